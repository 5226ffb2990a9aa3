import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { IToken } from 'chevrotain';
import { Scan, Scanner } from '../../grammar/src/scanner';
import { netlistLexer } from '../../grammar/src/tokens';
import { generateNetlist } from '../../bench/generate-netlist';
import { netlistText } from '../fuzz/netlist-arbitrary';
import { randomBytesText, randomUnicodeText, tokenStreamText } from '../fuzz/text-arbitraries';

// Our scanner must hand the parser exactly what the chevrotain lexer (tokens.ts, the language's
// definition) gives: the same tokens, comments, directives and lexing errors, offset for offset.

interface Lexed {
  tokens: IToken[];
  directives: IToken[];
  comments: IToken[];
  errors: { offset: number; length: number }[];
}

function byScanner(text: string, from = 0, to = text.length): Lexed {
  const out: Lexed = { tokens: [], directives: [], comments: [], errors: [] };
  const scanner = new Scanner(text, from, to);
  for (let found = scanner.next(); found !== Scan.End; found = scanner.next()) {
    if (found === Scan.Error) out.errors.push({ offset: scanner.start, length: scanner.end - scanner.start });
    else if (found === Scan.Directive) out.directives.push(scanner.token());
    else if (found === Scan.Comment) out.comments.push(scanner.token());
    else out.tokens.push(scanner.token());
  }
  return out;
}

/** The chevrotain lexer over the slice [from, to), its offsets moved back into the whole text. */
function byLexer(text: string, from = 0, to = text.length): Lexed {
  const lexed = netlistLexer.tokenize(text.slice(from, to));
  const moved = (tokens: IToken[] = []) => tokens.map((t) => ({ image: t.image, startOffset: t.startOffset + from, tokenTypeIdx: t.tokenTypeIdx, tokenType: t.tokenType }));
  return {
    tokens: moved(lexed.tokens),
    directives: moved(lexed.groups.directives),
    comments: moved(lexed.groups.comments),
    errors: lexed.errors.map((e) => ({ offset: e.offset + from, length: e.length })),
  };
}

/** Every character class the language distinguishes, and the words and pairs where they meet. */
const piece = fc.oneof(
  fc.constantFrom(...' \t\f\n\r+*@;$={}\'"(),.-_/\\:`~#%^&|<>?!][0123456789aAzZeEkKmMuUnNpP\u00b5\u03a9\u2028\ufeff\u0000\u0007\u000b\u001f\u007f\u0080}'.split('')),
  fc.constantFrom('.subckt', '.SUBCKT', '.ends', '.end', '.endl', '.endx', '.ends.x', '.include', '.inc', '.incl', '.includes', '.lib', '.model', '.param', '.Param', '.x', '._', '.5', '..'),
  fc.constantFrom('\r\n', '\n+', '\r\n +', '\r+', '\n\t+', '\n \f+', '*@ mains', '$ x', '$\n', '$\r', 'R1', 'SIN(', '{a*2}', "'1+'", '"p.cir"', '\ud800', '\udc00'),
  fc.constantFrom('$\t', '$a', ' *', '\t*@', '*x', ';x', '{\n', "'\r", '"\n', '{}', "''", '""', '}}', '\u0000\u0001'),
);
const denseText = fc.array(piece, { maxLength: 60 }).map((parts) => parts.join(''));

describe('the scanner against the chevrotain lexer', () => {
  it('gives the same tokens, groups and errors on random texts (fast-check)', () => {
    const text = fc.oneof(denseText, tokenStreamText, randomBytesText, randomUnicodeText, netlistText);
    fc.assert(
      fc.property(text, (t) => {
        expect(byScanner(t)).toEqual(byLexer(t));
      }),
      { seed: 20261202, numRuns: 2000, endOnFailure: true },
    );
  });

  it('scans a slice [from, to) as the lexer scans that slice alone (fast-check)', () => {
    fc.assert(
      fc.property(denseText, fc.nat(), fc.nat(), (t, a, b) => {
        const from = Math.min(a, b) % (t.length + 1);
        const to = from + (Math.max(a, b) % (t.length - from + 1));
        expect(byScanner(t, from, to)).toEqual(byLexer(t, from, to));
      }),
      { seed: 20261203, numRuns: 1000, endOnFailure: true },
    );
  });

  it('gives the same tokens on the generated benchmark netlist', () => {
    const text = generateNetlist(3000);
    const scanned = byScanner(text);
    expect(scanned).toEqual(byLexer(text));
    // The netlist has every kind of token the bench measures; an empty scan would pass the equality too.
    expect(scanned.tokens.length).toBeGreaterThan(9000);
    expect(scanned.comments.length).toBeGreaterThan(400);
    expect(scanned.directives.length).toBe(3);
  });
});
