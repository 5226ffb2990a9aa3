/**
 * The syntax tree of a netlist. Every node carries its exact source range (character offsets
 * into the text it was parsed from, end exclusive). Fields that error recovery may drop are
 * optional, so a half-typed card still produces a node.
 */
import type { Directive } from './directive-records';
import type { Expr } from './expression';

export interface Span {
  start: number;
  end: number;
}

export type Severity = 'error' | 'warning' | 'info' | 'hint';

/** A finding about the text itself (syntax, values, directives, parameters). */
export interface SyntaxDiagnostic {
  span: Span;
  severity: Severity;
  /** Stable lowercase code, e.g. `syntax-error`, `value-notation`. */
  code: string;
  message: string;
}

/** A word as written (original case); compare names with `key()`. */
export interface Name {
  text: string;
  span: Span;
}

/** A value as written: a number with scale suffix, a `{…}`/`'…'` expression, or a bare parameter name. */
export interface Value {
  text: string;
  span: Span;
  form: 'number' | 'expression' | 'identifier';
  /** The number, for `form: 'number'` when it could be read. */
  number?: number;
  /** The parsed expression, for `expression` and `identifier` forms when it could be parsed. */
  expr?: Expr;
}

/** `name=value`, or a bare flag word in a parameter list (value absent). */
export interface Param {
  name: Name;
  value?: Value;
  span: Span;
}

/** `SIN(0 325 50)` and the like. */
export interface FunctionCall {
  name: Name;
  args: Value[];
  span: Span;
}

interface CardBase {
  span: Span;
}

export interface PassiveCard extends CardBase {
  kind: 'passive';
  letter: 'R' | 'C' | 'L';
  name: Name;
  nodes: Name[];
  value?: Value;
  params: Param[];
}

export interface DiodeCard extends CardBase {
  kind: 'diode';
  name: Name;
  nodes: Name[];
  model?: Name;
  area?: Value;
  params: Param[];
}

export interface MosfetCard extends CardBase {
  kind: 'mosfet';
  name: Name;
  nodes: Name[];
  model?: Name;
  params: Param[];
}

export interface SourceCard extends CardBase {
  kind: 'source';
  letter: 'V' | 'I';
  name: Name;
  nodes: Name[];
  dc?: Value;
  acMagnitude?: Value;
  acPhase?: Value;
  waveform?: FunctionCall;
  params: Param[];
}

export interface CouplingCard extends CardBase {
  kind: 'coupling';
  name: Name;
  inductors: Name[];
  coefficient?: Value;
}

export interface InstanceCard extends CardBase {
  kind: 'instance';
  name: Name;
  nodes: Name[];
  subckt?: Name;
  params: Param[];
}

/** An element whose letter this subset does not model; kept so nothing is lost. */
export interface OpaqueCard extends CardBase {
  kind: 'opaque';
  name: Name;
  words: Name[];
}

export interface ModelCard extends CardBase {
  kind: 'model';
  keyword: Name;
  name?: Name;
  type?: Name;
  params: Param[];
}

export interface SubcktCard extends CardBase {
  kind: 'subckt';
  keyword: Name;
  name?: Name;
  ports: Name[];
  params: Param[];
}

export interface EndsCard extends CardBase {
  kind: 'ends';
  keyword: Name;
  name?: Name;
}

export interface ParamCard extends CardBase {
  kind: 'param';
  keyword: Name;
  params: Param[];
}

export interface IncludeCard extends CardBase {
  kind: 'include';
  keyword: Name;
  /** The path as written, without quotes. */
  path?: Name;
}

/** `.lib "file" section` (a reference) or `.lib section` (the start of a section in a library file). */
export interface LibCard extends CardBase {
  kind: 'lib';
  keyword: Name;
  path?: Name;
  section?: Name;
}

export interface EndlCard extends CardBase {
  kind: 'endl';
  keyword: Name;
}

export interface EndCard extends CardBase {
  kind: 'end';
  keyword: Name;
}

/** Any other dot card (`.tran`, `.op`, `.options`…): kept, not analysed. */
export interface ControlCard extends CardBase {
  kind: 'control';
  keyword: Name;
  words: Name[];
}

export interface DirectiveCard extends CardBase {
  kind: 'directive';
  directive?: Directive;
}

export interface TitleCard extends CardBase {
  kind: 'title';
  text: string;
}

export type ElementCard = PassiveCard | DiodeCard | MosfetCard | SourceCard | CouplingCard | InstanceCard | OpaqueCard;

export type Card =
  | ElementCard
  | ModelCard
  | SubcktCard
  | EndsCard
  | ParamCard
  | IncludeCard
  | LibCard
  | EndlCard
  | EndCard
  | ControlCard
  | DirectiveCard
  | TitleCard;

/** A `.subckt … .ends` block with its body, nested as written. */
export interface SubcktBlock {
  kind: 'subckt-block';
  header: SubcktCard;
  body: Item[];
  ends?: EndsCard;
  span: Span;
}

/** A `.lib section … .endl` block in a library file. */
export interface LibSectionBlock {
  kind: 'lib-section';
  header: LibCard;
  body: Item[];
  endl?: EndlCard;
  span: Span;
}

export type Item = Card | SubcktBlock | LibSectionBlock;

export interface Netlist {
  text: string;
  title?: TitleCard;
  /** Every card in source order (directives included), whatever block it sits in. */
  cards: Card[];
  /** The top level, with `.subckt` and `.lib` sections nested. */
  items: Item[];
  /** Full-line and trailing comments (directives excluded). */
  comments: Span[];
  diagnostics: SyntaxDiagnostic[];
}

/** Case-insensitive identity of a name. */
export function key(name: Name | string): string {
  return (typeof name === 'string' ? name : name.text).toLowerCase();
}
