/**
 * Elaboration copies the unchanged runs of a root's top level from its last elaboration
 * (circuit/top-level-runs.ts). Whatever it copies, the flat circuit must be the one a fresh parse
 * and elaboration of the same texts builds, here with an included file in the top level that an
 * edit may change, and edits that add or remove an include. The reference is a fresh build.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseNetlist, type Netlist } from '../../grammar/src/index';
import { elaborate, type ElaborateOptions, type FlatCircuit } from '../../server/src/circuit/index';
import { lastTrace, planTopLevel } from '../../server/src/circuit/top-level-runs';
import { FUZZ_SEED, PROPERTY_OPTIONS, runs, timeoutFor } from '../fuzz/fuzz-config';
import { applied } from './line-edits';

const ROOT = 'file:///work/runs.cir';
const PARTS = 'file:///work/parts.inc';

/** A root of our own invention: an included parts file, a subcircuit, elements before and after. */
const ROOT_TEXT = `top level runs
.param rv=1k
.include "parts.inc"
.subckt CELL a b
R1 a b {rv}
C1 a b 10n
.ends CELL
V1 in 0 SIN(0 10 50)
R1 in a 1
X1 a 0 CELL
D1 a b DP
C2 b 0 100u
X2 b 0 CELL
R2 b 0 {rv}
`;
const PARTS_TEXT = `.model DP D(IS=1n)
RP1 in 0 10k
`;

function said(flat: FlatCircuit) {
  return { elements: flat.elements, instances: flat.instances, models: [...flat.models], directives: flat.directives, diagnostics: flat.diagnostics, dependencies: flat.dependencies };
}

function elaborated(root: Netlist, parts: Netlist, options?: ElaborateOptions): FlatCircuit {
  return elaborate(ROOT, (uri) => (uri === ROOT ? root : uri === PARTS ? parts : undefined), options);
}

const LINES = ROOT_TEXT.split('\n').length - 1;
const ROOT_LINES = ['* a note', '', 'R3 a 0 47', 'X3 a b CELL', '.include "parts.inc"', '.include "missing.inc"', 'D2 b a DQ', '.model DQ D', '.param rv=2k'];
const PARTS_EDITS = [PARTS_TEXT, PARTS_TEXT.replace('10k', '22k'), `${PARTS_TEXT}RP2 a 0 1\n`, '.model DP D(IS=2n)\n', '* nothing here\n'];
const edit = fc.record({
  line: fc.integer({ min: 1, max: LINES - 1 }), kind: fc.constantFrom('replace', 'insert', 'remove'), text: fc.constantFrom(...ROOT_LINES),
  parts: fc.option(fc.constantFrom(...PARTS_EDITS), { nil: undefined }),
});

const include = (text: string) => parseNetlist(text, { titleLine: false });

describe('elaboration copying runs of the last top level', () => {
  const count = runs(60);
  it('builds what a fresh elaboration builds, after any chain of edits to the root and its included file (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 6 }), fc.constantFrom<ElaborateOptions | undefined>(undefined, { maxElements: 12 }, { maxIncludedCards: 1 }), (edits, options) => {
        let text = ROOT_TEXT;
        let partsText = PARTS_TEXT;
        let tree = parseNetlist(text);
        let parts = include(partsText);
        elaborated(tree, parts, options);
        for (const e of edits) {
          text = applied(text, e);
          tree = parseNetlist(text, { previous: tree, consumePrevious: true });
          // A changed included file is a new tree, as the adapter parses it again.
          if (e.parts !== undefined && e.parts !== partsText) parts = include((partsText = e.parts));
          expect(said(elaborated(tree, parts, options))).toEqual(said(elaborated(parseNetlist(text), include(partsText), options)));
        }
      }),
      { ...PROPERTY_OPTIONS, seed: FUZZ_SEED, numRuns: count },
    );
  }, timeoutFor(count, 2_000));

  it('copies the whole top level after a comment is typed, and all but the card after a value is', () => {
    const parts = include(PARTS_TEXT);
    // The last elaboration's trace, and the tree of an edited text with the cards moved in from it (as the server parses).
    const traceAndEdit = (edited: string) => {
      const first = parseNetlist(ROOT_TEXT);
      elaborated(first, parts);
      const trace = lastTrace(first.cards[0])!;
      return { trace, tree: parseNetlist(edited, { previous: first, consumePrevious: true }) };
    };
    const commented = traceAndEdit(ROOT_TEXT.replace('V1 in', '* typed\nV1 in'));
    const plan = planTopLevel(commented.trace, commented.tree.items, ROOT, () => true)!;
    expect(plan.prefixEnd + (plan.placed.length - plan.suffixStart)).toBe(commented.trace.placed.length);
    const { trace, tree } = traceAndEdit(ROOT_TEXT.replace('C2 b 0 100u', 'C2 b 0 220u'));
    const window = planTopLevel(trace, tree.items, ROOT, () => true)!;
    expect(window.suffixStart - window.prefixEnd).toBe(1);
    expect(window.placed[window.prefixEnd]!.item).toBe(tree.items.find((i) => i.kind === 'passive' && i.name.text === 'C2'));
    // An included tree that is no longer the one read, or a splice in the changed part, places afresh.
    expect(planTopLevel(trace, tree.items, ROOT, () => false)).toBeUndefined();
    expect(planTopLevel(trace, tree.items, 'file:///work/other.cir', () => true)).toBeUndefined();
    const spliced = traceAndEdit(ROOT_TEXT.replace('C2 b 0 100u', '.include "more.inc"'));
    expect(planTopLevel(spliced.trace, spliced.tree.items, ROOT, () => true)).toBeUndefined();
  });
});
