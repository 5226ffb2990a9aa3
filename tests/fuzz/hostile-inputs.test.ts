/**
 * Fuzzing with hostile structure (hostile-arbitraries.ts): nothing the input nests, multiplies or
 * includes makes the parser throw, the stack overflow or the work grow without bound, and what
 * the limits cut is always a finding.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseNetlist, type Netlist } from '../../grammar/src/index';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { resolveIncludePath } from '../../server/src/circuit/index';
import { checkDocument } from './document-properties';
import { FUZZ_SEED, PROPERTY_OPTIONS, runs, timeoutFor } from './fuzz-config';
import { deepNestingText, hierarchy, hierarchyText, includeWorld, type Hierarchy } from './hostile-arbitraries';
import { probeFractions } from './text-arbitraries';

const PARSES = runs(100);
const DOCUMENTS = runs(20);
const HIERARCHIES = runs(60);
const WORLDS = runs(60);
const FOLDER = 'file:///work/fuzz/';
/** Lowered limits, so each case reaches them in milliseconds. */
const LIMITS = { maxElements: 5_000, maxIncludedCards: 20_000 };

function analyseRoot(root: string, files: Record<string, string>): FileAnalysis {
  const file = analyze({ roots: [root], readText: (uri) => files[uri], limits: LIMITS }).files.get(root);
  if (!file) throw new Error('the root was not analysed');
  return file;
}

/** Every span of a parse lies in its text. */
function expectSpansInside(netlist: Netlist): void {
  for (const s of [...netlist.cards.map((c) => c.span), ...netlist.diagnostics.map((d) => d.span), ...netlist.comments]) {
    if (!(s.start >= 0 && s.start <= s.end && s.end <= netlist.text.length)) throw new Error(`span ${JSON.stringify(s)} outside 0..${netlist.text.length}`);
  }
}

/** Cards and instances of a fully expanded hierarchy (see `hierarchyText`). */
function fullSize(h: Hierarchy): { elements: number; instances: number } {
  let instances = 1;
  for (let k = 1; k <= h.levels; k++) instances += h.fanOut ** k;
  const leaves = h.fanOut ** h.levels;
  return { elements: leaves * h.leaf, instances: instances + (h.recursive ? leaves : 0) };
}

describe('hostile structure', () => {
  it(`the parser never throws on deep nesting (${PARSES} cases), and its tree can be copied to a worker and written as JSON`, () => {
    fc.assert(fc.property(deepNestingText, fc.boolean(), (text, titleLine) => {
      const netlist = parseNetlist(text, { titleLine });
      // parseNetlist turns a throw into an internal-error finding; none may be needed.
      expect(netlist.diagnostics.filter((d) => d.code === 'internal-error')).toEqual([]);
      expectSpansInside(netlist);
      structuredClone(netlist);
      JSON.stringify(netlist);
    }), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 40, numRuns: PARSES });
  }, timeoutFor(PARSES, 200));

  it(`deep nesting through analysis and every feature (${DOCUMENTS} cases)`, () => {
    fc.assert(fc.property(deepNestingText, probeFractions, (text, probes) => checkDocument(text, { probes })), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 41, numRuns: DOCUMENTS });
  }, timeoutFor(DOCUMENTS, 3_000));

  it(`subcircuit hierarchies (${HIERARCHIES} cases, up to 4^45 leaves): expanded whole when they fit, refused at the top instance when not`, () => {
    fc.assert(fc.property(hierarchy, (h) => {
      const root = `${FOLDER}laughs.cir`;
      const file = analyseRoot(root, { [root]: hierarchyText(h) });
      const { elements, instances } = fullSize(h);
      const tooLarge = file.findings.filter((f) => f.code === 'circuit-too-large');
      // The count before building charges every card of every expanded body: here exactly elements + instances.
      if (elements + instances <= LIMITS.maxElements) {
        expect(tooLarge).toEqual([]);
        expect(file.flat.elements).toHaveLength(elements);
      } else {
        expect(tooLarge.map((f) => file.text.slice(f.span.start, f.span.end))).toEqual(['X0']);
        expect(file.flat.elements).toEqual([]);
      }
      expect(file.findings.some((f) => f.code === 'recursive-subckt')).toBe(h.recursive && elements + instances <= LIMITS.maxElements);
    }), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 42, numRuns: HIERARCHIES });
  }, timeoutFor(HIERARCHIES, 500));

  it(`include worlds with fan-out, cycles and missing files (${WORLDS} cases): every include card of the root is read or has a finding`, () => {
    fc.assert(fc.property(includeWorld, ({ files, root }) => {
      const byUri = Object.fromEntries(Object.entries(files).map(([name, text]) => [FOLDER + name, text]));
      const rootUri = FOLDER + root;
      const file = analyseRoot(rootUri, byUri);
      expect(file.flat.elements.length + file.flat.instances.length).toBeLessThanOrEqual(LIMITS.maxElements + 1);
      const onCard = (span: { start: number; end: number }) => file.findings.some((f) => f.uri === rootUri && f.span.start < span.end && f.span.end > span.start);
      for (const item of file.netlist.items) {
        if (item.kind !== 'include' && item.kind !== 'lib') continue;
        if (item.kind === 'lib' && !item.path) continue;
        const target = item.path ? resolveIncludePath(rootUri, item.path.text) : undefined;
        // A library section of the root itself is read from the root, which is no dependency of its own.
        const read = target !== undefined && (target === rootUri || file.dependencies.includes(target));
        if (!onCard(item.span) && !read) {
          throw new Error(`'${file.text.slice(item.span.start, item.span.end)}' was neither read nor reported`);
        }
      }
    }), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 43, numRuns: WORLDS });
  }, timeoutFor(WORLDS, 500));
});
