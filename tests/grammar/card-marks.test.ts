import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { marksIn, marksOf } from '../../grammar/src/card-marks';
import { parseNetlist, type SyntaxDiagnostic } from '../../grammar/src/index';
import { nestBlocks } from '../../grammar/src/structure';
import { netlistText } from '../fuzz/netlist-arbitrary';
import { tokenStreamText } from '../fuzz/text-arbitraries';

// The passes over the whole card list look only at the marked cards; the marks a parse records must
// be exactly the cards of the shaping kinds, and nesting by the marks must equal nesting card by card.

const blocks = fc
  .array(fc.constantFrom('.subckt A a', '.subckt B b', '.ends', '.ends A', '.lib sec', '.lib "f.lib" sec', '.endl', 'R1 a 0 1', '*@ mains 230V', '.end', '+ x=1', '.SUBCKT C', '.include x'), { maxLength: 30 })
  .map((lines) => `Marks fixture\n${lines.join('\n')}\n`);

describe('the marks of the shaping cards', () => {
  it('are the cards of kind subckt, ends, lib, endl and end, and nesting by them equals nesting card by card (fast-check)', () => {
    let marked = 0;
    fc.assert(
      fc.property(fc.oneof(blocks, netlistText, tokenStreamText), fc.boolean(), (text, titleLine) => {
        const netlist = parseNetlist(text, { titleLine });
        const body = netlist.title ? netlist.cards.slice(1) : netlist.cards;
        const marks = marksOf(netlist);
        expect(marks).toEqual(marksIn(body));
        marked += marks.length;
        const byMarks: SyntaxDiagnostic[] = [];
        const byCards: SyntaxDiagnostic[] = [];
        expect(nestBlocks(body, byMarks, marks)).toEqual(nestBlocks(body, byCards));
        expect(byMarks).toEqual(byCards);
      }),
      { seed: 20261207, numRuns: 1500, endOnFailure: true },
    );
    expect(marked).toBeGreaterThan(1000);
  });

  it('follow a re-parse: the marks of an edited tree are those of a fresh parse', () => {
    const text = 'Marks fixture\n.subckt A a\nR1 a 0 1\n.ends\nR2 a 0 1\n.end\n';
    const edited = text.replace('R1 a 0 1', '.ends\n.subckt B b');
    const incremental = parseNetlist(edited, { previous: parseNetlist(text) });
    expect(marksOf(incremental)).toEqual(marksOf(parseNetlist(edited)));
    expect(marksOf(incremental)).toEqual([0, 1, 2, 3, 5]);
  });
});
