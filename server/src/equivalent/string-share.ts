/**
 * Each stage's share of a series capacitor string's voltage, at the tolerance vertex worst for it.
 *
 * The model (circuit analysis of the string, string-relaxation.ts; the tolerances from the file):
 * - the DC share at steady state is set by the balancing resistors, Rₖ/ΣRⱼ; capacitor leakage is
 *   neglected beside them (they are sized to carry several times the leakage: common practice);
 * - the ripple divides by the capacitances, (1/Cₖ)/Σ(1/Cⱼ), as 1/(ωC) ≪ R at the ripple frequency
 *   for any resistor sized for balancing (its time constant is seconds);
 * - at switch-on the stages take equal charge, so the capacitive share holds until the resistors
 *   have moved it to the resistive one; the largest share over that relaxation, times the highest
 *   string voltage, bounds the stage's voltage (exact for a charge fast against the balancing
 *   time constant, conservative otherwise);
 * - the worst vertex for stage k: its own capacitance smallest (tolerance and loss over life) with
 *   every other largest, its own resistance largest (`*@ rate R… tol=`) with every other smallest:
 *   it maximises both ends of the relaxation. Parts without a spread stay nominal.
 *
 * A string with a stage lacking a balancing resistor has no resistive share: its DC share is set
 * by leakage currents, which are not modelled; the capacitive share is used and a finding says so.
 */
import type { Rated, RatingsOf } from '../ratings/index';
import type { CapacitorFinding, CapacitorStage } from '../recognize/index';
import type { WorstValue } from '../solve/index';
import { relaxString } from './string-relaxation';

/** One capacitor's place in a string and its stage's share at the worst vertex. */
export interface StageShare {
  /** 1-based position of the stage from the string's first node, and the number of stages. */
  stage: number;
  stages: number;
  /** The other capacitors of the string, by stage. */
  stringNames: string[];
  /** Share at switch-on (equal charge): (1/Cₖ)/Σ(1/Cⱼ) at the vertex. Also the ripple's share. */
  capacitive: number;
  /** Share at steady state by the balancing resistors, Rₖ/ΣRⱼ; absent when a stage has none. */
  resistive?: number;
  /** The largest share over the relaxation from switch-on to steady state (the capacitive share when unbalanced). */
  peak: number;
  /** The slowest balancing time constant, s. */
  tauS?: number;
  /** Whether any tolerance moved the vertex off the nominal parts. */
  spread: boolean;
  /** The stages (1-based) without a balancing resistor. */
  unbalanced: number[];
}

type CapacitorRatingsByName = ReadonlyMap<string, RatingsOf<'capacitor'>>;
type ResistorTolerances = ReadonlyMap<string, Rated<readonly [number, number]>>;

/** The share of every capacitor that sits in a string of the group, by lowercase name. */
export function stringSharesOf(found: CapacitorFinding, capacitors: CapacitorRatingsByName | undefined, resistors: ResistorTolerances): Map<string, StageShare> {
  const out = new Map<string, StageShare>();
  for (const string of found.strings ?? []) {
    const names = string.stages.flatMap((st) => st.members.map((m) => m.name));
    const unbalanced = string.stages.flatMap((st, k) => (st.balancing.length ? [] : [k + 1]));
    const spans = string.stages.map((st) => stageSpread(st, capacitors, resistors));
    // A part with no positive capacitance or resistance has no share to speak of; the string's
    // capacitors are then judged at the whole group voltage (conservative).
    if (!spans.every((sp) => [sp.cMinF, sp.cMaxF, sp.rMinOhm, sp.rMaxOhm].every((v) => v > 0 && !Number.isNaN(v)))) continue;
    string.stages.forEach((stage, k) => {
      const cF = spans.map((s, j) => (j === k ? s.cMinF : s.cMaxF));
      const share: StageShare = { stage: k + 1, stages: string.stages.length, stringNames: names, capacitive: 0, peak: 0, spread: spans.some((s) => s.spread), unbalanced };
      if (unbalanced.length === 0) {
        const gS = spans.map((s, j) => 1 / (j === k ? s.rMaxOhm : s.rMinOhm));
        const relaxed = relaxString(cF, gS);
        const ends = Math.max(relaxed.initial[k]!, relaxed.final[k]!);
        Object.assign(share, { capacitive: relaxed.initial[k]!, resistive: relaxed.final[k]!, peak: Number.isFinite(relaxed.peak[k]) ? relaxed.peak[k]! : ends });
        if (Number.isFinite(relaxed.slowestTauS)) share.tauS = relaxed.slowestTauS;
      } else {
        const inv = cF.map((c) => 1 / c);
        share.capacitive = inv[k]! / inv.reduce((s, v) => s + v, 0);
        share.peak = share.capacitive;
      }
      for (const m of stage.members) out.set(m.name.toLowerCase(), share);
    });
  }
  return out;
}

/** A stage's capacitance and balancing resistance at the ends of their spreads. */
function stageSpread(stage: CapacitorStage, capacitors: CapacitorRatingsByName | undefined, resistors: ResistorTolerances) {
  let spread = false;
  const c = stage.members.map((m) => {
    const r = capacitors?.get(m.name);
    const [low, high] = r?.capTolerance?.value ?? [0, 0];
    const life = r?.capLifeLoss?.value ?? 0;
    if (low || high || life) spread = true;
    return { min: m.cF * (1 + low) * (1 + life), max: m.cF * (1 + high) };
  });
  const g = stage.balancing.map((b) => {
    const [low, high] = resistors.get(b.name.toLowerCase())?.value ?? [0, 0];
    if (low || high) spread = true;
    return { min: 1 / (b.ohm * (1 + high)), max: 1 / (b.ohm * (1 + low)) };
  });
  const sum = (xs: readonly number[]) => xs.reduce((s, v) => s + v, 0);
  return {
    cMinF: sum(c.map((x) => x.min)), cMaxF: sum(c.map((x) => x.max)),
    rMinOhm: 1 / sum(g.map((x) => x.max)), rMaxOhm: 1 / sum(g.map((x) => x.min)),
    spread,
  };
}

/** The highest and average voltage across a group at one corner. */
export interface GroupVoltage {
  corner: string;
  maxV: number;
  avgV: number;
}

/**
 * A stage's voltage over the corners: the switch-on bound (its peak share of the highest group
 * voltage) and the steady state (the resistive share of the average plus the capacitive share of
 * the ripple above it), each at the corner that makes it largest. The switch-on bound is never
 * below the steady state, as the peak share is at least both ends.
 */
export function stageVoltage(share: StageShare, group: readonly GroupVoltage[]): { peakV?: WorstValue; steadyV?: WorstValue } {
  let peakV: WorstValue | undefined;
  let steadyV: WorstValue | undefined;
  for (const g of group) {
    const peak = share.peak * g.maxV;
    if (!peakV || peak > peakV.value) peakV = { value: peak, corner: g.corner };
    if (share.resistive === undefined) continue;
    const steady = share.resistive * g.avgV + share.capacitive * (g.maxV - g.avgV);
    if (!steadyV || steady > steadyV.value) steadyV = { value: steady, corner: g.corner };
  }
  return { ...(peakV ? { peakV } : {}), ...(steadyV ? { steadyV } : {}) };
}
