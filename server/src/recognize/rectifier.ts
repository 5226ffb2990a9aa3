/**
 * What recognition finds: rectifiers with their devices, nodes and surroundings, and near misses.
 * Plain data; node names are the flat circuit's canonical nodes.
 */
import type { MainsDirective } from '../../../grammar/src/index';
import type { Origin, Place } from '../circuit/index';
import type { Finding, Fix } from '../findings/index';
import type { AcSource, DeviceRole, Load, RectifierKind } from '../solve/equivalent-circuit';

/** How a MOSFET's gate is driven. */
export type GateDrive = 'controller' | 'self-driven' | 'undriven';

/** One device of a rectifier, with its forward direction (a MOSFET's is its body diode's). */
export interface RectifierDeviceRef {
  /** Hierarchical name as written (`X1.D3`) and its lowercase key. */
  name: string;
  key: string;
  type: 'diode' | 'mosfet';
  role: DeviceRole;
  anode: string;
  cathode: string;
  /** Key of the device's model in the flat circuit, if it has one. */
  model?: string;
  origin: Origin;
  /** MOSFETs only. */
  channel?: 'n' | 'p';
  gateNode?: string;
  gate?: GateDrive;
  /** Names of the sources and X instances that drive the gate (gate: controller). */
  controllers?: { name: string; subckt?: string }[];
}

/** A transformer found from `K` coupling, by the cantilever model of two coupled inductors. */
export interface TransformerFinding {
  coupling: string;
  primary: string;
  secondary: string;
  k: number;
  primaryH: number;
  secondaryH: number;
  /** √(L2/L1). */
  turnsRatio: number;
  /** k·√(L2/L1) = M/L1: the open-circuit voltage ratio, and the ideal ratio of the cantilever model. */
  voltageRatio: number;
  /** (1 − k²)·L2: the leakage seen from the secondary. */
  leakageH: number;
}

/** The AC source as the rectifier sees it, referred through any transformer. */
export interface SourceFinding extends AcSource {
  /** Names of the sources, resistors, inductors and windings in the loop. */
  elements: string[];
  transformer?: TransformerFinding;
  /** The `*@ mains` directive that set the line voltage, if any (with its tolerance). */
  mains?: MainsDirective;
  /** True when no source was found and one was assumed. */
  assumed: boolean;
  /** The resistors in the loop, each with the factor that refers it to the rectifier side (1, or the turns ratio squared). */
  seriesResistors?: { name: string; ohm: number; referral: number }[];
}

/**
 * Filter capacitors across the output, merged into one: the parallel capacitors across it
 * (`members`) and any series strings beside them (`strings`). `cF` and `esrOhm` are the whole
 * group's (a string counts as its series equivalent); `names` lists every capacitor.
 */
export interface CapacitorFinding {
  names: string[];
  cF: number;
  esrOhm: number;
  /** Resistors taken as series ESR. */
  esrResistors: string[];
  /** The capacitors directly across the output, each with its own series resistor (ESR) when drawn. */
  members?: CapacitorMember[];
  /** Series strings across the output (recognize/capacitor-strings.ts). */
  strings?: CapacitorString[];
}

/** Capacitors in series across the output, from the slot's first node to its second. */
export interface CapacitorString {
  /** The nodes from end to end: the slot's two nodes and the internal nodes between. */
  nodes: string[];
  stages: CapacitorStage[];
}

/** One stage of a string: parallel capacitors between two of its nodes, and the resistors across them. */
export interface CapacitorStage {
  members: CapacitorMember[];
  /** Balancing resistors across the stage (none: leakage alone sets its DC voltage). */
  balancing: { name: string; ohm: number }[];
}

export interface CapacitorMember {
  name: string;
  cF: number;
  esrOhm: number;
  /** The resistor drawn in series, taken as ESR. */
  esr?: string;
}

/**
 * The load. With a `*@ load` directive, `elements` are the parts drawn across the output beside
 * it, summed in `fixed`, and `light` is the light end of a load range.
 */
export type LoadFinding = Load & { elements: string[]; fromDirective: boolean; light?: Load; fixed?: { ohm?: number; a?: number; elements: string[] } };

export interface Surroundings {
  source: SourceFinding;
  /** Bridges, half-wave, centre tap, three-phase: at most one. Doubler: [lower or series, upper or output]. */
  capacitors: CapacitorFinding[];
  load: LoadFinding;
  /** A DC choke between the output rail and the filter capacitor (dc-choke.ts). */
  choke?: ChokeFinding;
}

/** A series inductor in the DC path between a rectifier and its filter capacitor. */
export interface ChokeFinding {
  names: string[];
  lH: number;
  /** Winding resistance drawn with it (0 when none is drawn). */
  rOhm: number;
}

export interface Rectifier {
  /** Stable id: the kind and the first device's key (`diode-bridge:x1.d1`). */
  id: string;
  kind: RectifierKind;
  doubler?: 'full-wave' | 'half-wave';
  /** A bridge of diodes and MOSFETs that is not the hybrid pattern. */
  mixed?: boolean;
  devices: RectifierDeviceRef[];
  /** Bridge: [a, b]; three-phase: [a, b, c]; centre tap: the winding ends; doubler: [line, midpoint or return]; half-wave: [line, return]. */
  acNodes: string[];
  dcPositive: string;
  dcNegative: string;
  /** Centre tap: the tap node. */
  tap?: string;
  /** Where code lenses and findings about the whole rectifier go (the first device, or its top-level X card). */
  anchor: Place;
  surroundings: Surroundings;
}

/** A would-be bridge with one reversed device: it shorts the source on one half-cycle. */
export interface NearMiss {
  kind: 'reversed-device';
  devices: RectifierDeviceRef[];
  reversed: RectifierDeviceRef;
  acNodes: string[];
  dcPositive: string;
  dcNegative: string;
  anchor: Place;
  /** Swaps the reversed device's anode and cathode (drain and source) in its card. */
  fix: Fix;
}

export interface Recognition {
  rectifiers: Rectifier[];
  nearMisses: NearMiss[];
  diagnostics: Finding[];
}
