/**
 * Rating records per part kind. Every value carries its origin, so a hint can say where a number
 * came from and how far to trust it (a directive the user wrote, a parts-file entry, a catalog
 * entry with its source, or the `.model BV` fallback). SI units, temperatures in °C.
 */
import type { ForwardPoint, Span } from '../../../grammar/src/index';

export type { ForwardPoint } from '../../../grammar/src/index';

/** How far a catalog value can be trusted, in the terms of REFERENCES.md. */
export type Confidence =
  /** Confirmed in a published, non-manufacturer source. */
  | 'confirmed'
  /** Only weak or non-authoritative sources agree; usable, but say so. */
  | 'weak'
  /** Recalled without a source: a typical class value, never a check value. */
  | 'from-memory'
  /** A value of our own choosing (e.g. a generic forward curve for the class). */
  | 'chosen';

/** Where a rating value came from. */
export type RatingOrigin =
  | {
      kind: 'rate-directive';
      /** Whether the directive named the instance or its model. */
      target: 'instance' | 'model';
      /** The directive's target as written. */
      targetName: string;
      uri: string;
      /** Span of the `key=value` word in the directive. */
      span: Span;
    }
  | {
      kind: 'parts-file';
      uri: string;
      partName: string;
      /** JSON pointer of the field, e.g. `/parts/3/vrrmV`. */
      pointer: string;
    }
  | {
      kind: 'catalog';
      partName: string;
      /** The source of this value, in words (a reference, "from memory", or "our own choice"). */
      source: string;
      confidence: Confidence;
    }
  | {
      kind: 'model-param';
      /** Lowercase SPICE parameter name, e.g. `bv`. */
      param: string;
      modelName: string;
      uri: string;
      span: Span;
      /** Why this parameter stands in for a rating; shown in the hint. */
      note: string;
    }
  | {
      kind: 'default';
      /** What the default is and where it comes from. */
      text: string;
    };

/** A value with its origin. */
export interface Rated<T> {
  value: T;
  origin: RatingOrigin;
}

/**
 * Diode construction, which decides the forward drop, the temperature law and which reverse
 * voltages are available. `sic-schottky` is kept apart from `schottky` because silicon-carbide
 * Schottky rectifiers are made for mains-class voltages and silicon ones are not.
 */
export const DIODE_TECHNOLOGIES = ['silicon', 'fast', 'ultrafast', 'schottky', 'sic-schottky'] as const;
export type DiodeTechnology = (typeof DIODE_TECHNOLOGIES)[number];

/** The part kinds that carry ratings. */
export const PART_KINDS = ['diode', 'mosfet', 'capacitor', 'controller'] as const;
export type PartKind = (typeof PART_KINDS)[number];

/** Ratings of a rectifier diode (IEC 60747 / JEDEC symbols). */
export interface DiodeRatings {
  kind: 'diode';
  /** Repetitive peak reverse voltage. */
  vrrmV?: Rated<number>;
  /** Average forward current. */
  ifavA?: Rated<number>;
  /** Non-repetitive surge current, one half-sine of `ifsmDurationS`. */
  ifsmA?: Rated<number>;
  /** The half-sine duration IFSM is rated for; 8.3 ms unless the part says otherwise. */
  ifsmDurationS?: Rated<number>;
  tjmaxC?: Rated<number>;
  /** Junction-to-ambient thermal resistance. */
  rthjaKPerW?: Rated<number>;
  /** Forward points from which a model is fitted when the `.model` has no parameters. */
  vfPoints?: Rated<readonly ForwardPoint[]>;
  technology?: Rated<DiodeTechnology>;
  /** Part-to-part spread of the forward voltage, low and high shift in volts (`vfspread=`, a key of our own). */
  vfSpreadV?: Rated<readonly [number, number]>;
  cost?: Rated<number>;
}

/** Ratings of a MOSFET used as a rectifier switch. */
export interface MosfetRatings {
  kind: 'mosfet';
  vdsV?: Rated<number>;
  idA?: Rated<number>;
  rdsonOhm?: Rated<number>;
  tjmaxC?: Rated<number>;
  rthjaKPerW?: Rated<number>;
  /** Body-diode forward voltage. */
  vsdV?: Rated<number>;
  cost?: Rated<number>;
}

/** Ratings of a filter capacitor. */
export interface CapacitorRatings {
  kind: 'capacitor';
  vratedV?: Rated<number>;
  /** Rated ripple current (RMS). */
  iRippleA?: Rated<number>;
  esrOhm?: Rated<number>;
  /** Capacitance tolerance as fractions, low and high (`tol=-20%,+20%`). */
  capTolerance?: Rated<readonly [number, number]>;
  /** Capacitance lost over life as a fraction ≤ 0 (`life=-20%`). */
  capLifeLoss?: Rated<number>;
  /** Factor the rated ESR rises by at end of life or cold (`esrlife=2`). */
  esrLifeFactor?: Rated<number>;
  /** Rated life at a core temperature (`endurance=5000h@105C`): the endurance the part is rated for. */
  endurance?: Rated<CapacitorEndurance>;
  /** Thermal resistance from the capacitor's core to the ambient (`rth=`), K/W. */
  rthKPerW?: Rated<number>;
  cost?: Rated<number>;
}

/** A capacitor's rated life: hours at a core temperature. */
export interface CapacitorEndurance {
  hours: number;
  atC: number;
}

/** Ratings of a synchronous-rectifier controller. */
export interface ControllerRatings {
  kind: 'controller';
  /** Minimum supply voltage at which it drives the gates. */
  vminV?: Rated<number>;
  /** Quiescent current. */
  iqA?: Rated<number>;
  /** Quiescent current at two supply voltages (`iq=40uA@8V,300uA@60V`), in place of `iqA`. */
  iqPoints?: Rated<{ vV: number; iA: number }[]>;
  /** Maximum supply (input) voltage. */
  vmaxV?: Rated<number>;
  cost?: Rated<number>;
}

export type PartRatings = DiodeRatings | MosfetRatings | CapacitorRatings | ControllerRatings;

/** The ratings record type of one part kind. */
export type RatingsOf<K extends PartKind> = Extract<PartRatings, { kind: K }>;

/**
 * A SPICE diode model (IS, N, RS, EG, XTI; Berkeley SPICE3 diode model) suggested for a part
 * whose `.model` carries no parameters, with the reason it may be trusted as far as it may.
 */
export type ForwardModel = Record<ForwardModelParameter, number> & {
  /** Where the fit comes from, for the hint. */
  note: string;
};

/** The SPICE3 diode parameters a fit gives (IS A, N, RS Ω, EG eV, XTI, TNOM °C); the solver's `DiodeParams` has the same fields. */
export type ForwardModelParameter = 'isA' | 'n' | 'rsOhm' | 'egEv' | 'xti' | 'tnomC';

/** A part that may be offered by a quick fix: its name, where it is described, its ratings. */
export interface DiodePart {
  /** The name a `.model` card would use for it. */
  name: string;
  ratings: DiodeRatings;
  forwardModel?: ForwardModel;
}
