/**
 * `parseNetlist(text)` never throws: it returns the tree and the diagnostics. The text is scanned
 * once (scanner.ts); its tokens are cut into cards at line breaks; each card is parsed on its own,
 * so a broken card costs one diagnostic and nothing else.
 */
import type { IToken } from 'chevrotain';
import { parseCardTokens } from './card-parser';
import { buildElement, elementSyntax, NONE } from './card-builder';
import { parseDirective } from './directives';
import { buildDotCard } from './dot-card-builder';
import { carryOffsetLists, planReparse } from './reparse';
import { nestBlocks } from './structure';
import type { Card, Netlist, Span, SyntaxDiagnostic, TitleCard } from './syntax-tree';
import { detectForeignEncoding, withoutByteOrderMark, type ForeignEncoding } from './encoding';
import { isShapingHead, rememberMarks } from './card-marks';
import { readFlatCard } from './fast-card';
import { Scan, Scanner } from './scanner';
import { DotKeyword, tokenEnd, Word } from './tokens';
import { tokenMatcher } from 'chevrotain';

export interface ParseOptions {
  /** The first line is a title (SPICE convention for a top-level file) unless it parses as a card. Default true. */
  titleLine?: boolean;
  /**
   * The parse of an earlier version of the same text (with the same `titleLine`): its cards
   * outside the changed lines are reused. The result equals a parse without it.
   */
  previous?: Netlist;
  /**
   * Whether `previous` may be consumed: its cards after the edit are then moved (offsets updated
   * in place, the same objects) instead of copied. Only for a caller that drops the previous tree
   * (and everything that shares its nodes) once this parse returns.
   */
  consumePrevious?: boolean;
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
  const plan = options.previous ? planReparse(options.previous, text, options.consumePrevious ? 'move' : 'copy') : undefined;
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
  /** Indices into `cards` of the cards that shape the file (card-marks.ts). */
  marks: readonly number[];
}

/**
 * Scans and parses the lines in [from, to) of the text (both at line starts, or the text's end).
 * The scanner hands over one token at a time and each card is built as soon as its line ends, so
 * only one card's tokens are alive at once.
 */
function scanRegion(text: string, from: number, to: number): RegionParse {
  const cards: Card[] = [];
  const comments: Span[] = [];
  const diagnostics: SyntaxDiagnostic[] = [];
  const marks: number[] = [];
  const scanner = new Scanner(text, from, to);
  const tokens: IToken[] = [];
  for (;;) {
    const found = scanner.next();
    if (found === Scan.Token) {
      tokens.push(scanner.token());
      continue;
    }
    if (found === Scan.Comment) comments.push({ start: scanner.start, end: scanner.end });
    else if (found === Scan.Error) {
      const span = { start: scanner.start, end: scanner.end };
      diagnostics.push({ span, severity: 'error', code: 'syntax-error', message: `unexpected '${text.slice(span.start, span.end)}'` });
    } else {
      // A line break, a directive (which only ever starts a line) or the end closes the card.
      if (tokens.length) {
        if (isShapingHead(tokens[0]!.tokenType)) marks.push(cards.length);
        cards.push(buildCard(tokens, diagnostics));
        tokens.length = 0;
      }
      if (found === Scan.End) break;
      if (found === Scan.Directive) cards.push(directiveCard(text.slice(scanner.start, scanner.end), scanner.start, diagnostics));
    }
  }
  return { cards, comments, diagnostics, marks };
}

function directiveCard(line: string, start: number, diagnostics: SyntaxDiagnostic[]): Card {
  const parsed = parseDirective(line, start);
  // One line may hold any number of problems; spreading them into push() could pass the argument limit.
  for (const d of parsed.diagnostics) diagnostics.push(d);
  return { kind: 'directive', directive: parsed.directive, span: { start, end: start + line.length } };
}

/** Joins region parses (in text order) and runs the passes over the whole card list. */
function assemble(text: string, title: TitleCard | undefined, regions: RegionParse[]): Netlist {
  const diagnostics = joined(regions.map((r) => r.diagnostics));
  let marks: number[] = [];
  let before = 0;
  for (const region of regions) {
    for (const mark of region.marks) marks.push(before + mark);
    before += region.cards.length;
  }
  const all = joined(regions.map((r) => r.cards));
  const cards = truncateAtEnd(all, marks, diagnostics);
  if (cards.length < all.length) marks = marks.filter((m) => m < cards.length);
  const items = nestBlocks(cards, diagnostics, marks);
  diagnostics.sort((a, b) => a.span.start - b.span.start);
  const netlist: Netlist = { text, title, cards: title ? ([title] as Card[]).concat(cards) : cards, items, comments: joined(regions.map((r) => r.comments)), diagnostics };
  rememberMarks(netlist, marks);
  carryOffsetLists(netlist, regions, cards.length);
  return netlist;
}

/** The lists one after the other; `concat` copies whole arrays, where `flatMap` pushes element by element. */
function joined<T>(lists: T[][]): T[] {
  return lists.length === 1 ? lists[0]! : ([] as T[]).concat(...lists);
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
  const { tokens, errors } = scanLine(text, end);
  if (errors === 0 && tokens.length > 0) {
    const probe: SyntaxDiagnostic[] = [];
    const card = buildCard(tokens, probe);
    if (probe.every((d) => d.severity !== 'error') && card.kind !== 'opaque') return undefined;
  }
  return { kind: 'title', text: trimmed, span: { start: 0, end } };
}

/** The tokens of the text's first `end` characters as if they were the whole text, and how many lexing errors. */
function scanLine(text: string, end: number): { tokens: IToken[]; errors: number } {
  const scanner = new Scanner(text, 0, end);
  const tokens: IToken[] = [];
  let errors = 0;
  for (let found = scanner.next(); found !== Scan.End; found = scanner.next()) {
    if (found === Scan.Token) tokens.push(scanner.token());
    else if (found === Scan.Error) errors++;
  }
  return { tokens, errors };
}

function buildCard(tokens: IToken[], diagnostics: SyntaxDiagnostic[]): Card {
  const head = tokens[0]!;
  const span = spanOfTokens(head, tokens[tokens.length - 1]!);
  const isDot = tokenMatcher(head, DotKeyword);
  if (!isDot && head.tokenType !== Word) {
    diagnostics.push({ span: spanOfTokens(head, head), severity: 'error', code: 'syntax-error', message: `a card starts with an element name or a dot keyword, not '${head.image}'` });
    return { kind: 'opaque', name: { text: head.image, span: spanOfTokens(head, head) }, words: NONE, span };
  }
  const flat = readFlatCard(tokens);
  if (flat) return isDot ? buildDotCard(flat, span, diagnostics) : buildElement(flat, span, diagnostics);
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

/** SPICE stops reading at `.end`; what follows is dropped with a hint. */
function truncateAtEnd(cards: Card[], marks: readonly number[], diagnostics: SyntaxDiagnostic[]): Card[] {
  const end = marks.find((m) => cards[m]!.kind === 'end') ?? -1;
  if (end < 0 || end === cards.length - 1) return cards;
  const rest = cards.slice(end + 1).filter((c) => c.kind !== 'directive');
  if (rest.length) {
    diagnostics.push({ span: { start: rest[0]!.span.start, end: rest[rest.length - 1]!.span.end }, severity: 'hint', code: 'after-end', message: 'cards after .end are ignored' });
  }
  return cards.slice(0, end + 1);
}
