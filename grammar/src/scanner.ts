/**
 * Our own scanner in front of the chevrotain parser. It reads the same language as `netlistLexer`
 * (tokens.ts) and emits the same tokens: the same token types, images and start offsets, in
 * chevrotain's own token shape, so the parser and the card builders cannot tell them apart.
 * `tests/grammar/scanner.test.ts` proves the equality on random and generated texts.
 *
 * Why our own: the chevrotain lexer tries each pattern in turn at every token start and cost a
 * dozen times a line split; this one decides by the first character with one table look-up and
 * walks the text with `charCodeAt`. It also streams: the caller takes one token at a time, so the
 * tokens of a card die young instead of the whole file's tokens living at once.
 *
 * The rules it follows are those of tokens.ts, in the same precedence: at a line break a
 * continuation (`\n` + blanks + `+`) wins over a plain newline; at `*` a directive or full-line
 * comment wins only at a line start, else `*` starts a word; `;` and `$ ` open a trailing comment;
 * a brace or quote without its partner on the line is one unterminated token; a dot word that is
 * exactly a known keyword (any case) takes the keyword's type; characters no token can start are
 * reported as one lexing error per run, as the lexer's recovery does.
 */
import type { IToken, TokenType } from 'chevrotain';
import {
  BraceExpression, Comma, Directive, DotEnd, DotEndl, DotEnds, DotInclude, DotLib, DotModel, DotParam, DotSubckt, DotWord, Equals,
  LineComment, LParen, Newline, QuotedPath, QuoteExpression, RParen, TrailingComment, Unterminated, Word,
} from './tokens';

/** What `Scanner.next()` found; start and end of it are in `scanner.start` / `scanner.end`. */
export const enum Scan { End, Token, Newline, Comment, Directive, Error }

const enum Char { Invalid, Blank, FormFeed, LineFeed, Return, Star, Semicolon, Dollar, Brace, Quote, DoubleQuote, Single, Dot, Word }

/** The class of each ASCII character; every code unit from U+0080 up is a word character. */
const CLASS = new Uint8Array(128);
const SINGLE: (TokenType | undefined)[] = [];
(() => {
  for (const ch of 'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789_.+-*/!@#$%^&:<>?|~[]\\`') CLASS[ch.charCodeAt(0)] = Char.Word;
  const own: [string, Char][] = [[' ', Char.Blank], ['\t', Char.Blank], ['\f', Char.FormFeed], ['\n', Char.LineFeed], ['\r', Char.Return],
    ['*', Char.Star], [';', Char.Semicolon], ['$', Char.Dollar], ['{', Char.Brace], ["'", Char.Quote], ['"', Char.DoubleQuote], ['.', Char.Dot]];
  for (const [ch, cls] of own) CLASS[ch.charCodeAt(0)] = cls;
  for (const [ch, type] of [['(', LParen], [')', RParen], ['=', Equals], [',', Comma]] as const) {
    CLASS[ch.charCodeAt(0)] = Char.Single;
    SINGLE[ch.charCodeAt(0)] = type;
  }
})();

const classOf = (code: number): number => (code < 128 ? CLASS[code]! : Char.Word);
const isWordChar = (code: number): boolean => code >= 128 || CLASS[code] === Char.Word || CLASS[code] === Char.Star || CLASS[code] === Char.Dollar || CLASS[code] === Char.Dot;
/** `[\w.]`, what a dot word continues with. */
const isDotWordChar = (code: number): boolean => (code >= 48 && code <= 57) || (code >= 65 && code <= 90) || (code >= 97 && code <= 122) || code === 95 || code === 46;

const KEYWORDS: ReadonlyMap<string, TokenType> = new Map([
  ['.subckt', DotSubckt], ['.ends', DotEnds], ['.endl', DotEndl], ['.end', DotEnd], ['.model', DotModel], ['.param', DotParam],
  ['.include', DotInclude], ['.inc', DotInclude], ['.lib', DotLib],
]);
const LONGEST_KEYWORD = 8;
/** Longer images are slices that point into the text, and cost little more to keep than a shared one. */
const MAX_SHARED_LENGTH = 12;
const SHARED_SLOTS = 4096;

function sameText(word: string, text: string, start: number): boolean {
  for (let i = 0; i < word.length; i++) if (word.charCodeAt(i) !== text.charCodeAt(start + i)) return false;
  return true;
}

/** Scans [from, to) of a text as if that slice were the whole input (offsets stay the text's own). */
export class Scanner {
  /** Where the last thing found starts and ends (end exclusive). */
  start = 0;
  end = 0;
  /** The token type of the last thing found (a comment, directive and newline have theirs too). */
  type: TokenType = Word;
  private at: number;

  constructor(private readonly text: string, private readonly from: number, private readonly to: number) {
    this.at = from;
  }

  /** The last thing found (not an error) as the chevrotain token the lexer would give. */
  token(): IToken {
    const type = this.type;
    return { image: this.image(), startOffset: this.start, tokenTypeIdx: type.tokenTypeIdx!, tokenType: type };
  }

  /**
   * The text of the last thing found. Names repeat (a node on every card that touches it, a
   * model on every device), and the tree keeps the words it is given for as long as the file is
   * open, so a repeated word is handed out as the one string already made.
   */
  image(): string {
    const { text, start, end } = this;
    const length = end - start;
    if (length > MAX_SHARED_LENGTH) return text.slice(start, end);
    let hash = length;
    for (let at = start; at < end; at++) hash = (Math.imul(hash, 31) + text.charCodeAt(at)) | 0;
    const slot = hash & (SHARED_SLOTS - 1);
    const known = this.words[slot];
    if (known !== undefined && known.length === length && sameText(known, text, start)) return known;
    const image = text.slice(start, end);
    this.words[slot] = image;
    return image;
  }

  /** Recently made words by a hash of their text: one slot each, the newest wins (bounded, no growth). */
  private readonly words: (string | undefined)[] = new Array(SHARED_SLOTS).fill(undefined);

  next(): Scan {
    const { text, to } = this;
    for (;;) {
      const at = this.at;
      if (at >= to) return Scan.End;
      const code = text.charCodeAt(at);
      switch (classOf(code)) {
        case Char.Blank: case Char.FormFeed: this.at = this.skipBlanks(at + 1, true); continue;
        case Char.LineFeed: case Char.Return: {
          const after = code === 13 && at + 1 < to && text.charCodeAt(at + 1) === 10 ? at + 2 : at + 1;
          const plus = this.skipBlanks(after, false);
          if (plus < to && text.charCodeAt(plus) === 43) { this.at = plus + 1; continue; }
          this.type = Newline;
          return this.found(Scan.Newline, at, after);
        }
        case Char.Star:
          if (this.atLineStart(at)) {
            const directive = at + 1 < to && text.charCodeAt(at + 1) === 64;
            this.type = directive ? Directive : LineComment;
            return this.found(directive ? Scan.Directive : Scan.Comment, at, this.lineEnd(at));
          }
          return this.word(at);
        case Char.Semicolon: this.type = TrailingComment; return this.found(Scan.Comment, at, this.lineEnd(at));
        case Char.Dollar: {
          const next = at + 1 < to ? text.charCodeAt(at + 1) : -1;
          if (next !== 32 && next !== 9 && next !== 10 && next !== 13) return this.word(at);
          this.type = TrailingComment;
          return this.found(Scan.Comment, at, next === 10 || next === 13 ? at + 1 : this.lineEnd(at));
        }
        case Char.Brace: return this.closed(at, 125, BraceExpression);
        case Char.Quote: return this.closed(at, 39, QuoteExpression);
        case Char.DoubleQuote: return this.closed(at, 34, QuotedPath);
        case Char.Single: this.type = SINGLE[code]!; return this.found(Scan.Token, at, at + 1);
        case Char.Dot: return this.dot(at);
        case Char.Word: return this.word(at);
        default: {
          let end = at + 1;
          while (end < to && classOf(text.charCodeAt(end)) === Char.Invalid) end++;
          return this.found(Scan.Error, at, end);
        }
      }
    }
  }

  private found(kind: Scan, start: number, end: number): Scan {
    this.start = start;
    this.end = end;
    this.at = end;
    return kind;
  }

  /** Past the blanks from `at`: spaces and tabs, and form feeds where `formFeeds` (whitespace, not indentation). */
  private skipBlanks(at: number, formFeeds: boolean): number {
    const { text, to } = this;
    while (at < to) {
      const code = text.charCodeAt(at);
      if (code !== 32 && code !== 9 && !(formFeeds && code === 12)) break;
      at++;
    }
    return at;
  }

  /** Only blanks between the line's start (or the start of the input) and `at`. */
  private atLineStart(at: number): boolean {
    let before = at - 1;
    while (before >= this.from && (this.text.charCodeAt(before) === 32 || this.text.charCodeAt(before) === 9)) before--;
    if (before < this.from) return true;
    const code = this.text.charCodeAt(before);
    return code === 10 || code === 13;
  }

  private lineEnd(at: number): number {
    const { text, to } = this;
    while (at < to) {
      const code = text.charCodeAt(at);
      if (code === 10 || code === 13) break;
      at++;
    }
    return at;
  }

  /** A token from an opening character to its partner on the same line, else unterminated to the line's end. */
  private closed(at: number, partner: number, type: TokenType): Scan {
    const { text, to } = this;
    for (let end = at + 1; end < to; end++) {
      const code = text.charCodeAt(end);
      if (code === partner) { this.type = type; return this.found(Scan.Token, at, end + 1); }
      if (code === 10 || code === 13) break;
    }
    this.type = Unterminated;
    return this.found(Scan.Token, at, this.lineEnd(at));
  }

  private dot(at: number): Scan {
    const { text, to } = this;
    const first = at + 1 < to ? text.charCodeAt(at + 1) : -1;
    const letter = (first >= 65 && first <= 90) || (first >= 97 && first <= 122) || first === 95;
    if (!letter) return this.word(at);
    let end = at + 2;
    while (end < to && isDotWordChar(text.charCodeAt(end))) end++;
    this.type = (end - at <= LONGEST_KEYWORD && KEYWORDS.get(text.slice(at, end).toLowerCase())) || DotWord;
    return this.found(Scan.Token, at, end);
  }

  private word(at: number): Scan {
    const { text, to } = this;
    let end = at + 1;
    while (end < to && isWordChar(text.charCodeAt(end))) end++;
    this.type = Word;
    return this.found(Scan.Token, at, end);
  }
}
