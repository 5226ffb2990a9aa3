import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { IToken } from 'chevrotain';
import { parseCardTokens } from '../../grammar/src/card-parser';
import { readFlatCard } from '../../grammar/src/fast-card';
import { Scan, Scanner } from '../../grammar/src/scanner';
import { generateNetlist } from '../../bench/generate-netlist';
import { netlistText } from '../fuzz/netlist-arbitrary';
import { tokenStreamText } from '../fuzz/text-arbitraries';

// A flat card read without the parser must be exactly what the chevrotain parser reads from it,
// and must never be a card the parser rejects.

/** The token runs of each card of a text, as the parse cuts them (at line breaks and directives). */
function cardTokens(text: string): IToken[][] {
  const cards: IToken[][] = [];
  let current: IToken[] = [];
  const scanner = new Scanner(text, 0, text.length);
  for (let found = scanner.next(); ; found = scanner.next()) {
    if (found === Scan.Token) current.push(scanner.token());
    else if (found === Scan.Newline || found === Scan.Directive || found === Scan.End) {
      if (current.length) cards.push(current);
      current = [];
      if (found === Scan.End) return cards;
    }
  }
}

/** Words, values, parameters, expressions, paths, and every token that makes a card not flat. */
const TOKENS = ['R1', 'D2', 'a', '0', '1k', '.model', '.param', '.ends', '.tran', '.end', '=', '=', '{r*2}', "'1+1'", '"p.cir"', '(', ')', ',', '{open', 'x=1', 'y=', 'V1'];
const cardText = fc.array(fc.constantFrom(...TOKENS), { minLength: 1, maxLength: 9 }).map((t) => t.join(' '));

describe('flat cards read without the parser', () => {
  it('equal the parser reading of the same tokens, and are never cards the parser rejects (fast-check)', () => {
    let flat = 0;
    fc.assert(
      fc.property(fc.oneof(cardText, tokenStreamText, netlistText), (text) => {
        for (const tokens of cardTokens(text)) {
          const read = readFlatCard(tokens);
          if (!read) continue;
          flat++;
          const parsed = parseCardTokens(tokens);
          expect(parsed.error).toBeUndefined();
          expect(read).toEqual(parsed.card);
        }
      }),
      { seed: 20261204, numRuns: 3000, endOnFailure: true },
    );
    // Most random cards are not flat; enough must be for the equality above to have been tried.
    expect(flat).toBeGreaterThan(1000);
  });

  it('reads every card of the benchmark netlist without the parser except those with parentheses', () => {
    for (const tokens of cardTokens(generateNetlist(1000))) {
      const hasParentheses = tokens.some((t) => t.image === '(' || t.image === ')');
      expect(readFlatCard(tokens) === undefined).toBe(hasParentheses);
    }
  });

  it('leaves to the parser a stray =, a dot keyword among the arguments and an unterminated quote', () => {
    for (const text of ['R1 a b= = 1', 'R1=1 a b', 'R1 a b=1=2', 'R1 a .end', 'R1 a {open', 'R1 a,b 1']) {
      const [tokens] = cardTokens(text);
      expect(readFlatCard(tokens!)).toBeUndefined();
      expect(parseCardTokens(tokens!).error).toBeDefined();
    }
  });
});
