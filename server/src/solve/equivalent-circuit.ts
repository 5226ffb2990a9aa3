/**
 * The equivalent circuit of one recognised rectifier: the contract between recognition
 * (which finds the parts) and the solver (which computes the stresses). Plain data, SI units,
 * temperatures in °C.
 */

/** SPICE diode-model parameters (Berkeley SPICE3 diode model, defaults from its manual). */
export interface DiodeParams {
  isA: number;
  n: number;
  rsOhm: number;
  egEv: number;
  xti: number;
  tnomC: number;
}

/** Defaults of the Berkeley SPICE3 diode model: IS 1e-14 A, N 1, RS 0, EG 1.11 eV, XTI 3, TNOM 27 °C. */
export const SPICE_DIODE_DEFAULTS: Readonly<DiodeParams> = {
  isA: 1e-14,
  n: 1,
  rsOhm: 0,
  egEv: 1.11,
  xti: 3,
  tnomC: 27,
};

/**
 * Where a device sits in its rectifier. Bridges: `upper-x` conducts from AC node x into DC+,
 * `lower-x` from DC− into AC node x. Centre tap: one device per half-winding. Doubler: `d1`
 * charges the lower capacitor (or the series capacitor of a half-wave doubler), `d2` the upper.
 */
export type DeviceRole =
  | 'upper-a' | 'upper-b' | 'upper-c'
  | 'lower-a' | 'lower-b' | 'lower-c'
  | 'series'
  | 'winding-a' | 'winding-b'
  | 'd1' | 'd2';

export interface DiodeDevice {
  kind: 'diode';
  name: string;
  role: DeviceRole;
  params: DiodeParams;
  /** Junction-to-ambient thermal resistance, K/W; absent means Tj is not computed from loss. */
  rthjaKPerW?: number;
  /** Part-to-part forward-voltage spread, low and high shift in volts; the corners' part vertex picks one end. */
  vfSpreadV?: [number, number];
}

export interface MosfetDevice {
  kind: 'mosfet';
  name: string;
  role: DeviceRole;
  /** On-resistance at 25 °C. */
  rdsOn25Ohm: number;
  /** rdson(T) = rdson(25 °C)·(T/298.15 K)^exponent. */
  rdsOnTempExponent: number;
  body: DiodeParams;
  rthjaKPerW?: number;
  /** controller: driven while |e(t)| ≥ controller vmin; self-driven: gate on the opposite AC line. */
  gate: 'controller' | 'self-driven' | 'undriven';
  /**
   * Gate-source voltage above which a self-driven channel is taken as fully on (binary gate
   * model). Absent: `DEFAULT_GATE_ON_V` of mosfet-model.ts.
   */
  gateOnV?: number;
}

export type RectifierDevice = DiodeDevice | MosfetDevice;

export type RectifierKind =
  | 'diode-bridge'
  | 'active-bridge'
  | 'hybrid-bridge'
  | 'half-wave'
  | 'centre-tap'
  | 'doubler'
  | 'three-phase-bridge';

/** The AC source as the rectifier sees it (already referred through any transformer). */
export interface AcSource {
  /** Nominal RMS voltage: of the whole winding (bridge, half-wave, doubler), of each half-winding (centre tap), line-to-neutral (three-phase). */
  vrms: number;
  freqHz: number;
  seriesROhm: number;
  seriesLH: number;
  /** Nominal RMS of the mains feeding the source, before any transformer (for harmonic limits and safety). */
  mainsVrms: number;
  /** Turns ratio secondary/primary (1 without a transformer): source currents are referred back by it. */
  turnsRatio: number;
  /**
   * A transformer's magnetising inductance referred to the rectifier side (k²·L2 of the cantilever
   * model, transformer.ts): its current ∫e·dt/Lm flows in the primary beside the referred load
   * current, so the mains current is their sum. Absent: no transformer (or an ideal one).
   */
  magnetisingLH?: number;
}

/**
 * NTC inrush limiters in the source loop, referred to the rectifier side like the loop's other
 * resistance. The steady state runs with them hot (they run warm: `source.seriesROhm` holds the
 * hot value); a cold start sees the cold value, a hot restart the hot one (inrush-cases.ts).
 */
export interface InrushLimiter {
  names: string[];
  /** Cold resistance: the card value, at 25 °C (common practice for an NTC's nominal value). */
  coldROhm: number;
  /** Hot resistance, from the `hot=` rating; part of `source.seriesROhm`. */
  hotROhm: number;
}

export interface FilterCapacitor {
  name: string;
  /** Nominal capacitance. */
  cF: number;
  esrOhm: number;
  /** Smallest capacitance: tolerance and loss over life (absent: the nominal). */
  cMinF?: number;
  /** Largest capacitance: a new part at the top of its tolerance (absent: the nominal). */
  cMaxF?: number;
  /** ESR at end of life or cold, rated ESR times its rise plus any series resistor (absent: `esrOhm`). */
  esrAgedOhm?: number;
}

export type Load =
  | { kind: 'resistance'; ohm: number }
  | { kind: 'current'; a: number }
  | { kind: 'power'; w: number; vminV?: number }
  | { kind: 'none' };

export interface EquivalentCircuit {
  kind: RectifierKind;
  /** Doubler only: full-wave (two diodes, two capacitors in series) or half-wave (series capacitor then peak detector). */
  doubler?: 'full-wave' | 'half-wave';
  source: AcSource;
  devices: RectifierDevice[];
  /** Bridges, half-wave, centre tap, three-phase: at most one (parallel capacitors merged). Doubler: [lower or series, upper or output]. */
  capacitors: FilterCapacitor[];
  load: Load;
  /**
   * Resistors and DC current sources drawn across the output when a `*@ load` directive gives
   * the load: they draw in addition to it (a bleeder), at every corner and every load level.
   */
  fixedLoad?: FixedLoad;
  /** Active bridge: the controller's minimum operating voltage. */
  controllerVminV?: number;
  /** Active bridge: the controller's quiescent draw from the output (its supply), counted as loss. */
  controllerSupply?: ControllerSupply;
  /** NTC inrush limiters in the source loop, when any is rated with a hot resistance. */
  inrushLimiter?: InrushLimiter;
  /** A choke in the DC path between the rectifier and its filter capacitor (bridges only). */
  choke?: DcChoke;
}

/** A series inductor between a bridge's output and its filter capacitor, with its winding resistance. */
export interface DcChoke {
  names: string[];
  lH: number;
  rOhm: number;
}

/**
 * A controller's quiescent current as a straight line in its supply voltage, Iq(v) = iA + v/ohm
 * (the line through two rated points, or a constant). It is drawn from the output like a fixed
 * load, so its power, i0·v̄ + v_rms²/R over a period, is the controller's loss, not output.
 */
export interface ControllerSupply {
  iA: number;
  /** Absent: a constant current. */
  ohm?: number;
}

/** Parts always across the output beside the load: a resistance (parallel resistors merged) and a drawn current. */
export interface FixedLoad {
  ohm?: number;
  a?: number;
}

/**
 * Which end of each part's spread a corner takes (corners.ts says why per corner): the smallest
 * or largest capacitance, the aged or nominal ESR, the low or high forward voltage.
 */
export interface PartVertex {
  capacitance: 'min' | 'max';
  esr: 'nominal' | 'aged';
  vf: 'low' | 'high';
}

/** One operating corner: line, ambient, and where given line frequency, load level and part vertex. */
export interface Corner {
  name: string;
  /** Multiplier on the nominal source voltage (1 + tolerance; a universal input's ends relative to its nominal). */
  lineScale: number;
  ambientC: number;
  /** Line frequency at this corner; absent: the source's own. */
  freqHz?: number;
  /** The load this corner is solved at, replacing the circuit's own; absent: the circuit's load (its full end). */
  load?: Load;
  /** The end of a load range this corner takes; absent when the load is a single value. */
  loadLevel?: 'full' | 'light';
  /** Part-tolerance vertex; absent: nominal parts. */
  parts?: PartVertex;
}
