/**
 * "Did you mean": the edit distance itself (hand-counted cases), the choice among names in scope,
 * and the elaboration errors for a subcircuit or model name that is not defined, each with a
 * rename fix to the name in scope. Fixtures of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { closestNames, editDistance, typoDistance } from '../../server/src/circuit/did-you-mean';
import { applyEdits } from '../../server/src/rules/fixes/text-edits';
import { flatten } from './check';

describe('editDistance (optimal string alignment)', () => {
  it.each([
    ['bridge', 'bridge', 0],
    // One substitution, one insertion, one deletion, one swap of neighbours: 1 each (counted by hand).
    ['bridge', 'bridgx', 1],
    ['bridge', 'bridges', 1],
    ['bridge', 'brige', 1],
    ['bridge', 'brigde', 1],
    // Two edits: a swap and a substitution.
    ['bridge', 'brdigx', 2],
    ['', 'abc', 3],
    // kitten → sitting: the classic three (two substitutions and an insertion).
    ['kitten', 'sitting', 3],
  ])('%s → %s is %d', (a, b, d) => {
    expect(editDistance(a, b)).toBe(d);
    expect(editDistance(b, a)).toBe(d);
  });

  it('stops above a limit with limit + 1', () => {
    expect(editDistance('abcdefgh', 'zyxwvuts', 2)).toBe(3);
  });
});

describe('closestNames', () => {
  it('finds the nearest names in scope, case-insensitively, as written', () => {
    expect(closestNames('dr1n4007', ['D1N4007', 'DFAST', 'NM'])).toEqual(['D1N4007']);
    expect(closestNames('BRIGDE', ['Bridge', 'BRIDGE_FAST', 'SRCTRL'])).toEqual(['Bridge']);
  });

  it('offers nothing beyond the typo distance, and every name at the nearest distance', () => {
    expect(typoDistance(2)).toBe(1);
    // DR → DQ is one edit (within 1 for a two-letter name); DR → 1N4007 is far.
    expect(closestNames('DR', ['1N4007', 'DQ'])).toEqual(['DQ']);
    expect(closestNames('DR', ['1N4007'])).toEqual([]);
    expect(closestNames('DRX', ['DRA', 'DRB', 'DXX'])).toEqual(['DRA', 'DRB', 'DXX']);
  });

  it('skips the name itself and bounds its work', () => {
    expect(closestNames('abc', ['ABC'])).toEqual([]);
    const many = Array.from({ length: 20_000 }, (_, i) => `m${i}`);
    // The one near name sits past the 10,000 names compared, so it is not found: work is counted.
    expect(closestNames('target', [...many, 'targte'])).toEqual([]);
    expect(closestNames('target', ['targte', ...many])).toEqual(['targte']);
  });
});

describe('undefined subcircuit and model names are errors with a rename fix', () => {
  const text = [
    'typos',
    '.subckt BRIDGE ac1 ac2 pos neg',
    'D1 ac1 pos DRECT',
    '.ends BRIDGE',
    '.model DRECT D(IS=5n)',
    'X1 a b p 0 BRIGDE',
    'D9 a p DRECX',
    'D8 a p ZZZ',
    '',
  ].join('\n');
  const flat = flatten(text);
  const of = (code: string) => flat.diagnostics.filter((d) => d.code === code);

  it('unknown-subckt: an error on the name, suggesting the defined subcircuit', () => {
    const [d] = of('unknown-subckt');
    expect(d).toMatchObject({ severity: 'error' });
    expect(text.slice(d!.span.start, d!.span.end)).toBe('BRIGDE');
    expect(d!.message).toContain("did you mean 'BRIDGE'?");
    expect(d!.fixes).toHaveLength(1);
    expect(d!.fixes![0]).toMatchObject({ title: "Change 'BRIGDE' to 'BRIDGE'", preferred: true });
    expect(applyEdits(text, d!.fixes![0]!.edits)).toContain('X1 a b p 0 BRIDGE\n');
  });

  it('unknown-model: an error with a rename where a model is near, without one where none is', () => {
    const found = of('unknown-model');
    expect(found.map((d) => [text.slice(d.span.start, d.span.end), d.severity])).toEqual([['DRECX', 'error'], ['ZZZ', 'error']]);
    expect(found[0]!.fixes?.map((f) => f.title)).toEqual(["Change 'DRECX' to 'DRECT'"]);
    expect(found[1]!.fixes).toBeUndefined();
    expect(found[1]!.message).not.toContain('did you mean');
  });

  it('looks only at the names visible from the card: a model local to a subcircuit is not offered outside it', () => {
    const local = 'scope\n.subckt PKG a b\nD1 a b DLOCAL\n.model DLOCAL D\n.ends\nX1 n1 n2 PKG\nD2 n1 n2 DLOCAX\n';
    const [d] = flatten(local).diagnostics.filter((x) => x.code === 'unknown-model');
    expect(d!.fixes).toBeUndefined();
    const inside = 'scope\n.model DTOP D\n.subckt PKG a b\nD1 a b DTOX\n.ends\nX1 n1 n2 PKG\n';
    const [e] = flatten(inside).diagnostics.filter((x) => x.code === 'unknown-model');
    expect(e!.fixes?.[0]?.edits[0]?.newText).toBe('DTOP');
  });
});
