/**
 * Choosing a replacement diode for the part-swap fix: the lowest-rated catalog or parts-file part
 * that meets a requirement, never a silicon Schottky for a mains-class reverse voltage.
 */
import type { DeratingPolicy } from './derating-policy';
import { DEFAULT_IFSM_DURATION_S } from './rating-origin';
import type { DiodePart, DiodeTechnology } from './rating-records';
import { equivalentSurgeA } from './surge-rating';

/**
 * Silicon Schottky rectifiers are not made for mains-class reverse voltages; 200 V is taken as
 * the top of their class (common practice). Silicon-carbide Schottky parts are not limited here.
 */
export const SCHOTTKY_MAX_VRRM_V = 200;

/** A half-sine current pulse: its peak and its length. */
export interface SurgePulse {
  peakA: number;
  durationS: number;
}

/** What a diode must be rated for. All limits are minimum ratings, after derating. */
export interface DiodeRequirement {
  minVrrmV?: number;
  minIfavA?: number;
  /** The pulse the IFSM rating must cover, compared at equal I²t. */
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
 * IFSM ≥ surge peak / ifsm (DESIGN.md §6).
 */
export function diodeRequirementFromStress(stress: DiodeStress, policy: DeratingPolicy): DiodeRequirement {
  const requirement: DiodeRequirement = { minVrrmV: stress.pivV / policy.vr.value };
  if (stress.iavgA !== undefined) requirement.minIfavA = stress.iavgA / policy.if.value;
  if (stress.surge) requirement.surge = { peakA: stress.surge.peakA / policy.ifsm.value, durationS: stress.surge.durationS };
  return requirement;
}

/**
 * Why a part fails a requirement, one phrase per reason; empty when it passes. A rating the
 * requirement needs but the part does not state is a failure: a fix must not guess.
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
  const atLeast = (label: string, have: number | undefined, need: number | undefined, unit: string): void => {
    if (need === undefined) return;
    if (have === undefined) reasons.push(`no ${label} rating`);
    else if (have < need) reasons.push(`${label} ${have} ${unit} < ${round(need)} ${unit}`);
  };
  atLeast('VRRM', r.vrrmV?.value, requirement.minVrrmV, 'V');
  atLeast('IF(AV)', r.ifavA?.value, requirement.minIfavA, 'A');
  atLeast('Tjmax', r.tjmaxC?.value, requirement.minTjmaxC, '°C');
  if (requirement.surge) atLeast('IFSM (equal I²t)', surgeCapabilityA(part, requirement.surge.durationS), requirement.surge.peakA, 'A');
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
  const ifsm = part.ratings.ifsmA?.value;
  if (ifsm === undefined) return undefined;
  return equivalentSurgeA(ifsm, part.ratings.ifsmDurationS?.value ?? DEFAULT_IFSM_DURATION_S, pulseS);
}

function compareKeys(a: readonly number[], b: readonly number[]): number {
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return a[k] < b[k] ? -1 : 1;
  return 0;
}

function round(value: number): string {
  return String(Number(value.toPrecision(3)));
}
