/**
 * The one implementation of "does this part pass every stress rule": a device's worst-case
 * figures against its ratings under the derating policy, one verdict per stress. The rules report
 * the verdicts, the quick fixes and part selection keep a part only when every verdict passes,
 * the `rate` templates and the minimum ratings of a replacement invert the same table, and the
 * topology comparison picks its catalog parts with it.
 *
 * Severity: beyond the rating itself the part is outside what its maker guarantees (error);
 * beyond only the policy's fraction it lacks the margin the policy asks for (warning). The surge
 * is judged twice (REFERENCES.md §5, D): its peak against IFSM, and its ∫i²dt against the
 * rating's I²t over the rated pulse, IFSM²·t_rated/2 (a half-sine of t_rated, 8.3 ms unless the
 * part says otherwise). The policy's `ifsm` fraction applies to the current, so to the I²t
 * squared. Whichever uses more of its rating, compared as currents (the peak, and the half-sine
 * peak √(2·I²t/t_rated) of the same I²t), binds. An I²t beyond the rating's is an error (energy
 * the part is not rated to absorb); a peak beyond IFSM with the I²t inside is a warning (a short
 * spike: holding its peak to IFSM is the conservative common practice). The junction is held to
 * `junctionLimitC` of the policy; beyond Tjmax itself is an error.
 */
import { junctionLimitC, type DeratingPolicy } from './derating-policy';
import { DEFAULT_IFSM_DURATION_S } from './rating-origin';
import type { DiodeRatings, MosfetRatings } from './rating-records';
import { equivalentSurgeA, halfSineI2tA2s } from './surge-rating';

export type StressKind = 'reverse-voltage' | 'vds' | 'average-current' | 'drain-current' | 'surge' | 'junction-temperature';

/** A worst-case figure: its value (and, from the solver, the corner that gave it). */
export interface StressFigure {
  value: number;
}

/** A device's worst-case figures, as the solver's `DeviceFigures` carry them. */
export interface StressInputs {
  worst?: {
    pivV?: StressFigure;
    iavgA?: StressFigure;
    irmsA?: StressFigure;
    tjC?: StressFigure;
    thermalRunaway?: boolean;
  };
  /**
   * The switch-on surge: its I²t over the half-cycle `durationS`, its peak (`figureA` when no
   * `peakA` is given: a half-sine pulse) and the figure that picked its worst case.
   */
  surge?: { i2tA2s: number; figureA: number; durationS: number; peakA?: number };
  /** Without a thermal resistance the junction is only the ambient and is not judged. */
  rthjaKPerW?: number;
}

/**
 * `pass`, or how it fails: `warning`/`error` (see the file comment), `unrated` when the part
 * states no rating for a stress it sees, `runaway` when its junction temperature does not settle.
 */
export type StressStatus = 'pass' | 'warning' | 'error' | 'unrated' | 'runaway';

export interface StressVerdict {
  stress: StressKind;
  status: StressStatus;
  /** The figure judged (PIV, average or RMS current, surge figure, junction temperature). */
  figure: number;
  /** The rating it is held against (IFSM converted to the surge's length); absent when unrated. */
  rating?: number;
  /** The largest figure the policy allows; absent when unrated. */
  limit?: number;
  /** `limit − figure`: the room left, negative beyond the policy. */
  margin?: number;
  /** Surges only: the I²t the rating allows, IFSM²·t_rated/2. */
  ratedI2tA2s?: number;
  /** Surges only: the two comparisons and which binds. */
  surge?: SurgeJudgement;
}

/** A surge held against IFSM by its peak and against the rated I²t by its ∫i²dt. */
export interface SurgeJudgement {
  peakA: number;
  ifsmA: number;
  /** The pulse length IFSM is rated for. */
  ratedS: number;
  i2tA2s: number;
  ratedI2tA2s: number;
  /** peak / IFSM. */
  peakShare: number;
  /** I²t / rated I²t. */
  i2tShare: number;
  /** The comparison that uses more of its rating, as currents (peak/IFSM against √(I²t share)). */
  binding: 'peak' | 'i2t';
}

type Ratings = DiodeRatings | MosfetRatings;

/** The stresses held as a fraction of one rating: figure ≤ fraction × rating. */
const RATIO_STRESSES: readonly {
  stress: StressKind;
  kind: Ratings['kind'];
  figure: (w: NonNullable<StressInputs['worst']>) => StressFigure | undefined;
  rating: (r: Ratings) => number | undefined;
  fraction: (p: DeratingPolicy) => number;
}[] = [
  { stress: 'reverse-voltage', kind: 'diode', figure: (w) => w.pivV, rating: (r) => (r.kind === 'diode' ? r.vrrmV?.value : undefined), fraction: (p) => p.vr.value },
  { stress: 'vds', kind: 'mosfet', figure: (w) => w.pivV, rating: (r) => (r.kind === 'mosfet' ? r.vdsV?.value : undefined), fraction: (p) => p.vds.value },
  { stress: 'average-current', kind: 'diode', figure: (w) => w.iavgA, rating: (r) => (r.kind === 'diode' ? r.ifavA?.value : undefined), fraction: (p) => p.if.value },
  // ID is a continuous rating, so the RMS current (what heats the channel) is held to it (common practice).
  { stress: 'drain-current', kind: 'mosfet', figure: (w) => w.irmsA, rating: (r) => (r.kind === 'mosfet' ? r.idA?.value : undefined), fraction: (p) => p.id.value },
];

/** Every stress the device sees, judged. A stress without a figure (not computed) has no verdict. */
export function stressVerdicts(inputs: StressInputs, ratings: Ratings, policy: DeratingPolicy): StressVerdict[] {
  const verdicts: StressVerdict[] = [];
  const worst = inputs.worst ?? {};
  for (const s of RATIO_STRESSES) {
    const figure = s.figure(worst)?.value;
    if (s.kind === ratings.kind && figure !== undefined) verdicts.push(ratioVerdict(s.stress, figure, s.rating(ratings), s.fraction(policy)));
  }
  if (ratings.kind === 'diode' && inputs.surge) verdicts.push(surgeVerdict(inputs.surge, ratings, policy));
  const junction = junctionVerdict(inputs, ratings, policy);
  if (junction) verdicts.push(junction);
  return verdicts;
}

/** The verdict of one stress, when the device sees it. */
export function stressVerdict(kind: StressKind, inputs: StressInputs, ratings: Ratings, policy: DeratingPolicy): StressVerdict | undefined {
  return stressVerdicts(inputs, ratings, policy).find((v) => v.stress === kind);
}

/**
 * Whether the part passes every stress rule: figures to judge, and each verdict `pass` (an
 * unrated stress fails: a fix must not guess).
 */
export function passesEveryStress(inputs: StressInputs, ratings: Ratings, policy: DeratingPolicy): boolean {
  return inputs.worst !== undefined && stressVerdicts(inputs, ratings, policy).every((v) => v.status === 'pass');
}

/** Severity of a figure held to `fraction` of `rating`: error beyond the rating, warning beyond the fraction. */
export function ratioSeverity(figure: number, rating: number, fraction: number): 'error' | 'warning' | undefined {
  if (figure > rating) return 'error';
  if (figure > rating * fraction) return 'warning';
  return undefined;
}

/**
 * The least rating that passes each ratio stress, and the least surge a replacement's IFSM must
 * cover: the same table inverted (figure / fraction). Keys are the rating fields.
 */
export function leastPassingRatings(inputs: StressInputs, policy: DeratingPolicy): {
  vrrmV?: number; vdsV?: number; ifavA?: number; idA?: number; surge?: { peakA: number; i2tA2s: number; durationS: number };
} {
  const worst = inputs.worst ?? {};
  const out: ReturnType<typeof leastPassingRatings> = {};
  const fields = { 'reverse-voltage': 'vrrmV', vds: 'vdsV', 'average-current': 'ifavA', 'drain-current': 'idA' } as const;
  for (const s of RATIO_STRESSES) {
    const figure = s.figure(worst)?.value;
    const field = fields[s.stress as keyof typeof fields];
    if (figure !== undefined) out[field] = figure / s.fraction(policy);
  }
  const f = policy.ifsm.value;
  if (inputs.surge) out.surge = { peakA: surgePeakA(inputs.surge) / f, i2tA2s: inputs.surge.i2tA2s / (f * f), durationS: inputs.surge.durationS };
  return out;
}

/** A half-sine pulse as surge inputs: its figure is its peak, its I²t Ip²·t/2 (or `i2tA2s` when given). */
export function halfSineSurge(peakA: number, durationS: number, i2tA2s = halfSineI2tA2s(peakA, durationS)): NonNullable<StressInputs['surge']> {
  return { figureA: peakA, peakA, i2tA2s, durationS };
}

/** The least IFSM, rated for `ratedS`, whose peak and I²t both cover a surge: max(peak, √(2·I²t/t_rated)). */
export function leastIfsmA(surge: { peakA: number; i2tA2s: number }, ratedS: number): number {
  return Math.max(surge.peakA, Math.sqrt((2 * surge.i2tA2s) / ratedS));
}

/** The IFSM rating converted to a pulse length at equal I²t, with the I²t it allows; undefined without an IFSM. */
export function surgeCapability(ratings: DiodeRatings, durationS: number): { ifsmA: number; ratedS: number; equivalentA: number; i2tA2s: number } | undefined {
  const ifsmA = ratings.ifsmA?.value;
  if (ifsmA === undefined) return undefined;
  const ratedS = ratings.ifsmDurationS?.value ?? DEFAULT_IFSM_DURATION_S;
  return { ifsmA, ratedS, equivalentA: equivalentSurgeA(ifsmA, ratedS, durationS), i2tA2s: halfSineI2tA2s(ifsmA, ratedS) };
}

function ratioVerdict(stress: StressKind, figure: number, rating: number | undefined, fraction: number): StressVerdict {
  if (rating === undefined) return { stress, status: 'unrated', figure };
  const limit = rating * fraction;
  return { stress, status: ratioSeverity(figure, rating, fraction) ?? 'pass', figure, rating, limit, margin: limit - figure };
}

function surgePeakA(surge: NonNullable<StressInputs['surge']>): number {
  return surge.peakA ?? surge.figureA;
}

/**
 * The surge's verdict. Its figure is the binding comparison as a current, max(peak, √(2·I²t/t_rated)),
 * held to IFSM times the policy's fraction.
 */
function surgeVerdict(surge: NonNullable<StressInputs['surge']>, ratings: DiodeRatings, policy: DeratingPolicy): StressVerdict {
  const capability = surgeCapability(ratings, surge.durationS);
  const peakA = surgePeakA(surge);
  if (!capability) return { stress: 'surge', status: 'unrated', figure: peakA };
  const { ifsmA, ratedS, i2tA2s: ratedI2tA2s } = capability;
  const peakShare = peakA / ifsmA;
  // The I²t's share as a current first (√(2·I²t/t_rated)/IFSM), so a tiny IFSM's squared rating cannot underflow the comparison.
  const equivalentShare = Math.sqrt((2 * surge.i2tA2s) / ratedS) / ifsmA;
  const i2tShare = equivalentShare ** 2;
  const figure = leastIfsmA({ peakA, i2tA2s: surge.i2tA2s }, ratedS);
  const limit = ifsmA * policy.ifsm.value;
  const status = surge.i2tA2s > ratedI2tA2s ? 'error' : figure > limit ? 'warning' : 'pass';
  const judgement: SurgeJudgement = {
    peakA, ifsmA, ratedS, i2tA2s: surge.i2tA2s, ratedI2tA2s, peakShare, i2tShare, binding: peakShare >= equivalentShare ? 'peak' : 'i2t',
  };
  return { stress: 'surge', status, figure, rating: ifsmA, limit, margin: limit - figure, ratedI2tA2s, surge: judgement };
}

function junctionVerdict(inputs: StressInputs, ratings: Ratings, policy: DeratingPolicy): StressVerdict | undefined {
  const tjC = inputs.worst?.tjC?.value;
  if (inputs.worst?.thermalRunaway) return { stress: 'junction-temperature', status: 'runaway', figure: tjC ?? Infinity };
  if (tjC === undefined || inputs.rthjaKPerW === undefined) return undefined;
  const tjmaxC = ratings.tjmaxC?.value;
  const limit = junctionLimitC(policy.tj.value, tjmaxC);
  const status = tjmaxC !== undefined && tjC > tjmaxC ? 'error' : tjC > limit ? 'warning' : 'pass';
  const verdict: StressVerdict = { stress: 'junction-temperature', status, figure: tjC, limit, margin: limit - tjC };
  if (tjmaxC !== undefined) verdict.rating = tjmaxC;
  return verdict;
}
