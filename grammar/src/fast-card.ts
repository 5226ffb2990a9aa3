/**
 * The common card read without the chevrotain parser: a head and flat arguments (words,
 * `name=value`, expressions, quoted paths), no parentheses. For such a card the parser's result is
 * fixed by its grammar (card-parser.ts): `Word Equals` starts a parameter whose value is the next
 * word or expression if one follows, any other word is a value, and nothing else may appear. This
 * builds that same `RawCard`; any token outside that shape (a parenthesis, a comma, a stray `=`,
 * a dot keyword among the arguments, an unterminated quote) returns undefined and the card goes
 * to the parser, which reads it and words its errors as it always has.
 * `tests/grammar/fast-card.test.ts` checks the equality against the parser on random token runs.
 */
import { tokenMatcher, type IToken } from 'chevrotain';
import type { RawArg, RawCard } from './card-parser';
import { BraceExpression, DotKeyword, Equals, QuotedPath, QuoteExpression, tokenEnd, Word } from './tokens';

const WORD = Word.tokenTypeIdx!;
const EQUALS = Equals.tokenTypeIdx!;
const BRACE = BraceExpression.tokenTypeIdx!;
const QUOTE = QuoteExpression.tokenTypeIdx!;
const PATH = QuotedPath.tokenTypeIdx!;

/** The parser's reading of a flat card, or undefined when the card needs the parser. */
export function readFlatCard(tokens: readonly IToken[]): RawCard | undefined {
  const head = tokens[0];
  if (!head || (head.tokenTypeIdx !== WORD && !tokenMatcher(head, DotKeyword))) return undefined;
  const args: RawArg[] = [];
  const count = tokens.length;
  for (let i = 1; i < count; ) {
    const token = tokens[i]!;
    const type = token.tokenTypeIdx;
    if (type === WORD) {
      const equals = tokens[i + 1];
      if (equals === undefined || equals.tokenTypeIdx !== EQUALS) {
        args.push({ kind: 'word', token });
        i++;
        continue;
      }
      const next = tokens[i + 2];
      const value = next === undefined ? undefined : valueArg(next);
      args.push({ kind: 'param', name: token, value, end: value ? tokenEnd(next!) : tokenEnd(equals) });
      i += value ? 3 : 2;
    } else if (type === BRACE || type === QUOTE) {
      args.push({ kind: 'expr', token });
      i++;
    } else if (type === PATH) {
      args.push({ kind: 'path', token });
      i++;
    } else return undefined;
  }
  return { head, args };
}

function valueArg(token: IToken): RawArg | undefined {
  const type = token.tokenTypeIdx;
  if (type === WORD) return { kind: 'word', token };
  if (type === BRACE || type === QUOTE) return { kind: 'expr', token };
  return undefined;
}

