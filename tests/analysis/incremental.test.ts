/**
 * The analysis of an edited file made from the previous one (its parse passed in, the solution
 * cache shared, the flat circuit cut down after the rules as the language server asks) must say
 * exactly what a fresh analysis of the same text says: every finding, every figure of every
 * rectifier, the near misses, the policy and the dependencies. Checked on chains of random edits
 * to generated netlists (tests/fuzz/netlist-arbitrary.ts) and the examples; the fresh analysis
 * has no cache, so a stale cache hit would show as a difference.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import type { Finding } from '../../server/src/findings/index';
import type { RuleInput } from '../../server/src/rules/registry';
import { circuitIndexOf, compactAfterRules } from '../../server/src/rules/rule-context';
import type { SolutionCache } from '../../server/src/solve/index';
import { netlistText } from '../fuzz/netlist-arbitrary';
import { FUZZ_SEED, PROPERTY_OPTIONS, runs, timeoutFor } from '../fuzz/fuzz-config';

const URI = 'file:///incremental.cir';

/** A finding's judgement without its fixes (reading lazily computed fixes would run trial solves). */
function judgement(f: Finding) {
  return { uri: f.uri, span: f.span, severity: f.severity, code: f.code, message: f.message, related: f.related };
}

/** What an analysis says, as data: findings, figures, near misses, policy, dependencies. */
function said(file: FileAnalysis | undefined) {
  if (!file) return undefined;
  return {
    findings: file.findings.map(judgement),
    rectifiers: file.rectifiers.map((r) => ({
      rectifier: r.rectifier, circuit: r.circuit, corners: r.corners, solution: r.solution, devices: r.devices, capacitors: r.capacitors,
      controller: r.controller,
    })),
    nearMisses: file.nearMisses,
    policy: file.policy,
    dependencies: file.dependencies,
    netlist: file.netlist,
    directives: file.flat.directives,
  };
}

function fresh(text: string): FileAnalysis | undefined {
  return analyze({ roots: [URI], readText: () => text }).files.get(URI);
}

/** As the language server's worker analyses: the previous trees consumed (their cards moved), the cache shared, the flat circuit compacted. */
function incremental(text: string, previous: FileAnalysis | undefined, cache: SolutionCache): FileAnalysis | undefined {
  return analyze({
    roots: [URI], readText: () => text, solutionCache: cache, compactFlat: true, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse: true,
  }).files.get(URI);
}

/** Edits an editor makes: a character typed or deleted anywhere, a value changed, a line added or taken out. */
const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant('splice' as const), at: fc.nat(), cut: fc.nat({ max: 6 }), insert: fc.constantFrom('', '1', 'k', ' ', '\n', '+ ', '*', 'R9 a 0 1k\n', ')', '{') }),
  fc.record({ kind: fc.constant('value' as const), at: fc.nat(), to: fc.constantFrom('2.2', '47', '100', '0', '330') }),
  fc.record({ kind: fc.constant('assignment' as const), at: fc.nat(), to: fc.constantFrom('2.2', '47', '100', '0', '330') }),
  fc.record({ kind: fc.constant('line' as const), at: fc.nat(), insert: fc.constantFrom('* a note\n', '', 'C99 n0p 0 10u\n', 'RX n0p 0 0\n') }),
);

type Edit = { kind: 'splice'; at: number; cut: number; insert: string } | { kind: 'value'; at: number; to: string } | { kind: 'assignment'; at: number; to: string } | { kind: 'line'; at: number; insert: string };

function applyEdit(text: string, e: Edit): string {
  if (e.kind === 'splice') {
    const start = e.at % (text.length + 1);
    return text.slice(0, start) + e.insert + text.slice(Math.min(text.length, start + e.cut));
  }
  if (e.kind === 'value' || e.kind === 'assignment') {
    // The n-th number that stands alone as a card argument, or that is assigned (`.param rv=1k`, `rval=1k`).
    const numbers = [...text.matchAll(e.kind === 'value' ? /(?<= )\d+(\.\d+)?(?=[a-zA-Z]*(\s|$))/g : /(?<==\s*)\d+(\.\d+)?/g)];
    const hit = numbers[e.at % Math.max(1, numbers.length)];
    return hit?.index === undefined ? text : text.slice(0, hit.index) + e.to + text.slice(hit.index + hit[0].length);
  }
  const lines = text.split('\n');
  const at = 1 + (e.at % Math.max(1, lines.length - 1));
  if (e.insert) lines.splice(at, 0, e.insert.replace(/\n$/, ''));
  else lines.splice(at, 1);
  return lines.join('\n');
}

/** A file of our own whose top-level cards read a parameter and a model defined on other lines. */
const PARAMETRISED = `parametrised cards
.param gain=2
.param rv=1k
V1 a 0 SIN(0 10 50)
D1 a b DX
RLOAD b 0 {rv}
RFIX b 0 470
RGAIN b 0 {gain*rv}
C1 b 0 {rv*1n}
.model DX D
`;

const examples = readdirSync(join(__dirname, '../../examples')).filter((f) => f.endsWith('.cir')).map((f) => readFileSync(join(__dirname, '../../examples', f), 'utf8'));

describe('the analysis after an edit, from the previous one', () => {
  const count = runs(10);
  it('says exactly what a fresh analysis says, after any chain of edits (fast-check)', () => {
    const source = fc.oneof(netlistText, fc.constantFrom(...examples));
    fc.assert(
      fc.property(source, fc.array(edit, { minLength: 1, maxLength: 4 }), (text, edits) => {
        const cache: SolutionCache = new Map();
        let current = text;
        let previous = incremental(current, undefined, cache);
        expect(said(previous)).toEqual(said(fresh(current)));
        for (const e of edits) {
          current = applyEdit(current, e);
          previous = incremental(current, previous, cache);
          expect(said(previous)).toEqual(said(fresh(current)));
        }
      }),
      { ...PROPERTY_OPTIONS, seed: FUZZ_SEED, numRuns: count },
    );
  }, timeoutFor(count, 20_000));

  it('elaborates the same flat circuit as a fresh analysis from the moved cards, whatever the edit (fast-check)', () => {
    // The moved cards are the same objects, so whatever elaboration keeps by card
    // (circuit/elaboration-memo.ts) must follow a parameter or a model edited elsewhere.
    const source = fc.oneof(netlistText, fc.constantFrom(...examples, PARAMETRISED));
    fc.assert(
      fc.property(source, fc.array(edit, { minLength: 1, maxLength: 4 }), (text, edits) => {
        let current = text;
        const consuming = (previous: FileAnalysis | undefined) => analyze({ roots: [URI], readText: () => current, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse: true }).files.get(URI);
        let previous = consuming(undefined);
        for (const e of edits) {
          current = applyEdit(current, e);
          previous = consuming(previous);
          expect(previous?.flat.elements).toEqual(fresh(current)?.flat.elements);
          expect(previous?.flat.diagnostics).toEqual(fresh(current)?.flat.diagnostics);
        }
      }),
      { ...PROPERTY_OPTIONS, seed: FUZZ_SEED, numRuns: count },
    );
  }, timeoutFor(count, 20_000));

  it('gives a top-level card the value of a parameter edited elsewhere, and its device the model renamed elsewhere', () => {
    let text = PARAMETRISED;
    const consuming = (previous: FileAnalysis | undefined) => analyze({ roots: [URI], readText: () => text, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse: true }).files.get(URI)!;
    let previous = consuming(undefined);
    const value = (f: FileAnalysis, name: string) => (f.flat.elements.find((e) => e.name === name) as { value?: number }).value;
    expect(value(previous, 'RLOAD')).toBe(1000);
    text = text.replace('.param rv=1k', '.param rv=2k');
    previous = consuming(previous);
    expect(value(previous, 'RLOAD')).toBe(2000);
    expect(value(previous, 'RFIX')).toBe(470);
    expect(value(previous, 'RGAIN')).toBe(4000);
    text = text.replace('.model DX D', '.model DY D');
    previous = consuming(previous);
    expect(previous.flat.elements.find((e) => e.name === 'D1')).toMatchObject({ model: undefined });
    expect(previous.findings.some((f) => f.code === 'unknown-model')).toBe(true);
  });

  it('keeps, of the flat circuit, the rectifiers\' capacitors and devices and every source, and the names in use', () => {
    // The bridge of examples/ with a filler resistor beside it: the resistor goes, the rest stays.
    const text = examples.find((t) => /^D\w* /m.test(t) && /^C\w* /m.test(t))!.replace(/\n\.end\b/i, '\nRFILLER nfill 0 1k\n.end');
    const whole = fresh(text)!;
    const compact = incremental(text, undefined, new Map())!;
    expect(whole.rectifiers.length).toBeGreaterThan(0);
    const kept = new Set(compact.flat.elements.map((e) => e.key));
    expect(kept.has('rfiller')).toBe(false);
    for (const r of whole.rectifiers) {
      for (const d of r.rectifier.devices) expect(kept.has(d.key)).toBe(true);
      for (const c of r.rectifier.surroundings.capacitors) for (const n of c.names) expect(kept.has(n.toLowerCase())).toBe(true);
    }
    expect(compact.flat.elements.filter((e) => e.kind === 'vsource')).toEqual(whole.flat.elements.filter((e) => e.kind === 'vsource'));
    expect(compact.flat.models).toEqual(whole.flat.models);
    // The fixes that name a new part or node still see every name of the whole circuit.
    const input: RuleInput = { rootUri: URI, netlist: whole.netlist, flat: whole.flat, rectifiers: whole.rectifiers, nearMisses: whole.nearMisses, policy: whole.policy };
    expect(compactAfterRules(input).elements.some((e) => e.key === 'rfiller')).toBe(false);
    expect(circuitIndexOf(input).elementKeys.has('rfiller')).toBe(true);
    expect(circuitIndexOf(input).nodeNames.has('nfill')).toBe(true);
  });

  it('takes the names in use from the last analysis while no key moved, and sees a name an edit repeats and then removes', () => {
    const base = examples.find((t) => /^D\w* /m.test(t) && /^C\w* /m.test(t))!.replace(/\n\.end\b/i, '\nRFILLER nfill 0 1k\n.end');
    // One edit at a time, as an editor sends them. Below the title (an edit to the title line is
    // parsed afresh): the cards after the comment move, no key changes; then a value, then a name.
    const commented = base.replace(/\n(?=[^*\n])/, '\n* a comment line\n');
    const valued = commented.replace('RFILLER nfill 0 1k', 'RFILLER nfill 0 0');
    const texts = [base, commented, valued, valued.replace('RFILLER nfill 0 0', 'RFILLER nfill 0 0\nRFILLER nfill2 0 1k'), valued];
    let previous: FileAnalysis | undefined;
    const indexes = texts.map((text) => {
      previous = analyze({ roots: [URI], readText: () => text, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse: true }).files.get(URI)!;
      expect(said(previous)).toEqual(said(fresh(text)));
      const { netlist, flat, rectifiers, nearMisses, policy } = previous;
      return circuitIndexOf({ rootUri: URI, netlist, flat, rectifiers, nearMisses, policy });
    });
    expect(indexes[1]!.elementKeys).toBe(indexes[0]!.elementKeys);
    expect(indexes[1]!.voltageSources).toBe(indexes[0]!.voltageSources);
    expect(indexes[2]!.elementKeys).toBe(indexes[0]!.elementKeys);
    // The resistor typed to 0 Ω is a new element: the lists by kind are made again and hold it.
    expect(indexes[1]!.zeroOhmResistors.map((e) => e.key)).not.toContain('rfiller');
    expect(indexes[2]!.zeroOhmResistors.map((e) => e.key)).toContain('rfiller');
    expect(indexes[3]!.repeatedKeys.has('rfiller')).toBe(true);
    expect(indexes[4]!.repeatedKeys.size).toBe(0);
    expect(said(previous)!.findings.some((f) => f.code === 'duplicate-name')).toBe(false);
  });
});

describe('consuming the previous trees', () => {
  const consuming = (files: Record<string, string>, previous: FileAnalysis | undefined, limits = {}) =>
    analyze({ roots: [URI], readText: (u) => files[u], limits, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse: true }).files.get(URI);
  const freshOf = (files: Record<string, string>, limits = {}) => analyze({ roots: [URI], readText: (u) => files[u], limits }).files.get(URI);
  const bridge = (extra: string) =>
    `consumed trees\nV1 ac1 ac2 SIN(0 325 50)\n${extra}D1 ac1 p DX\nD2 ac2 p DX\nD3 m ac1 DX\nD4 m ac2 DX\nC1 p m 100u\nR1 p m 1k\n.include parts.inc\n.model DX D(IS=1n)\n.end\n`;

  it('re-parses a file cut at the card limit from scratch the second time, so the cut text is right (the limit parses twice)', () => {
    const limits = { maxCards: 6 };
    let files = { [URI]: bridge(''), 'file:///parts.inc': 'RX ac1 0 1meg\n' };
    let previous = consuming(files, undefined, limits);
    for (const extra of ['* a note\n', '', 'R9 ac1 ac2 1meg\n* two\n', '']) {
      files = { ...files, [URI]: bridge(extra) };
      previous = consuming(files, previous, limits);
      expect(said(previous)).toEqual(said(freshOf(files, limits)));
    }
  });

  it('reads an include it parsed before from its own previous tree, and an include that changed, right', () => {
    let files = { [URI]: bridge(''), 'file:///parts.inc': 'RX ac1 0 1meg\n' };
    let previous = consuming(files, undefined);
    for (const include of ['RX ac1 0 1meg\n* more\n', 'RX ac1 0 2meg\n', 'RX ac1 0 2meg\n']) {
      files = { [URI]: bridge('* edit\n'), 'file:///parts.inc': include };
      previous = consuming(files, previous);
      expect(said(previous)).toEqual(said(freshOf(files)));
      expect(previous!.parsed.get('file:///parts.inc')!.text).toBe(include);
    }
  });

  it('analyses a root that includes itself right with its trees consumed', () => {
    let files = { [URI]: bridge('').replace('.include parts.inc', `.include ${URI}`) };
    let previous = consuming(files, undefined);
    for (const extra of ['* a\n', '* b\n']) {
      files = { [URI]: bridge(extra).replace('.include parts.inc', `.include ${URI}`) };
      previous = consuming(files, previous);
      expect(said(previous)).toEqual(said(freshOf(files)));
    }
  });
});
