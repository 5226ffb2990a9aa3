/**
 * The flat circuit: every element of a netlist hierarchy with hierarchical names (`X1.D3`),
 * canonical node names, evaluated values, and the origin of each card and terminal so that a
 * finding can point at the right text in the right file. Plain data.
 */
import type { Directive, Netlist, Span } from '../../../grammar/src/index';
import type { Finding, Place } from '../findings/index';
import type { ReadRefusal } from './file-text';

export type { Place } from '../findings/index';

/** One `X` card on the way from the root file down to an element. */
export interface InstanceStep {
  /** Instance name as written (`X1`). */
  name: string;
  /** Lowercase subcircuit name. */
  subckt: string;
  uri: string;
  /** Span of the whole X card. */
  span: Span;
  nameSpan: Span;
}

/** Where a flat element came from. */
export interface Origin {
  /** The file holding the element's card (a subcircuit's file for an element inside one). */
  uri: string;
  /** Span of the card. */
  span: Span;
  nameSpan: Span;
  /** The X cards from the root file down to the element's scope; empty at top level. */
  chain: InstanceStep[];
}

/** One terminal of an element: the flat node it connects to and the node name as written. */
export interface Terminal {
  /** Canonical flat node: lowercase, `0` for ground, `x1.n` inside an instance. */
  node: string;
  /** The node name as written in the card, and where. */
  text: string;
  uri: string;
  span: Span;
}

/** A `SIN(VO VA FREQ TD THETA PHASE)` waveform with SPICE defaults filled in. */
export interface SineWave {
  offset: number;
  amplitude: number;
  /** Undefined when the card leaves it out (SPICE then uses 1/TSTOP, which we do not know). */
  freqHz?: number;
  delayS: number;
  dampingPerS: number;
  phaseDeg: number;
}

interface ElementBase {
  /** Hierarchical name as written (`X1.D3`). */
  name: string;
  /** Lowercase hierarchical name: the identity of the element. */
  key: string;
  terminals: Terminal[];
  origin: Origin;
  /** Evaluated `name=value` parameters of the card, lowercase names. */
  params: Record<string, number>;
}

export interface PassiveElement extends ElementBase {
  kind: 'resistor' | 'capacitor' | 'inductor';
  /** Ω, F or H; undefined when the value could not be evaluated. */
  value?: number;
}

export interface DiodeElement extends ElementBase {
  kind: 'diode';
  /** Key into `FlatCircuit.models`. Terminals: anode, cathode. */
  model?: string;
}

export interface MosfetElement extends ElementBase {
  kind: 'mosfet';
  /** Key into `FlatCircuit.models`. Terminals: drain, gate, source, bulk. */
  model?: string;
}

export interface SourceElement extends ElementBase {
  kind: 'vsource' | 'isource';
  /** DC value (V or A); SPICE's default 0 when not written. */
  dc: number;
  acMagnitude?: number;
  sine?: SineWave;
  /** Other waveforms (PULSE, PWL…) by lowercase name, kept but not analysed. */
  otherWaveform?: string;
}

export interface CouplingElement extends ElementBase {
  kind: 'coupling';
  /** Keys of the coupled inductors. */
  inductors: string[];
  coefficient?: number;
}

export interface OpaqueElement extends ElementBase {
  kind: 'opaque';
}

export type FlatElement = PassiveElement | DiodeElement | MosfetElement | SourceElement | CouplingElement | OpaqueElement;

/** An X instance; `resolved` false when its subcircuit is not defined (a black box). */
export interface FlatInstance {
  name: string;
  key: string;
  subckt: string;
  /** Port nodes in card order. */
  terminals: Terminal[];
  origin: Origin;
  resolved: boolean;
  params: Record<string, number>;
}

/** A `.model` card with evaluated parameters. */
export interface FlatModel {
  /** Name as written. */
  name: string;
  /** Lowercase type (`d`, `nmos`, `pmos`…). */
  type: string;
  params: Record<string, number>;
  uri: string;
  span: Span;
}

/** A directive with the file it came from. */
export interface PlacedDirective {
  uri: string;
  directive: Directive;
}

export interface FlatCircuit {
  rootUri: string;
  elements: FlatElement[];
  instances: FlatInstance[];
  /** By key: a top-level model's lowercase name, or `x1.name` for a model local to a subcircuit. */
  models: ReadonlyMap<string, FlatModel>;
  /** Every directive of every file that took part, in reading order. */
  directives: PlacedDirective[];
  /** Values of the global parameters. */
  globalParams: ReadonlyMap<string, number>;
  /** Every file the root depends on (the root first), for re-analysis when one of them changes. */
  dependencies: string[];
  diagnostics: Finding[];
}

/**
 * Already-parsed files by URI, or a pure lookup; undefined means the file cannot be read, and a
 * refusal says why (see file-text.ts).
 */
export type FileSource = ReadonlyMap<string, Netlist> | ((uri: string) => Netlist | ReadRefusal | undefined);

/**
 * Where a finding about an element belongs: the element's name in its card at top level, or the
 * name of the top-level X card that holds it (the root file is what the user is looking at).
 */
export function anchorOf(origin: Origin): Place {
  const outer = origin.chain[0];
  return outer ? { uri: outer.uri, span: outer.nameSpan } : { uri: origin.uri, span: origin.nameSpan };
}

/** The ground node's canonical name. */
export const GROUND = '0';

/** Whether a node name (any case) is ground: `0` or `gnd`. */
export function isGroundName(name: string): boolean {
  const lower = name.toLowerCase();
  return lower === '0' || lower === 'gnd';
}
