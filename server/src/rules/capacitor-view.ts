/**
 * The filter capacitors of each rectifier as the capacitor rules see them: each named part with
 * its ratings, its card, its share of its group's ripple current and its peak voltage.
 *
 * Ripple share: recognition merges parallel capacitors and series strings into one; the ripple
 * current divides between parallel branches in proportion to their capacitance, and flows whole
 * through each stage of a string (`rippleShareOf`, recognize/capacitor-strings.ts; equal impedance
 * phase at the ripple frequencies when ESR is small against 1/ωC; D for identical parts, an
 * estimate otherwise).
 *
 * Peak voltage: the solver reports the output's maximum. A bridge, half-wave, centre tap or
 * three-phase capacitor sees it whole. A full-wave doubler's two capacitors each see half of it
 * (they are in series across the output and charge symmetrically, D); a half-wave doubler's series
 * capacitor charges to the crest, half the output, and its output capacitor sees the whole
 * (REFERENCES.md §1, doubler row, M). A capacitor in a series string sees its stage's share of
 * that (equivalent/string-share.ts): the larger of the switch-on bound and the steady state.
 */
import { stageVoltage, type GroupVoltage, type RectifierAnalysis, type StageShare } from '../equivalent/index';
import type { PassiveElement } from '../circuit/index';
import type { CapacitorRatings } from '../ratings/index';
import { rippleShareOf } from '../recognize/index';
import type { WorstValue } from '../solve/index';
import { circuitIndexOf, fmt, pct } from './rule-context';
import type { RuleInput } from './registry';

export interface CapacitorView {
  analysis: RectifierAnalysis;
  /** Index of the (merged) capacitor in the equivalent circuit. */
  group: number;
  name: string;
  element: PassiveElement;
  ratings: CapacitorRatings;
  /** This part's fraction of its group's ripple current. */
  share: number;
  /** Worst peak voltage across this part. */
  peakV?: WorstValue;
  /** Worst RMS ripple current through this part. */
  irmsA?: WorstValue;
  /** In a series string: its stage's share, and its voltage at steady state (the peak is the switch-on bound). */
  stringShare?: StageShare;
  steadyV?: WorstValue;
}

const views = new WeakMap<RuleInput, readonly CapacitorView[]>();

/** Every named filter capacitor of every rectifier of the file, worked out once per analysis (five rules read them). */
export function capacitorsOf(input: RuleInput): readonly CapacitorView[] {
  let found = views.get(input);
  if (!found) views.set(input, (found = capacitorViews(input)));
  return found;
}

function capacitorViews(input: RuleInput): CapacitorView[] {
  const byKey = circuitIndexOf(input).capacitorsByKey;
  return input.rectifiers.flatMap((analysis) =>
    analysis.rectifier.surroundings.capacitors.flatMap((found, group) => {
      const elements = found.names.map((n) => byKey.get(n.toLowerCase())).filter((e): e is PassiveElement => e !== undefined);
      return elements.map((element) => {
        const part = analysis.capacitors.find((c) => c.name.toLowerCase() === element.key);
        const ratings = part?.ratings ?? { kind: 'capacitor' as const };
        const share = rippleShareOf(found, element.name) ?? 1 / elements.length;
        const view: CapacitorView = { analysis, group, name: element.name, element, ratings, share };
        if (part?.share) {
          const { peakV, steadyV } = stageVoltage(part.share, groupVoltages(analysis, group));
          view.stringShare = part.share;
          if (peakV) view.peakV = peakV;
          if (steadyV) view.steadyV = steadyV;
        } else {
          const peakV = peakVoltage(analysis, group);
          if (peakV) view.peakV = peakV;
        }
        const irmsA = worstIrms(analysis, group, share);
        if (irmsA) view.irmsA = irmsA;
        return view;
      });
    }));
}

/**
 * How a string capacitor's peak came about, for messages: its stage, the shares and the balancing
 * time constant; undefined for a capacitor that is not in a string.
 */
export function stringShareText(view: CapacitorView): string | undefined {
  const s = view.stringShare;
  if (!s) return undefined;
  const where = `stage ${s.stage} of ${s.stages} of the series string ${s.stringNames.join(', ')}${s.spread ? ', at its worst tolerance vertex' : ''}`;
  if (s.resistive === undefined) {
    return `${where}: ${pct(s.capacitive)} by capacitance; with no balancing resistor across stage ${s.unbalanced.join(', ')}, leakage sets the DC share, which is not modelled`;
  }
  const settling = [
    ...(s.tauS !== undefined ? [`time constant ${fmt(s.tauS)} s`] : []),
    ...(view.steadyV ? [`${fmt(view.steadyV.value)} V at ${view.steadyV.corner}`] : []),
  ].join(', ');
  const overshoot = s.peak > Math.max(s.capacitive, s.resistive) + 1e-6 ? `; ${pct(s.peak)} at most while settling` : '';
  return `${where}: ${pct(s.capacitive)} at switch-on (equal charge), settling to ${pct(s.resistive)} by the balancing resistors (${settling})${overshoot}`;
}

/** The group's highest and average voltage at each corner: the output, or a doubler capacitor's part of it. */
function groupVoltages(analysis: RectifierAnalysis, group: number): GroupVoltage[] {
  const factor = groupFactor(analysis, group);
  return analysis.solution.corners.flatMap((c) => (c.vOutMaxV !== undefined && c.vOutAvgV !== undefined
    ? [{ corner: c.name, maxV: c.vOutMaxV * factor, avgV: c.vOutAvgV * factor }] : []));
}

function peakVoltage(analysis: RectifierAnalysis, group: number): WorstValue | undefined {
  const out = analysis.solution.worst.vOutMaxV;
  return out ? { value: out.value * groupFactor(analysis, group), corner: out.corner } : undefined;
}

/** The fraction of the output a group sees: half for a full-wave doubler's and a half-wave doubler's series capacitor. */
function groupFactor(analysis: RectifierAnalysis, group: number): number {
  const r = analysis.rectifier;
  return r.kind !== 'doubler' || (r.doubler === 'half-wave' && group !== 0) ? 1 : 0.5;
}

function worstIrms(analysis: RectifierAnalysis, group: number, share: number): WorstValue | undefined {
  let worst: WorstValue | undefined;
  for (const corner of analysis.solution.corners) {
    const i = corner.capacitorIrmsA?.[group];
    if (i !== undefined && (!worst || i * share > worst.value)) worst = { value: i * share, corner: corner.name };
  }
  return worst;
}
