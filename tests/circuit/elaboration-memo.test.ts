/**
 * Elaboration from moved cards (the language server's re-parse) keeps each top-level element and
 * each top-level instance's expansion (circuit/elaboration-memo.ts). Whatever it keeps, the flat
 * circuit must be the one a fresh elaboration of the same text builds: every element, instance,
 * model, directive and diagnostic. The reference is a fresh parse and elaboration.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseNetlist, type Netlist } from '../../grammar/src/index';
import { elaborate, type ElaborateOptions, type FlatCircuit } from '../../server/src/circuit/index';
import { FUZZ_SEED, PROPERTY_OPTIONS, runs, timeoutFor } from '../fuzz/fuzz-config';
import { applied } from './line-edits';

const URI = 'file:///memo.cir';

/** A hierarchy of our own: parameters read through instances, a local model, a nested subcircuit, a directive in a body. */
const HIERARCHY = `hierarchy for the elaboration memo
.param rv=1k gain=2
.subckt CELL a b rval=100
.param rin={rval*gain}
R1 a m {rin}
C1 m b 10n
.model DLOC D(IS=1n)
D1 m b DLOC
.ends CELL
.subckt PAIR a b
X1 a m CELL rval={rv}
X2 m b CELL
.ends PAIR
.subckt NOTED a b
*@ rate DX vrrm=100V
R1 a b 1
.ends NOTED
V1 in 0 SIN(0 10 50)
XA in n1 PAIR
XB n1 0 CELL rval=47
XC n1 0 NOTED
R9 in 0 {rv}
D9 in n1 DX
.model DX D
`;

function said(flat: FlatCircuit) {
  return { elements: flat.elements, instances: flat.instances, models: [...flat.models], directives: flat.directives, diagnostics: flat.diagnostics };
}

function elaborated(tree: Netlist, options?: ElaborateOptions): FlatCircuit {
  return elaborate(URI, () => tree, options);
}

/** Edits to the hierarchy: a line's text replaced, a line added or taken out. */
const LINES = HIERARCHY.split('\n').length - 1;
const REPLACEMENTS = ['* a note', '', '.param rv=2k gain=2', '.param rin={rval}', 'R1 a m 22', 'X2 m b CELL rval=5', 'XB n1 0 PAIR', '.model DLOC D(IS=2n)', '.model DX D(N=2)', '.ends', 'XD n1 0 NOPE', '*@ rate DX vrrm=200V', '.param rv={rv}'];
const edit = fc.record({ line: fc.integer({ min: 1, max: LINES - 1 }), kind: fc.constantFrom('replace', 'insert', 'remove'), text: fc.constantFrom(...REPLACEMENTS) });

describe('elaboration from moved cards', () => {
  const count = runs(60);
  it('builds the flat circuit a fresh elaboration builds, after any chain of edits (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 6 }), fc.constantFrom<ElaborateOptions | undefined>(undefined, { maxElements: 20 }, { maxDepth: 1 }), (edits, options) => {
        let text = HIERARCHY;
        let tree = parseNetlist(text, { titleLine: true });
        elaborated(tree, options);
        for (const e of edits) {
          text = applied(text, e);
          tree = parseNetlist(text, { titleLine: true, previous: tree, consumePrevious: true });
          expect(said(elaborated(tree, options))).toEqual(said(elaborated(parseNetlist(text, { titleLine: true }), options)));
        }
      }),
      { ...PROPERTY_OPTIONS, seed: FUZZ_SEED, numRuns: count },
    );
  }, timeoutFor(count, 2_000));

  it('keeps the elements and expansions of cards an edit elsewhere only moved', () => {
    const before = parseNetlist(HIERARCHY, { titleLine: true });
    const first = elaborated(before);
    const text = HIERARCHY.replace('V1 in 0', '* a note\nV1 in 0');
    const moved = elaborated(parseNetlist(text, { titleLine: true, previous: before, consumePrevious: true }));
    const kept = new Set(first.elements);
    // Every element but the directive-holding NOTED's resistor is the very object built before.
    expect(moved.elements.filter((e) => !kept.has(e)).map((e) => e.name)).toEqual(['XC.R1']);
    expect(moved.elements.find((e) => e.name === 'XA.X1.R1')).toMatchObject({ value: 2000 });
    expect(said(moved)).toEqual(said(elaborated(parseNetlist(text, { titleLine: true }))));
  });

  it('refuses a kept expansion that no longer fits the flattened size after a card is added above it', () => {
    // The largest expansion last, so that it is what no longer fits.
    const source = HIERARCHY.replace('XA in n1 PAIR\n', '').replace('D9 in n1 DX\n', 'D9 in n1 DX\nXA in n1 PAIR\n');
    const fits = (options: ElaborateOptions) => !elaborated(parseNetlist(source, { titleLine: true }), options).diagnostics.some((d) => d.code === 'circuit-too-large');
    let limit = 1;
    while (!fits({ maxElements: limit })) limit++;
    const options = { maxElements: limit };
    const before = parseNetlist(source, { titleLine: true });
    elaborated(before, options);
    const text = source.replace('V1 in 0', 'R0 in 0 1\nV1 in 0');
    const after = elaborated(parseNetlist(text, { titleLine: true, previous: before, consumePrevious: true }), options);
    expect(after.diagnostics.map((d) => d.code)).toContain('circuit-too-large');
    expect(said(after)).toEqual(said(elaborated(parseNetlist(text, { titleLine: true }), options)));
  });

  it('builds afresh what a parameter, a model or a definition edited elsewhere changes', () => {
    const before = parseNetlist(HIERARCHY, { titleLine: true });
    const first = elaborated(before);
    const text = HIERARCHY.replace('.param rv=1k', '.param rv=3k').replace('R1 a m {rin}', 'R1 a m {rin*2}');
    const after = elaborated(parseNetlist(text, { titleLine: true, previous: before, consumePrevious: true }));
    expect(after.elements.find((e) => e.name === 'XA.X1.R1')).toMatchObject({ value: 12_000 });
    expect(after.elements.find((e) => e.name === 'R9')).toMatchObject({ value: 3000 });
    expect(after.elements.some((e) => first.elements.includes(e) && e.name !== 'V1' && e.name !== 'D9')).toBe(false);
  });
});
