/**
 * Typed records of the `*@` directives (our own; they live in comments so the file stays valid
 * for any simulator). Values are SI numbers; temperatures °C; fractions for percentages.
 */
import type { Name, Span } from './syntax-tree';

export interface MainsDirective {
  keyword: 'mains';
  span: Span;
  /** RMS volts: line-to-neutral for one phase, line-to-line when `phases` is 3. The highest of a range. */
  vrms?: number;
  /** A universal input `100V..240V`: the lowest and highest nominal; `vrms` is the highest. */
  vrmsRange?: [number, number];
  /** The first frequency written; with several (`50Hz,60Hz`), `freqsHz` lists them all, ascending. */
  freqHz?: number;
  freqsHz?: number[];
  /** Line tolerance as fractions, e.g. −0.15 and +0.10. */
  tolLow?: number;
  tolHigh?: number;
  phases?: 1 | 3;
}

export interface AmbientDirective {
  keyword: 'ambient';
  span: Span;
  nominalC?: number;
  maxC?: number;
}

export type LoadSpec =
  | { kind: 'power'; w: number }
  | { kind: 'current'; a: number }
  | { kind: 'resistance'; ohm: number };

export interface LoadDirective {
  keyword: 'load';
  span: Span;
  load?: LoadSpec;
  /** A range `0.2W..12W`: `load` is the full end (most power or current, least resistance), this the light end. */
  lightLoad?: LoadSpec;
  /** Lowest output voltage the load works down to (for hold-up time). */
  vminV?: number;
}

/** Rating keys (IEC 60747 / JEDEC symbols, lowercase). */
export const RATING_KEYS = [
  'vrrm', 'ifav', 'ifsm', 'tjmax', 'rthja', 'vf',
  'vds', 'id', 'rdson', 'vsd',
  'vrated', 'iripple', 'esr',
  'vmin', 'iq',
  'cost',
  'vmax',
  'tol', 'life', 'esrlife', 'vfspread',
  'hot', 'endurance', 'rth',
] as const;
export type RatingKey = (typeof RATING_KEYS)[number];

export interface ForwardPoint {
  vV: number;
  iA: number;
}

export interface RatingEntry {
  key: RatingKey;
  span: Span;
  /** Scalar value (absent for `vf`, which carries points). */
  value?: number;
  /** `vf=0.93V@1A,0.78V@0.1A`; for `iq` the current at each supply voltage (`iq=40uA@8V,300uA@60V`). */
  points?: ForwardPoint[];
  /** `ifsm=30A@10ms`: the surge duration the rating is given for. */
  durationS?: number;
  /** `endurance=5000h@105C`: the temperature the rated life is given at. */
  atC?: number;
  /** A two-sided spread, low then high (`tol=-20%,+20%` as fractions, `vfspread=-0.05V,+0.1V`); `value` is absent. */
  range?: [number, number];
}

export interface RateDirective {
  keyword: 'rate';
  span: Span;
  /** A model name or an instance name. */
  target?: Name;
  entries: RatingEntry[];
}

export const DERATE_KEYS = ['vr', 'if', 'ifsm', 'tj', 'cap', 'ripple', 'vds', 'id', 'life'] as const;
export type DerateKey = (typeof DERATE_KEYS)[number];

export interface DerateEntry {
  key: DerateKey;
  span: Span;
  /** A fraction of the rating (`vr=80%` → 0.8); for `tj` a temperature in °C; for `life` hours. */
  value: number;
}

export interface DerateDirective {
  keyword: 'derate';
  span: Span;
  entries: DerateEntry[];
}

export interface AllowDirective {
  keyword: 'allow';
  span: Span;
  codes: Name[];
}

/** `*@ profile hours=4000h years=10 price=0.25`: how long the product runs and what its energy costs, for the comparison. */
export interface ProfileDirective {
  keyword: 'profile';
  span: Span;
  /** Operating hours per year. */
  hoursPerYear?: number;
  years?: number;
  /** Price of one kWh, in the file's own currency (the one its `cost=` ratings use). */
  pricePerKwh?: number;
}

export const PROFILE_KEYS = ['hours', 'years', 'price'] as const;

export type Directive = MainsDirective | AmbientDirective | LoadDirective | RateDirective | DerateDirective | AllowDirective | ProfileDirective;

export const DIRECTIVE_KEYWORDS = ['mains', 'ambient', 'load', 'rate', 'derate', 'allow', 'profile'] as const;
