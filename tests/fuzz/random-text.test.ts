/**
 * Fuzzing with text that is not a netlist: random bytes, random Unicode and random token streams,
 * each through parse → analysis → every feature (document-properties.ts lists the properties).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { checkDocument } from './document-properties';
import { FUZZ_SEED, runs, timeoutFor, PROPERTY_OPTIONS } from './fuzz-config';
import { probeFractions, randomBytesText, randomUnicodeText, tokenStreamText } from './text-arbitraries';

const BYTES = runs(600);
const UNICODE = runs(400);
const TOKENS = runs(1000);

describe('random text through every feature', () => {
  it(`random bytes (${BYTES} cases)`, () => {
    fc.assert(fc.property(randomBytesText, probeFractions, (text, probes) => checkDocument(text, { probes })), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED, numRuns: BYTES });
  }, timeoutFor(BYTES, 50));

  it(`random Unicode strings (${UNICODE} cases)`, () => {
    fc.assert(fc.property(randomUnicodeText, probeFractions, (text, probes) => checkDocument(text, { probes })), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 1, numRuns: UNICODE });
  }, timeoutFor(UNICODE, 50));

  it(`random token streams (${TOKENS} cases), every fifth analysed twice`, () => {
    let index = 0;
    fc.assert(fc.property(tokenStreamText, probeFractions, (text, probes) => {
      checkDocument(text, { probes, determinism: index++ % 5 === 0 });
    }), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 2, numRuns: TOKENS });
  }, timeoutFor(TOKENS, 100));

  it('the parser keeps every token stream within its text (spans of cards and diagnostics)', () => {
    fc.assert(fc.property(tokenStreamText, (text) => {
      const netlist = parseNetlist(text);
      for (const s of [...netlist.cards.map((c) => c.span), ...netlist.diagnostics.map((d) => d.span), ...netlist.comments]) {
        expect(s.start >= 0 && s.start <= s.end && s.end <= text.length).toBe(true);
      }
    }), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED + 3, numRuns: runs(500) });
  });
});
