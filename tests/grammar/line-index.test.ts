/**
 * The line index against the definition, worked out character by character here: a line ends at
 * LF, at CRLF (one break) or at a lone CR, and a position is (lines before, characters since the
 * last break). Texts with line feeds only take the index's fast path; the others its general one.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LineIndex } from '../../grammar/src/line-index';
import { FUZZ_SEED, PROPERTY_OPTIONS } from '../fuzz/fuzz-config';

function positionByScan(text: string, offset: number) {
  let line = 0, start = 0;
  for (let i = 0; i < offset; i++) {
    const ch = text[i];
    if (ch === '\n' || (ch === '\r' && text[i + 1] !== '\n')) { line++; start = i + 1; }
  }
  return { line, character: offset - start };
}

const texts = (breaks: string[]) => fc.array(fc.oneof(fc.constantFrom(...breaks), fc.string({ maxLength: 6 })), { maxLength: 30 }).map((parts) => parts.join(''));

describe('LineIndex', () => {
  for (const [label, breaks] of [['line feeds only', ['\n']], ['CRLF, lone CR and LF mixed', ['\n', '\r\n', '\r']]] as const) {
    it(`puts every offset on its line and column: ${label} (fast-check)`, () => {
      fc.assert(fc.property(texts([...breaks]), (text) => {
        const index = new LineIndex(text);
        for (let offset = 0; offset <= text.length; offset++) {
          const expected = positionByScan(text, offset);
          expect(index.positionAt(offset)).toEqual(expected);
          if (text[offset - 1] !== '\r' || text[offset] !== '\n') expect(index.offsetAt(expected)).toBe(offset);
        }
        expect(index.lineCount).toBe(positionByScan(text, text.length).line + 1);
      }), { ...PROPERTY_OPTIONS, seed: FUZZ_SEED, numRuns: 200 });
    });
  }
});
