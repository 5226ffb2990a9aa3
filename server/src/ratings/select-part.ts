/**
 * Choosing a replacement diode for the part-swap fix: the lowest-rated catalog or parts-file part
 * that meets a requirement, never a silicon Schottky for a mains-class reverse voltage.
 */
import { displayNumber } from '../../../grammar/src/index';
import { DEFAULT_DERATING, type DeratingPolicy, type PolicyEntry } from './derating-policy';
import { DEFAULT_IFSM_DURATION_S } from './rating-origin';
import type { DiodePart, DiodeTechnology } from './rating-records';
import { halfSineSurge, leastPassingRatings, stressVerdicts, surgeCapability, type StressInputs, type StressKind } from './stress-checks';

/**
 * Silicon Schottky rectifiers are not made for mains-class reverse voltages; 200 V is taken as
 * the top of their class (common practice). Silicon-carbide Schottky parts are not limited here.
 */
export const SCHOTTKY_MAX_VRRM_V = 200;

/** A current pulse: its peak, its length and its I²t (a half-sine's, Ip²·t/2, when absent). */
export interface SurgePulse {
  peakA: number;
  durationS: number;
  i2tA2s?: number;
}

/** What a diode must be rated for. All limits are minimum ratings, after derating. */
export interface DiodeRequirement {
  minVrrmV?: number;
  minIfavA?: number;
  /** The pulse the IFSM rating must cover, by its peak and by its I²t. */
  surge?: SurgePulse;
  minTjmaxC?: number;
  /** Allowed constructions; absent means any. Pass the current part's to keep the designer's choice. */
  technologies?: readonly DiodeTechnology[];
}

/** Worst-case stresses of one diode, as the solver reports them. */
export interface DiodeStress {
  pivV: number;
  iavgA?: number;
  /** Inrush through the device (first half-cycle at switch-on). */
  surge?: SurgePulse;
}

/**
 * Turns stresses into minimum ratings under a policy: VRRM ≥ PIV / vr, IF(AV) ≥ Iavg / if,
 * IFSM ≥ surge peak / ifsm (DESIGN.md §6) — the stress checks inverted (stress-checks.ts).
 */
export function diodeRequirementFromStress(stress: DiodeStress, policy: DeratingPolicy): DiodeRequirement {
  const least = leastPassingRatings(stressInputs(stress.pivV, stress.iavgA, stress.surge), policy);
  const requirement: DiodeRequirement = { minVrrmV: least.vrrmV! };
  if (least.ifavA !== undefined) requirement.minIfavA = least.ifavA;
  if (least.surge) requirement.surge = least.surge;
  return requirement;
}

/** Every fraction at 100 %: a requirement's minimums are already derated, so it is held to the rating itself. */
const AT_RATING: DeratingPolicy = (() => {
  const full: PolicyEntry<number> = { value: 1, origin: { kind: 'default', source: 'the minimum ratings of a requirement', basis: 'confirmed' } };
  return { ...DEFAULT_DERATING, vr: full, if: full, ifsm: full, cap: full, ripple: full, vds: full, id: full };
})();

/** The requirement's rating checks, by stress, with the words of a failure. */
const CHECKED: readonly { stress: StressKind; label: string; unit: string }[] = [
  { stress: 'reverse-voltage', label: 'VRRM', unit: 'V' },
  { stress: 'average-current', label: 'IF(AV)', unit: 'A' },
  { stress: 'surge', label: 'IFSM (peak and I²t)', unit: 'A' },
];

/**
 * Why a part fails a requirement, one phrase per reason; empty when it passes. A rating the
 * requirement needs but the part does not state is a failure: a fix must not guess. The ratings
 * are judged by the stress checks with the minimums as figures, at 100 % of the rating.
 */
export function checkDiodeRequirement(part: DiodePart, requirement: DiodeRequirement): string[] {
  const r = part.ratings;
  const reasons: string[] = [];
  const technology = r.technology?.value;
  if (requirement.technologies && (technology === undefined || !requirement.technologies.includes(technology))) {
    reasons.push(`technology ${technology ?? 'unknown'} is not among ${requirement.technologies.join(', ')}`);
  }
  if (technology === 'schottky' && (requirement.minVrrmV ?? 0) > SCHOTTKY_MAX_VRRM_V) {
    reasons.push(`a silicon Schottky is not offered above ${SCHOTTKY_MAX_VRRM_V} V reverse (common practice)`);
  }
  const verdicts = stressVerdicts(stressInputs(requirement.minVrrmV, requirement.minIfavA, requirement.surge), r, AT_RATING);
  const failure = (check: (typeof CHECKED)[number]): string | undefined => {
    const v = verdicts.find((x) => x.stress === check.stress);
    if (!v || v.status === 'pass') return undefined;
    if (v.rating === undefined) return `no ${check.label} rating`;
    return `${check.label} ${displayNumber(v.rating)} ${check.unit} < ${displayNumber(v.figure)} ${check.unit}`;
  };
  const [vrrm, ifav, surge] = CHECKED.map(failure);
  const tjmax = requirement.minTjmaxC === undefined ? undefined
    : r.tjmaxC === undefined ? 'no Tjmax rating'
    : r.tjmaxC.value < requirement.minTjmaxC ? `Tjmax ${displayNumber(r.tjmaxC.value)} °C < ${displayNumber(requirement.minTjmaxC)} °C` : undefined;
  for (const reason of [vrrm, ifav, tjmax, surge]) if (reason) reasons.push(reason);
  return reasons;
}

/**
 * The lowest-rated part that meets the requirement: the smallest current class first (the
 * smaller, cheaper part), then the lowest VRRM, then the lowest surge rating. When every passing
 * part states a cost, the cheapest wins instead. Undefined when none passes.
 */
export function selectPassingPart(requirement: DiodeRequirement, candidates: readonly DiodePart[]): DiodePart | undefined {
  const passing = candidates.filter((part) => checkDiodeRequirement(part, requirement).length === 0);
  const byCost = passing.length > 0 && passing.every((p) => p.ratings.cost !== undefined);
  const surgeS = requirement.surge?.durationS ?? DEFAULT_IFSM_DURATION_S;
  const keys = (p: DiodePart): number[] => [
    ...(byCost ? [p.ratings.cost!.value] : []),
    p.ratings.ifavA?.value ?? Infinity,
    p.ratings.vrrmV?.value ?? Infinity,
    surgeCapabilityA(p, surgeS) ?? Infinity,
  ];
  const sorted = [...passing].sort((a, b) => compareKeys(keys(a), keys(b)) || a.name.localeCompare(b.name));
  return sorted[0];
}

/** The part's IFSM converted to a pulse length at equal I²t, or undefined without an IFSM. */
export function surgeCapabilityA(part: DiodePart, pulseS: number): number | undefined {
  return surgeCapability(part.ratings, pulseS)?.equivalentA;
}

/** Stresses given as plain numbers, in the shape the stress checks read. */
function stressInputs(pivV: number | undefined, iavgA: number | undefined, surge: SurgePulse | undefined): StressInputs {
  const worst: NonNullable<StressInputs['worst']> = {};
  if (pivV !== undefined) worst.pivV = { value: pivV };
  if (iavgA !== undefined) worst.iavgA = { value: iavgA };
  return surge ? { worst, surge: halfSineSurge(surge.peakA, surge.durationS, surge.i2tA2s) } : { worst };
}

function compareKeys(a: readonly number[], b: readonly number[]): number {
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return a[k] < b[k] ? -1 : 1;
  return 0;
}
