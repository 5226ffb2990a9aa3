/**
 * Tokens of the netlist language. Lines matter in SPICE, so newlines are tokens; a `+` at the
 * start of a line joins it to the card above and is skipped with the line break before it.
 * Comments and directives go to their own groups so the parser sees only cards.
 */
import { createToken, Lexer, type CustomPatternMatcherFunc, type TokenType } from 'chevrotain';

/** Matches `pattern` only where it starts a line (after optional blanks). */
function atLineStart(pattern: RegExp): CustomPatternMatcherFunc {
  const sticky = new RegExp(pattern.source, 'y' + pattern.flags.replace('y', ''));
  return (text, offset) => {
    let before = offset - 1;
    while (before >= 0 && (text[before] === ' ' || text[before] === '\t')) before--;
    if (before >= 0 && text[before] !== '\n' && text[before] !== '\r') return null;
    sticky.lastIndex = offset;
    return sticky.exec(text);
  };
}

export const Whitespace = createToken({ name: 'Whitespace', pattern: /[ \t\f]+/, group: Lexer.SKIPPED });
export const Continuation = createToken({
  name: 'Continuation',
  pattern: /(?:\r\n|\r|\n)[ \t]*\+/,
  group: Lexer.SKIPPED,
  line_breaks: true,
});
export const Newline = createToken({ name: 'Newline', pattern: /\r\n|\r|\n/, line_breaks: true });

export const Directive = createToken({
  name: 'Directive',
  pattern: { exec: atLineStart(/\*@[^\r\n]*/) },
  start_chars_hint: ['*'],
  line_breaks: false,
  group: 'directives',
});
export const LineComment = createToken({
  name: 'LineComment',
  pattern: { exec: atLineStart(/\*[^\r\n]*/) },
  start_chars_hint: ['*'],
  line_breaks: false,
  group: 'comments',
});
export const TrailingComment = createToken({ name: 'TrailingComment', pattern: /;[^\r\n]*|\$[ \t][^\r\n]*|\$(?=[\r\n])/, group: 'comments' });

export const BraceExpression = createToken({ name: 'BraceExpression', pattern: /\{[^}\r\n]*\}/ });
export const QuoteExpression = createToken({ name: 'QuoteExpression', pattern: /'[^'\r\n]*'/ });
export const QuotedPath = createToken({ name: 'QuotedPath', pattern: /"[^"\r\n]*"/ });
/** An opening brace or quote with no closing partner on the line. */
export const Unterminated = createToken({ name: 'Unterminated', pattern: /[{'"][^\r\n]*/ });

export const LParen = createToken({ name: 'LParen', pattern: /\(/ });
export const RParen = createToken({ name: 'RParen', pattern: /\)/ });
export const Equals = createToken({ name: 'Equals', pattern: /=/ });
export const Comma = createToken({ name: 'Comma', pattern: /,/ });

/** The category of every dot card's keyword. */
export const DotKeyword = createToken({ name: 'DotKeyword', pattern: Lexer.NA });
/** Any dot keyword; the known ones below take precedence when they match the whole word. */
export const DotWord = createToken({ name: 'DotWord', pattern: /\.[A-Za-z_][\w.]*/, categories: [DotKeyword] });
const dotKeyword = (name: string, word: string): TokenType =>
  createToken({ name, pattern: new RegExp(`\\.${word}`, 'i'), longer_alt: DotWord, categories: [DotKeyword] });
export const DotSubckt = dotKeyword('DotSubckt', 'subckt');
export const DotEnds = dotKeyword('DotEnds', 'ends');
export const DotEndl = dotKeyword('DotEndl', 'endl');
export const DotEnd = dotKeyword('DotEnd', 'end');
export const DotModel = dotKeyword('DotModel', 'model');
export const DotParam = dotKeyword('DotParam', 'param');
export const DotInclude = createToken({ name: 'DotInclude', pattern: /\.inc(?:lude)?/i, longer_alt: DotWord, categories: [DotKeyword] });
export const DotLib = dotKeyword('DotLib', 'lib');

/** Names, nodes, numbers, units: everything else up to a separator. */
// A positive character class (not a complement) so the lexer can index tokens by first character.
export const Word = createToken({ name: 'Word', pattern: /[\w.+\-*/!@#$%^&:<>?|~[\]\\`\u0080-\uffff]+/ });

export const allTokens: TokenType[] = [
  Continuation, Newline, Whitespace,
  Directive, LineComment, TrailingComment,
  BraceExpression, QuoteExpression, QuotedPath, Unterminated,
  LParen, RParen, Equals, Comma,
  DotSubckt, DotEnds, DotEndl, DotEnd, DotModel, DotParam, DotInclude, DotLib, DotWord, DotKeyword,
  Word,
];

export const netlistLexer = new Lexer(allTokens, { ensureOptimizations: true, positionTracking: 'onlyOffset' });

/** The offset just after a token (the lexer tracks start offsets only, for speed). */
export function tokenEnd(token: { startOffset: number; image: string }): number {
  return token.startOffset + token.image.length;
}
