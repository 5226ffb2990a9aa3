/**
 * Gives the arguments of a parsed card their meaning (nodes, value, model, parameters…) for each
 * card kind, and reports what is missing or extra on the exact token at fault.
 */
import type { IToken } from 'chevrotain';
import { argEnd, argStart, type RawArg, type RawCard } from './card-parser';
import { parseExpression } from './expression';
import type {
  Card, DiodeCard, FunctionCall, InstanceCard, MosfetCard, Name, Param, PassiveCard, SourceCard, Span, SyntaxDiagnostic, Value,
} from './syntax-tree';
import { tokenEnd } from './tokens';
import { readNumber } from './values';

type Diagnostics = SyntaxDiagnostic[];

const ELEMENT_SYNTAX: Readonly<Record<string, string>> = {
  R: 'Rname node node value', C: 'Cname node node value', L: 'Lname node node value',
  D: 'Dname anode cathode model', M: 'Mname drain gate source bulk model',
  V: 'Vname node+ node- [DC value] [AC mag] [SIN(VO VA FREQ …)]', I: 'Iname node+ node- [DC value] [AC mag] [SIN(…)]',
  K: 'Kname Lname Lname coefficient', X: 'Xname node… subckt [name=value…]',
};

/** The syntax reminder shown when an element card is malformed. */
export function elementSyntax(letter: string): string | undefined {
  return ELEMENT_SYNTAX[letter];
}

/**
 * The one empty list that every card without parameters, ports or words shares (frozen, so no
 * consumer can fill it by mistake): a tree of a large file holds one per card otherwise.
 */
export const NONE: never[] = Object.freeze([]) as never[];

/**
 * A list built by `push` keeps room for sixteen entries; the tree keeps its lists for as long as
 * the file is open, so each is stored at its exact length (or as `NONE`).
 */
export function exact<T>(list: T[]): T[] {
  return list.length === 0 ? NONE : list.slice();
}

export function nameOf(token: IToken): Name {
  return { text: token.image, span: { start: token.startOffset, end: tokenEnd(token) } };
}

function spanOf(arg: RawArg): Span {
  return { start: argStart(arg), end: argEnd(arg) };
}

/** Reads a value argument (number, expression or parameter name). */
export function valueOf(arg: RawArg, diagnostics: Diagnostics): Value | undefined {
  if (arg.kind === 'word') {
    const span = spanOf(arg);
    const text = arg.token.image;
    const reading = readNumber(text);
    if (reading) {
      if (reading.warning) diagnostics.push({ span, severity: 'warning', code: 'value-notation', message: reading.warning });
      return { text, span, form: 'number', number: reading.value };
    }
    if (!/^[A-Za-z_][\w.]*$/.test(text)) {
      diagnostics.push({ span, severity: 'error', code: 'syntax-error', message: `'${text}' is neither a number nor a parameter name` });
      return { text, span, form: 'identifier' };
    }
    return { text, span, form: 'identifier', expr: { type: 'ref', name: text.toLowerCase(), start: span.start, end: span.end } };
  }
  if (arg.kind === 'expr') {
    const span = spanOf(arg);
    const parsed = parseExpression(arg.token.image.slice(1, -1), span.start + 1);
    if (parsed.error) diagnostics.push({ span: parsed.error, severity: 'error', code: 'syntax-error', message: parsed.error.message });
    return { text: arg.token.image, span, form: 'expression', expr: parsed.expr };
  }
  return undefined;
}

function paramOf(arg: Extract<RawArg, { kind: 'param' }>, diagnostics: Diagnostics): Param {
  const value = arg.value ? valueOf(arg.value, diagnostics) : undefined;
  if (!arg.value) diagnostics.push({ span: spanOf(arg), severity: 'error', code: 'syntax-error', message: `'${arg.name.image}=' needs a value` });
  return { name: nameOf(arg.name), value, span: spanOf(arg) };
}

/** Splits arguments into bare ones (in order), parameters and groups. */
function sortArgs(args: RawArg[], diagnostics: Diagnostics) {
  const bare: RawArg[] = [];
  const params: Param[] = [];
  const groups: Extract<RawArg, { kind: 'group' }>[] = [];
  for (const arg of args) {
    if (arg.kind === 'param') params.push(paramOf(arg, diagnostics));
    else if (arg.kind === 'group') groups.push(arg);
    else bare.push(arg);
  }
  return { bare, params: exact(params), groups };
}

function wordName(arg: RawArg | undefined, role: string, diagnostics: Diagnostics): Name | undefined {
  if (!arg) return undefined;
  if (arg.kind === 'word') return nameOf(arg.token);
  if (arg.kind === 'path') return { text: arg.token.image.slice(1, -1), span: spanOf(arg) };
  diagnostics.push({ span: spanOf(arg), severity: 'error', code: 'syntax-error', message: `expected ${role}, found '${arg.kind === 'expr' ? arg.token.image : '…'}'` });
  return undefined;
}

function reportExtra(args: RawArg[], what: string, diagnostics: Diagnostics): void {
  for (const arg of args) diagnostics.push({ span: spanOf(arg), severity: 'error', code: 'syntax-error', message: `unexpected extra ${what}` });
}

function reportGroups(groups: RawArg[], card: string, diagnostics: Diagnostics): void {
  for (const g of groups) diagnostics.push({ span: spanOf(g), severity: 'error', code: 'syntax-error', message: `a parenthesised list does not belong on ${card}` });
}

/** Reports a card that ended before a required part, on the card's last token. */
function reportShort(head: IToken, args: RawArg[], message: string, diagnostics: Diagnostics): void {
  const last = args.length ? spanOf(args[args.length - 1]!) : nameOf(head).span;
  diagnostics.push({ span: last, severity: 'error', code: 'syntax-error', message });
}

function nodes(bare: RawArg[], count: number, diagnostics: Diagnostics): Name[] {
  const picked = bare.length > count ? bare.slice(0, count) : bare;
  if (picked.length === 0) return NONE;
  // Words and paths always name a node; only an expression is refused (with its diagnostic).
  if (picked.every((a) => a.kind !== 'expr')) return picked.map((a) => wordName(a, 'a node name', diagnostics)!);
  return exact(picked.flatMap((a) => wordName(a, 'a node name', diagnostics) ?? []));
}

function buildPassive(raw: RawCard, span: Span, letter: 'R' | 'C' | 'L', d: Diagnostics): PassiveCard {
  const [a, b, c] = raw.args;
  // The card as it is nearly always written, two nodes and a value, built without sorting its arguments.
  if (raw.args.length === 3 && a!.kind === 'word' && b!.kind === 'word' && c!.kind === 'word') {
    return { kind: 'passive', letter, name: nameOf(raw.head), nodes: [nameOf(a!.token), nameOf(b!.token)], params: NONE, span, value: valueOf(c!, d) };
  }
  const { bare, params, groups } = sortArgs(raw.args, d);
  reportGroups(groups, `a ${letter} card`, d);
  const name = nameOf(raw.head);
  const two = nodes(bare, 2, d);
  // One literal with every field, so the card holds its fields in itself rather than in a second store.
  let card: PassiveCard;
  if (bare[2]) card = { kind: 'passive', letter, name, nodes: two, params, span, value: valueOf(bare[2], d) };
  else {
    card = { kind: 'passive', letter, name, nodes: two, params, span };
    reportShort(raw.head, raw.args, `${raw.head.image} needs two nodes and a value (${ELEMENT_SYNTAX[letter]})`, d);
  }
  if (bare.length > 3) reportExtra(bare.slice(3), 'value', d);
  return card;
}

function buildDiode(raw: RawCard, span: Span, d: Diagnostics): DiodeCard {
  const [a, b, c] = raw.args;
  // Anode, cathode and model, as nearly every diode is written: no arguments to sort.
  if (raw.args.length === 3 && a!.kind === 'word' && b!.kind === 'word' && c!.kind === 'word') {
    return { kind: 'diode', name: nameOf(raw.head), nodes: [nameOf(a!.token), nameOf(b!.token)], params: NONE, span, model: nameOf(c!.token) };
  }
  const { bare, card } = modelledCard(raw, span, d, 'diode', 2, `anode, cathode and a model (${ELEMENT_SYNTAX.D})`);
  if (bare[3]) card.area = valueOf(bare[3], d);
  if (bare.length > 4) reportExtra(bare.slice(4), 'value', d);
  return card;
}

function buildMosfet(raw: RawCard, span: Span, d: Diagnostics): MosfetCard {
  const { bare, card } = modelledCard(raw, span, d, 'mosfet', 4, `drain, gate, source, bulk and a model (${ELEMENT_SYNTAX.M})`);
  if (bare.length > 5) reportExtra(bare.slice(5), 'value', d);
  return card;
}

/** A device card whose nodes are followed by a model name: the part diodes and MOSFETs share. */
function modelledCard<K extends 'diode' | 'mosfet'>(raw: RawCard, span: Span, d: Diagnostics, kind: K, nodeCount: number, needs: string) {
  const { bare, params, groups } = sortArgs(raw.args, d);
  reportGroups(groups, kind === 'diode' ? 'a diode card' : 'a MOSFET card', d);
  const name = nameOf(raw.head);
  const nodeNames = nodes(bare, nodeCount, d);
  const card = { kind, name, nodes: nodeNames, params, span, model: wordName(bare[nodeCount], 'a model name', d) } as Extract<DiodeCard | MosfetCard, { kind: K }>;
  if (!bare[nodeCount]) reportShort(raw.head, raw.args, `${raw.head.image} needs ${needs}`, d);
  return { bare, card };
}

function buildSource(raw: RawCard, span: Span, letter: 'V' | 'I', d: Diagnostics): SourceCard {
  const card: SourceCard = { kind: 'source', letter, name: nameOf(raw.head), nodes: [], params: [], span };
  const rest = [...raw.args];
  for (let next = rest[0]; card.nodes.length < 2 && next?.kind === 'word'; next = rest[0]) {
    card.nodes.push(nameOf(next.token));
    rest.shift();
  }
  if (card.nodes.length < 2) reportShort(raw.head, raw.args, `${raw.head.image} needs two nodes (${ELEMENT_SYNTAX[letter]})`, d);
  while (rest.length) {
    const arg = rest.shift()!;
    const word = arg.kind === 'word' ? arg.token.image.toLowerCase() : '';
    if (arg.kind === 'param') card.params.push(paramOf(arg, d));
    else if (arg.kind === 'group') card.waveform = callOf(arg, d);
    else if (word === 'dc' && rest[0] && rest[0].kind !== 'param') card.dc = valueOf(rest.shift()!, d);
    else if (word === 'ac' && rest[0] && rest[0].kind !== 'param') {
      card.acMagnitude = valueOf(rest.shift()!, d);
      if (rest[0] && (rest[0].kind === 'expr' || (rest[0].kind === 'word' && readNumber(rest[0].token.image)))) card.acPhase = valueOf(rest.shift()!, d);
    } else if (card.dc === undefined && arg.kind !== 'path') card.dc = valueOf(arg, d);
    else reportExtra([arg], 'value', d);
  }
  card.nodes = exact(card.nodes);
  card.params = exact(card.params);
  return card;
}

function callOf(group: Extract<RawArg, { kind: 'group' }>, d: Diagnostics): FunctionCall {
  const args = group.args.flatMap((a) => (a.kind === 'word' || a.kind === 'expr' ? (valueOf(a, d) ?? []) : []));
  const name = group.name ? nameOf(group.name) : { text: '', span: { start: group.open.startOffset, end: group.open.startOffset } };
  return { name, args, span: spanOf(group) };
}

function buildInstance(raw: RawCard, span: Span, d: Diagnostics): InstanceCard {
  const { bare, params, groups } = sortArgs(raw.args, d);
  reportGroups(groups, 'a subcircuit instance', d);
  const words = bare.flatMap((a) => wordName(a, 'a node or subcircuit name', d) ?? []);
  const name = nameOf(raw.head);
  const card: InstanceCard = { kind: 'instance', name, nodes: words.length > 1 ? words.slice(0, -1) : NONE, params, span, subckt: words[words.length - 1] };
  if (!card.subckt) reportShort(raw.head, raw.args, `${raw.head.image} needs nodes and a subcircuit name (${ELEMENT_SYNTAX.X})`, d);
  return card;
}

/** Builds an element card from its letter; unknown letters become opaque cards with a hint. */
export function buildElement(raw: RawCard, span: Span, d: Diagnostics): Card {
  const letter = raw.head.image.charAt(0).toUpperCase();
  switch (letter) {
    case 'R': case 'C': case 'L': return buildPassive(raw, span, letter, d);
    case 'D': return buildDiode(raw, span, d);
    case 'M': return buildMosfet(raw, span, d);
    case 'V': case 'I': return buildSource(raw, span, letter, d);
    case 'X': return buildInstance(raw, span, d);
    case 'K': {
      const { bare, groups } = sortArgs(raw.args, d);
      reportGroups(groups, 'a coupling card', d);
      const inductors = exact(bare.slice(0, -1).flatMap((a) => wordName(a, 'an inductor name', d) ?? []));
      if (inductors.length < 2) reportShort(raw.head, raw.args, `${raw.head.image} needs two inductors and a coefficient (${ELEMENT_SYNTAX.K})`, d);
      const last = bare[bare.length - 1];
      return { kind: 'coupling', name: nameOf(raw.head), inductors, coefficient: last && inductors.length >= 2 ? valueOf(last, d) : undefined, span };
    }
    default: {
      d.push({ span: nameOf(raw.head).span, severity: 'hint', code: 'unknown-element', message: `element letter '${letter}' is not modelled here; the card is kept but not analysed` });
      const words = exact(raw.args.flatMap((a) => (a.kind === 'word' ? [nameOf(a.token)] : [])));
      return { kind: 'opaque', name: nameOf(raw.head), words, span };
    }
  }
}

export { sortArgs, wordName, reportExtra, reportShort, spanOf };
