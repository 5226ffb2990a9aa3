/**
 * `parseNetlist(text)` never throws: it returns the tree and the diagnostics. The text is lexed
 * once; its tokens are cut into cards at line breaks; each card is parsed on its own, so a broken
 * card costs one diagnostic and nothing else.
 */
import type { IToken } from 'chevrotain';
import { parseCardTokens } from './card-parser';
import { buildElement, elementSyntax } from './card-builder';
import { parseDirective } from './directives';
import { buildDotCard } from './dot-card-builder';
import { planReparse } from './reparse';
import { nestBlocks } from './structure';
import type { Card, Netlist, Span, SyntaxDiagnostic, TitleCard } from './syntax-tree';
import { detectForeignEncoding, withoutByteOrderMark, type ForeignEncoding } from './encoding';
import { DotKeyword, netlistLexer, Newline, tokenEnd, Word } from './tokens';
import { tokenMatcher } from 'chevrotain';

export interface ParseOptions {
  /** The first line is a title (SPICE convention for a top-level file) unless it parses as a card. Default true. */
  titleLine?: boolean;
  /**
   * The parse of an earlier version of the same text (with the same `titleLine`): its cards
   * outside the changed lines are reused. The result equals a parse without it.
   */
  previous?: Netlist;
}

export function parseNetlist(source: string, options: ParseOptions = {}): Netlist {
  try {
    return parseText(source, options);
  } catch (error) {
    // No input may make the parser throw (the hostile-structure fuzz suite checks that none does);
    // should a bug let one through, the file gets one finding instead of taking its caller down.
    const reason = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
    const diagnostic: SyntaxDiagnostic = { span: { start: 0, end: 0 }, severity: 'error', code: 'internal-error', message: `the parser failed (${reason}); the file is not analysed` };
    return { text: source, cards: [], items: [], comments: [], diagnostics: [diagnostic] };
  }
}

function parseText(source: string, options: ParseOptions): Netlist {
  const encoding = detectForeignEncoding(source);
  if (encoding) return encodingRefusal(source, encoding);
  const text = withoutByteOrderMark(source);
  const plan = options.previous ? planReparse(options.previous, text) : undefined;
  if (plan) return assemble(text, options.previous!.title, [plan.prefix, scanRegion(text, plan.start, plan.end), plan.suffix]);
  const title = options.titleLine === false ? undefined : readTitle(text);
  return assemble(text, title, [scanRegion(text, title ? title.span.end : 0, text.length)]);
}

/** A file in another encoding: one finding naming it, and no cards (what it would give is garbage). */
function encodingRefusal(text: string, encoding: ForeignEncoding): Netlist {
  const diagnostic: SyntaxDiagnostic = {
    span: { start: 0, end: 0 }, severity: 'error', code: 'file-encoding',
    message: `the file is ${encoding.name}${encoding.bom ? ' with a byte-order mark' : ''}, not UTF-8 text: it was not analysed; save it as UTF-8`,
  };
  return { text, cards: [], items: [], comments: [], diagnostics: [diagnostic] };
}

interface RegionParse {
  cards: Card[];
  comments: Span[];
  diagnostics: SyntaxDiagnostic[];
}

/**
 * A region is lexed in pieces of about this many characters, cut at line starts that do not
 * continue the line before, so the tokens of a large file are never all alive at once (they cost
 * some fifty times the text they cover).
 */
const PIECE_CHARS = 1 << 20;
const PIECE_CUT = /\n(?![ \t]*\+)/g;

/** Lexes and parses the lines in [from, to) of the text (both at line starts, or the text's end). */
function scanRegion(text: string, from: number, to: number): RegionParse {
  const pieces: RegionParse[] = [];
  for (let start = from; start < to; ) {
    PIECE_CUT.lastIndex = start + PIECE_CHARS;
    const cut = to - start > PIECE_CHARS ? PIECE_CUT.exec(text) : null;
    const end = cut && cut.index + 1 < to ? cut.index + 1 : to;
    pieces.push(scanPiece(text, start, end));
    start = end;
  }
  if (pieces.length === 1) return pieces[0]!;
  return { cards: pieces.flatMap((p) => p.cards), comments: pieces.flatMap((p) => p.comments), diagnostics: pieces.flatMap((p) => p.diagnostics) };
}

function scanPiece(text: string, from: number, to: number): RegionParse {
  const diagnostics: SyntaxDiagnostic[] = [];
  const lexed = netlistLexer.tokenize(text.slice(from, to));
  if (from > 0) {
    for (const token of lexed.tokens) token.startOffset += from;
    for (const group of Object.values(lexed.groups)) for (const token of group) token.startOffset += from;
  }
  for (const error of lexed.errors) {
    const span = { start: error.offset + from, end: error.offset + from + Math.max(1, error.length) };
    diagnostics.push({ span, severity: 'error', code: 'syntax-error', message: `unexpected '${text.slice(span.start, span.end)}'` });
  }
  const elementCards = splitCards(lexed.tokens).map((tokens) => buildCard(tokens, diagnostics));
  const directiveCards: Card[] = (lexed.groups.directives ?? []).map((token) => {
    const parsed = parseDirective(token.image, token.startOffset);
    // One line may hold any number of problems; spreading them into push() could pass the argument limit.
    for (const d of parsed.diagnostics) diagnostics.push(d);
    return { kind: 'directive', directive: parsed.directive, span: spanOfTokens(token, token) };
  });
  const comments = (lexed.groups.comments ?? []).map((t) => spanOfTokens(t, t));
  return { cards: mergeByOffset(elementCards, directiveCards), comments, diagnostics };
}

/** Joins region parses (in text order) and runs the passes over the whole card list. */
function assemble(text: string, title: TitleCard | undefined, regions: RegionParse[]): Netlist {
  const diagnostics = regions.flatMap((r) => r.diagnostics);
  const cards = truncateAtEnd(regions.flatMap((r) => r.cards), diagnostics);
  const items = nestBlocks(cards, diagnostics);
  diagnostics.sort((a, b) => a.span.start - b.span.start);
  return { text, title, cards: title ? [title, ...cards] : cards, items, comments: regions.flatMap((r) => r.comments), diagnostics };
}

function spanOfTokens(first: IToken, last: IToken): Span {
  return { start: first.startOffset, end: tokenEnd(last) };
}

/** Takes the first line as the title unless it is a comment, a dot card or a clean element card. */
function readTitle(text: string): TitleCard | undefined {
  const end = text.search(/\r|\n|$/);
  const line = text.slice(0, end);
  const trimmed = line.trim();
  if (trimmed === '' || trimmed.startsWith('*') || trimmed.startsWith('.')) return undefined;
  const lexed = netlistLexer.tokenize(line);
  if (lexed.errors.length === 0 && lexed.tokens.length > 0) {
    const probe: SyntaxDiagnostic[] = [];
    const card = buildCard(lexed.tokens, probe);
    if (probe.every((d) => d.severity !== 'error') && card.kind !== 'opaque') return undefined;
  }
  return { kind: 'title', text: trimmed, span: { start: 0, end } };
}

function splitCards(tokens: IToken[]): IToken[][] {
  const cards: IToken[][] = [];
  let current: IToken[] = [];
  for (const token of tokens) {
    if (token.tokenType === Newline) {
      if (current.length) cards.push(current);
      current = [];
    } else current.push(token);
  }
  if (current.length) cards.push(current);
  return cards;
}

function buildCard(tokens: IToken[], diagnostics: SyntaxDiagnostic[]): Card {
  const head = tokens[0]!;
  const span = spanOfTokens(head, tokens[tokens.length - 1]!);
  const isDot = tokenMatcher(head, DotKeyword);
  if (!isDot && head.tokenType !== Word) {
    diagnostics.push({ span: spanOfTokens(head, head), severity: 'error', code: 'syntax-error', message: `a card starts with an element name or a dot keyword, not '${head.image}'` });
    return { kind: 'opaque', name: { text: head.image, span: spanOfTokens(head, head) }, words: [], span };
  }
  const parsed = parseCardTokens(tokens);
  if (parsed.error) {
    const at = parsed.error.token ?? tokens[tokens.length - 1]!;
    const syntax = isDot ? undefined : elementSyntax(head.image.charAt(0).toUpperCase());
    const message = parsed.error.token ? parsed.error.message : `${head.image}: the card ends too early (${parsed.error.message})`;
    diagnostics.push({ span: spanOfTokens(at, at), severity: 'error', code: 'syntax-error', message: syntax ? `${message}; expected ${syntax}` : message });
    // Keep what came before the fault so the card still has a name, nodes and a range.
    const before = tokens.filter((t) => t.startOffset < at.startOffset && t !== head && t.tokenType === Word);
    const recovered = { head, args: before.map((token) => ({ kind: 'word' as const, token })) };
    return isDot ? buildDotCard(recovered, span, []) : buildElement(recovered, span, []);
  }
  return isDot ? buildDotCard(parsed.card!, span, diagnostics) : buildElement(parsed.card!, span, diagnostics);
}

function mergeByOffset(a: Card[], b: Card[]): Card[] {
  if (b.length === 0) return a;
  const out: Card[] = [];
  let i = 0;
  let j = 0;
  while (i < a.length || j < b.length) {
    if (j >= b.length || (i < a.length && a[i]!.span.start < b[j]!.span.start)) out.push(a[i++]!);
    else out.push(b[j++]!);
  }
  return out;
}

/** SPICE stops reading at `.end`; what follows is dropped with a hint. */
function truncateAtEnd(cards: Card[], diagnostics: SyntaxDiagnostic[]): Card[] {
  const end = cards.findIndex((c) => c.kind === 'end');
  if (end < 0 || end === cards.length - 1) return cards;
  const rest = cards.slice(end + 1).filter((c) => c.kind !== 'directive');
  if (rest.length) {
    diagnostics.push({ span: { start: rest[0]!.span.start, end: rest[rest.length - 1]!.span.end }, severity: 'hint', code: 'after-end', message: 'cards after .end are ignored' });
  }
  return cards.slice(0, end + 1);
}
