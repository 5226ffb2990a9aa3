/**
 * The filter capacitors of each rectifier as the capacitor rules see them: each named part with
 * its ratings, its card, its share of its group's ripple current and its peak voltage.
 *
 * Ripple share: recognition merges parallel capacitors into one; their ripple current divides in
 * proportion to their capacitance (equal impedance phase at the ripple frequencies when ESR is
 * small against 1/ωC; D for identical parts, an estimate otherwise).
 *
 * Peak voltage: the solver reports the output's maximum. A bridge, half-wave, centre tap or
 * three-phase capacitor sees it whole. A full-wave doubler's two capacitors each see half of it
 * (they are in series across the output and charge symmetrically, D); a half-wave doubler's series
 * capacitor charges to the crest, half the output, and its output capacitor sees the whole
 * (REFERENCES.md §1, doubler row, M).
 */
import type { RectifierAnalysis } from '../equivalent/index';
import type { PassiveElement } from '../circuit/index';
import type { CapacitorRatings } from '../ratings/index';
import type { WorstValue } from '../solve/index';
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
}

/** Every named filter capacitor of every rectifier of the file. */
export function capacitorsOf(input: RuleInput): CapacitorView[] {
  const byKey = new Map(input.flat.elements.filter((e): e is PassiveElement => e.kind === 'capacitor').map((e) => [e.key, e]));
  return input.rectifiers.flatMap((analysis) =>
    analysis.rectifier.surroundings.capacitors.flatMap((found, group) => {
      const elements = found.names.map((n) => byKey.get(n.toLowerCase())).filter((e): e is PassiveElement => e !== undefined);
      const total = elements.reduce((s, e) => s + (e.value ?? 0), 0);
      return elements.map((element) => {
        const ratings = analysis.capacitors.find((c) => c.name.toLowerCase() === element.key)?.ratings ?? { kind: 'capacitor' as const };
        const share = total > 0 ? (element.value ?? 0) / total : 1 / elements.length;
        const view: CapacitorView = { analysis, group, name: element.name, element, ratings, share };
        const peakV = peakVoltage(analysis, group);
        if (peakV) view.peakV = peakV;
        const irmsA = worstIrms(analysis, group, share);
        if (irmsA) view.irmsA = irmsA;
        return view;
      });
    }));
}

function peakVoltage(analysis: RectifierAnalysis, group: number): WorstValue | undefined {
  const out = analysis.solution.worst.vOutMaxV;
  if (!out) return undefined;
  const r = analysis.rectifier;
  if (r.kind !== 'doubler') return out;
  const half = { value: out.value / 2, corner: out.corner };
  if (r.doubler === 'half-wave') return group === 0 ? half : out;
  return half;
}

function worstIrms(analysis: RectifierAnalysis, group: number, share: number): WorstValue | undefined {
  let worst: WorstValue | undefined;
  for (const corner of analysis.solution.corners) {
    const i = corner.capacitorIrmsA?.[group];
    if (i !== undefined && (!worst || i * share > worst.value)) worst = { value: i * share, corner: corner.name };
  }
  return worst;
}
