/**
 * The chevrotain parser of one card: a head token followed by arguments, where an argument is a
 * value, a `name=value` parameter, a parenthesised group (`SIN(0 325 50)`, `D(IS=1n)`) or a
 * quoted path. Cards are parsed one at a time, so a broken card never disturbs its neighbours;
 * what each argument means is decided afterwards, per card kind, in `card-builder.ts`.
 */
import { EmbeddedActionsParser, type IToken, type IParserErrorMessageProvider, type TokenType } from 'chevrotain';
import {
  allTokens, BraceExpression, Comma, DotKeyword, Equals, LParen, QuoteExpression, QuotedPath, RParen, Unterminated, Word,
  tokenEnd,
} from './tokens';

export type RawArg =
  | { kind: 'word'; token: IToken }
  | { kind: 'expr'; token: IToken }
  | { kind: 'path'; token: IToken }
  | { kind: 'param'; name: IToken; value?: RawArg; end: number }
  | { kind: 'group'; name?: IToken; open: IToken; args: RawArg[]; end: number };

export interface RawCard {
  head: IToken;
  args: RawArg[];
}

const TOKEN_DESCRIPTIONS: ReadonlyMap<TokenType, string> = new Map([
  [Word, 'a name or value'],
  [Equals, "'='"],
  [LParen, "'('"],
  [RParen, "')'"],
  [BraceExpression, 'an expression'],
  [QuoteExpression, 'an expression'],
]);

function describe(token: IToken): string {
  if (token.tokenType === Unterminated) return `unclosed '${token.image.charAt(0)}'`;
  return token.image === '' ? 'the end of the card' : `'${token.image}'`;
}

const messages: IParserErrorMessageProvider = {
  buildMismatchTokenMessage: ({ expected, actual }) =>
    `expected ${TOKEN_DESCRIPTIONS.get(expected) ?? expected.name}, found ${describe(actual)}`,
  buildNotAllInputParsedMessage: ({ firstRedundant }) => `unexpected ${describe(firstRedundant)}`,
  buildNoViableAltMessage: ({ actual }) => `unexpected ${describe(actual[0]!)}`,
  buildEarlyExitMessage: ({ actual }) => `unexpected ${describe(actual[0]!)}`,
};

class CardParser extends EmbeddedActionsParser {
  constructor() {
    super(allTokens, { recoveryEnabled: false, maxLookahead: 2, errorMessageProvider: messages });
    this.performSelfAnalysis();
  }

  public card = this.RULE('card', (): RawCard => {
    const head = this.OR([{ ALT: () => this.CONSUME(Word) }, { ALT: () => this.CONSUME(DotKeyword) }]);
    const args: RawArg[] = [];
    this.MANY(() => args.push(this.SUBRULE(this.argument)));
    return { head, args };
  });

  private argument = this.RULE('argument', (): RawArg =>
    this.OR([
      { ALT: () => this.SUBRULE(this.group) },
      { ALT: () => this.SUBRULE(this.param) },
      { ALT: () => this.SUBRULE(this.value) },
      { ALT: () => ({ kind: 'path', token: this.CONSUME(QuotedPath) }) as RawArg },
    ]),
  );

  private group = this.RULE('group', (): RawArg => {
    const name = this.OPTION(() => this.CONSUME(Word));
    const open = this.CONSUME(LParen);
    const args: RawArg[] = [];
    this.MANY(() => this.OR([{ ALT: () => args.push(this.SUBRULE(this.argument)) }, { ALT: () => this.CONSUME(Comma) }]));
    const close = this.CONSUME(RParen);
    return { kind: 'group', name, open, args, end: tokenEnd(close) };
  });

  private param = this.RULE('param', (): RawArg => {
    const name = this.CONSUME(Word);
    const equals = this.CONSUME(Equals);
    const value = this.OPTION(() => this.SUBRULE(this.value));
    return this.ACTION(() => ({ kind: 'param', name, value, end: value ? argEnd(value) : tokenEnd(equals) }) as RawArg);
  });

  private value = this.RULE('value', (): RawArg =>
    this.OR([
      { ALT: () => ({ kind: 'word', token: this.CONSUME(Word) }) as RawArg },
      { ALT: () => ({ kind: 'expr', token: this.CONSUME(BraceExpression) }) as RawArg },
      { ALT: () => ({ kind: 'expr', token: this.CONSUME(QuoteExpression) }) as RawArg },
    ]),
  );
}

/** The offset just after an argument. */
export function argEnd(arg: RawArg): number {
  return arg.kind === 'param' || arg.kind === 'group' ? arg.end : tokenEnd(arg.token);
}

/** The offset where an argument starts. */
export function argStart(arg: RawArg): number {
  if (arg.kind === 'param') return arg.name.startOffset;
  if (arg.kind === 'group') return (arg.name ?? arg.open).startOffset;
  return arg.token.startOffset;
}

const parser = new CardParser();

export interface CardParse {
  card?: RawCard;
  /** The first syntax error, with the offending token (absent token: the card ended early). */
  error?: { message: string; token?: IToken };
}

/**
 * Deeper parenthesis nesting than this is refused before parsing: the parser descends once per
 * level, so nesting is the one thing in a card that could exhaust the stack. Real cards nest two.
 */
export const MAX_GROUP_DEPTH = 32;

/** Parses the tokens of one card (no newlines among them). */
export function parseCardTokens(tokens: IToken[]): CardParse {
  const tooDeep = firstTooDeep(tokens);
  if (tooDeep) return { error: { message: `parentheses nest deeper than ${MAX_GROUP_DEPTH} levels (limit: parenthesis nesting); the card is read only up to here`, token: tooDeep } };
  parser.input = tokens;
  const card = parser.card();
  const error = parser.errors[0];
  if (!error) return { card };
  const token = error.token.image === '' || error.token.tokenType.name === 'EOF' ? undefined : error.token;
  return { card, error: { message: error.message, token } };
}

/** The first '(' past the nesting limit, counting only parentheses (an unclosed one counts too). */
function firstTooDeep(tokens: readonly IToken[]): IToken | undefined {
  let depth = 0;
  for (const token of tokens) {
    if (token.tokenType === LParen && ++depth > MAX_GROUP_DEPTH) return token;
    if (token.tokenType === RParen && depth > 0) depth--;
  }
  return undefined;
}
