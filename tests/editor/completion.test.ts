/**
 * Completion, in-process: `completeAt` (editor/completion.ts) at the `$0` cursor of a parsed
 * fixture, with the models of the file and its includes as the language server gathers them
 * (lsp/navigation-features.ts). The fixtures are netlists of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { DERATE_KEYS, DIRECTIVE_KEYWORDS, RATING_KEYS, parseNetlist, type Netlist } from '../../grammar/src/index';
import { completeAt, modelsOf, type CompletionItem } from '../../server/src/editor/completion';
import { FINDING_CODES } from '../../server/src/rules/codes';
import { readCursor } from '../helpers/cursor';
import { analyseAt } from './check';

/** The completion items at the cursor of a fixture, with the models the fixture itself defines. */
function completeIn(fixture: string): CompletionItem[] {
  const { text, offset } = readCursor(fixture);
  const netlist = parseNetlist(text);
  return completeAt(netlist, offset, modelsOf(netlist));
}

const labels = (items: readonly CompletionItem[]) => items.map((i) => i.label);

describe('completion in directives', () => {
  it('offers the directive keywords after `*@`, with what each is for', () => {
    const items = completeIn('t\n*@ $0\nR1 a 0 1k\n');
    expect(labels(items)).toEqual([...DIRECTIVE_KEYWORDS]);
    expect(items.find((i) => i.label === 'mains')).toMatchObject({ kind: 'keyword', detail: expect.stringContaining('mains 230V 50Hz') });
  });

  it('offers the rating keys after a rate line\'s name, inserting `key=`', () => {
    const items = completeIn('t\n*@ rate DX v$0\nD1 a b DX\n.model DX D\n');
    expect(labels(items)).toEqual([...RATING_KEYS]);
    expect(items.find((i) => i.label === 'vrrm')).toMatchObject({ kind: 'property', insertText: 'vrrm=' });
  });

  it('offers the derating keys anywhere on a derate line', () => {
    expect(labels(completeIn('t\n*@ derate vr=75% $0\n'))).toEqual([...DERATE_KEYS]);
  });

  it('offers nothing for the name of a rate line itself', () => {
    expect(completeIn('t\n*@ rate $0\n')).toEqual([]);
  });

  it('offers every finding code after `allow`, with its description', () => {
    const items = completeIn('t\n*@ allow $0\nD1 a b DX\n');
    expect(labels(items)).toEqual(Object.keys(FINDING_CODES));
    expect(items.find((i) => i.label === 'piv-margin')).toMatchObject({ kind: 'code', detail: FINDING_CODES['piv-margin'] });
  });

  it('offers the tolerance and phase keys on a mains line', () => {
    expect(labels(completeIn('t\n*@ mains 230V 50Hz $0\n'))).toEqual(['tol', 'phases']);
  });
});

describe('completion on element cards', () => {
  const models = `t
.model DX D(IS=1n)
.model NX NMOS(rdson=0.02)
`;

  it('offers diode models, and only those, in a diode card\'s model place', () => {
    expect(completeIn(`${models}D9 a b $0\n`)).toEqual([{ label: 'DX', kind: 'model', detail: 'model D' }]);
  });

  it('offers MOSFET models in a MOSFET card\'s sixth place', () => {
    expect(labels(completeIn(`${models}M1 d g s s $0\n`))).toEqual(['NX']);
  });

  it('offers the node names of the scope in node places, without the word being typed', () => {
    const fixture = `t
V1 in 0 SIN(0 10 50)
R1 in out 1k
.subckt INNER p q
R5 p inside 1
.ends INNER
R2 out $0
`;
    // Top level: in, 0, out; the subcircuit's own nodes (p, q, inside) are not in this scope.
    expect(labels(completeIn(fixture))).toEqual(['in', '0', 'out']);
  });

  it('inside a subcircuit body offers its ports, its nodes and ground', () => {
    const fixture = `t
R1 top 0 1k
.subckt INNER p q
R5 p inside 1
R6 $0
.ends INNER
`;
    // A body's nodes are local (only ground is global, name-index.ts), so the top level's `top` is not offered.
    expect(labels(completeIn(fixture)).sort()).toEqual(['0', 'inside', 'p', 'q']);
  });

  it('offers nodes and subcircuit names on an X card', () => {
    const items = completeIn('t\n.subckt BR4 a b p n\n.ends BR4\nV1 l n SIN(0 10 50)\nX1 l n $0\n');
    expect(items.filter((i) => i.kind === 'subckt')).toEqual([{ label: 'BR4', kind: 'subckt' }]);
    expect(items.filter((i) => i.kind === 'node').map((i) => i.label)).toEqual(['l', 'n']);
  });

  it('offers nothing in a comment, for a card\'s name, or past a card\'s last place', () => {
    expect(completeIn('t\nR1 a 0 1k\n* R2 $0\n')).toEqual([]);
    expect(completeIn('t\nR1 a 0 1k\nR$0\n')).toEqual([]);
    expect(completeIn('t\nR1 a 0 1k\n.model DX D\nD1 a 0 DX $0\n')).toEqual([]);
    expect(completeIn('t\nR1 a 0 1k\nR2 a 0 1k $0\n')).toEqual([]);
  });

  it('offers a model defined in an included file, as the server gathers them from the analysis', () => {
    const { file, offset } = analyseAt('t\n.include "lib.cir"\nD1 a b $0\n', { extra: { 'file:///w/lib.cir': '.model DLIB D(IS=2n)\n' } });
    const models = [...file.parsed.values()].flatMap(modelsOf);
    expect(labels(completeAt(file.netlist, offset, models))).toEqual(['DLIB']);
  });
});

describe('completion answers from the text as it is now (issue 14 regression)', () => {
  // Typing `XYZ ` before `signal` on line 2, then asking on line 4 before the file is analysed again.
  const before = `Completion while typing (a fixture of our own)
V1 signal 0 SIN(0 10 50)
R1 signal gate 10
R2 gate 0 1k
R3 `;
  const typed = readCursor(`Completion while typing (a fixture of our own)
V1 signal 0 SIN(0 10 50)
R1 XYZ signal gate 10
R2 gate 0 1k
R3 $0`);
  const old: Netlist = parseNetlist(before);

  it('offers whole node names from the parse of the current text (re-using the old parse\'s cards, as the server does)', () => {
    const current = parseNetlist(typed.text, { previous: old });
    expect(current.text).toBe(typed.text);
    expect(labels(completeAt(current, typed.offset)).sort()).toEqual(['0', 'XYZ', 'gate', 'signal']);
  });

  it('the mixed input the server once built (the old tree with the new text) gives the splices this guards against', () => {
    // Not how anything should call completeAt: it shows the first case can fail, by building the old bug's input.
    const mixed: Netlist = { ...old, text: typed.text };
    const spliced = labels(completeAt(mixed, typed.offset));
    expect(spliced).not.toEqual(expect.arrayContaining(['XYZ']));
    expect(spliced.some((l) => !['0', 'XYZ', 'gate', 'signal'].includes(l))).toBe(true);
  });
});
