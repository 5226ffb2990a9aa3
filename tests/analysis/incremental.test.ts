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

function incremental(text: string, previous: FileAnalysis | undefined, cache: SolutionCache): FileAnalysis | undefined {
  return analyze({ roots: [URI], readText: () => text, solutionCache: cache, compactFlat: true, previousParse: (u) => previous?.parsed.get(u) }).files.get(URI);
}

/** Edits an editor makes: a character typed or deleted anywhere, a value changed, a line added or taken out. */
const edit: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant('splice' as const), at: fc.nat(), cut: fc.nat({ max: 6 }), insert: fc.constantFrom('', '1', 'k', ' ', '\n', '+ ', '*', 'R9 a 0 1k\n', ')', '{') }),
  fc.record({ kind: fc.constant('value' as const), at: fc.nat(), to: fc.constantFrom('2.2', '47', '100', '0', '330') }),
  fc.record({ kind: fc.constant('line' as const), at: fc.nat(), insert: fc.constantFrom('* a note\n', '', 'C99 n0p 0 10u\n', 'RX n0p 0 0\n') }),
);

type Edit = { kind: 'splice'; at: number; cut: number; insert: string } | { kind: 'value'; at: number; to: string } | { kind: 'line'; at: number; insert: string };

function applyEdit(text: string, e: Edit): string {
  if (e.kind === 'splice') {
    const start = e.at % (text.length + 1);
    return text.slice(0, start) + e.insert + text.slice(Math.min(text.length, start + e.cut));
  }
  if (e.kind === 'value') {
    // The n-th number that stands alone as a card argument.
    const numbers = [...text.matchAll(/(?<= )\d+(\.\d+)?(?=[a-zA-Z]*(\s|$))/g)];
    const hit = numbers[e.at % Math.max(1, numbers.length)];
    return hit?.index === undefined ? text : text.slice(0, hit.index) + e.to + text.slice(hit.index + hit[0].length);
  }
  const lines = text.split('\n');
  const at = 1 + (e.at % Math.max(1, lines.length - 1));
  if (e.insert) lines.splice(at, 0, e.insert.replace(/\n$/, ''));
  else lines.splice(at, 1);
  return lines.join('\n');
}

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
});
