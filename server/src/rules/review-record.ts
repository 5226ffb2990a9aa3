/**
 * The design-review record: one row per rectifier part (diode, MOSFET, filter capacitor) with each
 * stress it sees — the figure at its worst corner, the rating, the share of the rating used, the
 * policy's limit, where the rating and the limit come from, and the verdict — judged exactly as
 * the rules judge them (ratings/stress-checks.ts for devices, the capacitor views of
 * capacitor-view.ts for capacitors). A stress a part does not see is "not applicable"; one it sees
 * without a rating is "not rated": nothing is left blank.
 */
import { displayNumber } from '../../../grammar/src/index';
import {
  describeOrigin, describePolicyOrigin, junctionLimitC, ratioSeverity, stressVerdicts,
  type DeratingPolicy, type PolicyEntry, type RatingOrigin, type StressKind, type StressVerdict,
} from '../ratings/index';
import type { DeviceAnalysis } from '../equivalent/index';
import type { WorstValue } from '../solve/index';
import { capacitorsOf, type CapacitorView } from './capacitor-view';
import type { RuleInput } from './registry';

/** The four stress columns of the record; each part kind fills those it sees. */
export const REVIEW_STRESSES = ['voltage', 'current', 'surge', 'temperature'] as const;
export type ReviewStressId = (typeof REVIEW_STRESSES)[number];

export type ReviewVerdict = 'pass' | 'warning' | 'error' | 'not rated' | 'not computed' | 'runaway' | 'not applicable';

export interface ReviewStress {
  /** What is judged, in words ("reverse voltage (VRRM)"). */
  label: string;
  unit: string;
  figure?: number;
  corner?: string;
  rating?: number;
  ratingOrigin: string;
  /** figure / rating. */
  used?: number;
  limit?: number;
  limitOrigin: string;
  verdict: ReviewVerdict;
}

export interface ReviewRow {
  rectifier: string;
  /** The part's name as the netlist gives it (`X1.D3`). */
  reference: string;
  kind: 'diode' | 'mosfet' | 'capacitor';
  /** Its model or part name, or "(no model)". */
  part: string;
  stresses: Record<ReviewStressId, ReviewStress>;
  /** The worst of its stresses. */
  verdict: ReviewVerdict;
}

const NOT_APPLICABLE: ReviewStress = { label: 'not applicable', unit: '', ratingOrigin: 'not applicable', limitOrigin: 'not applicable', verdict: 'not applicable' };

const DEVICE_COLUMNS: Readonly<Record<'diode' | 'mosfet', Partial<Record<ReviewStressId, { stress: StressKind; label: string; unit: string }>>>> = {
  diode: {
    voltage: { stress: 'reverse-voltage', label: 'reverse voltage (VRRM)', unit: 'V' },
    current: { stress: 'average-current', label: 'average current (IF(AV))', unit: 'A' },
    surge: { stress: 'surge', label: 'switch-on surge (IFSM)', unit: 'A' },
    temperature: { stress: 'junction-temperature', label: 'junction temperature (Tj)', unit: '°C' },
  },
  mosfet: {
    voltage: { stress: 'vds', label: 'blocking voltage (VDS)', unit: 'V' },
    current: { stress: 'drain-current', label: 'RMS current (ID)', unit: 'A' },
    temperature: { stress: 'junction-temperature', label: 'junction temperature (Tj)', unit: '°C' },
  },
};

export function reviewRecord(input: RuleInput): ReviewRow[] {
  const rows: ReviewRow[] = [];
  for (const analysis of input.rectifiers) {
    const rectifier = analysis.rectifier.id;
    for (const device of analysis.devices) rows.push(deviceRow(rectifier, device, input.policy));
    for (const view of capacitorsOf(input).filter((v) => v.analysis === analysis)) rows.push(capacitorRow(rectifier, view, input.policy));
  }
  return rows;
}

function deviceRow(rectifier: string, device: DeviceAnalysis, policy: DeratingPolicy): ReviewRow {
  const ratings = device.ratings.ratings;
  const kind = ratings.kind === 'mosfet' ? 'mosfet' : 'diode';
  const verdicts = stressVerdicts(device.figures, ratings, policy);
  const stresses = Object.fromEntries(REVIEW_STRESSES.map((id) => {
    const column = DEVICE_COLUMNS[kind][id];
    if (!column) return [id, NOT_APPLICABLE];
    return [id, deviceStress(column, verdicts.find((v) => v.stress === column.stress), device, policy)];
  })) as Record<ReviewStressId, ReviewStress>;
  return { rectifier, reference: device.ref.name, kind, part: device.model?.name ?? '(no model)', stresses, verdict: worstOf(Object.values(stresses)) };
}

function deviceStress(column: { stress: StressKind; label: string; unit: string }, verdict: StressVerdict | undefined, device: DeviceAnalysis, policy: DeratingPolicy): ReviewStress {
  const ratings = device.ratings.ratings as unknown as Record<string, { value: number; origin: RatingOrigin } | undefined>;
  const field = { 'reverse-voltage': 'vrrmV', vds: 'vdsV', 'average-current': 'ifavA', 'drain-current': 'idA', surge: 'ifsmA', 'junction-temperature': 'tjmaxC' }[column.stress];
  const rated = ratings[field];
  const worst = device.figures.worst;
  const corner = column.stress === 'surge' ? device.figures.surge?.corner
    : column.stress === 'junction-temperature' ? worst?.tjC?.corner
      : column.stress === 'average-current' ? worst?.iavgA?.corner
        : column.stress === 'drain-current' ? worst?.irmsA?.corner : worst?.pivV?.corner;
  const base = { label: column.label, unit: column.unit, ratingOrigin: rated ? describeOrigin(rated.origin) : 'not rated', limitOrigin: limitOrigin(column.stress, policy) };
  if (column.stress === 'junction-temperature' && device.figures.rthjaKPerW === undefined) {
    return { ...base, verdict: 'not rated', ratingOrigin: rated ? base.ratingOrigin : 'not rated', limitOrigin: 'no RθJA: the junction temperature was not checked' };
  }
  if (!verdict) return { ...base, verdict: worst ? 'not computed' : 'not computed' };
  const out: ReviewStress = { ...base, figure: verdict.figure, verdict: verdict.status === 'unrated' ? 'not rated' : verdict.status };
  if (corner) out.corner = corner;
  if (verdict.rating !== undefined) {
    out.rating = column.stress === 'surge' ? verdict.surge?.ifsmA ?? verdict.rating : verdict.rating;
    out.used = verdict.figure / verdict.rating;
  }
  if (verdict.limit !== undefined) out.limit = verdict.limit;
  return out;
}

function limitOrigin(stress: StressKind, policy: DeratingPolicy): string {
  const entry: PolicyEntry<unknown> | undefined = {
    'reverse-voltage': policy.vr, vds: policy.vds, 'average-current': policy.if, 'drain-current': policy.id, surge: policy.ifsm, 'junction-temperature': policy.tj,
  }[stress];
  return entry ? describePolicyOrigin(entry.origin) : 'not applicable';
}

function capacitorRow(rectifier: string, view: CapacitorView, policy: DeratingPolicy): ReviewRow {
  const r = view.ratings;
  const stresses: Record<ReviewStressId, ReviewStress> = {
    voltage: ratioStress('peak voltage (rated voltage)', 'V', view.peakV, r.vratedV, policy.cap),
    current: ratioStress('ripple current (rated ripple)', 'A', view.irmsA, r.iRippleA, policy.ripple),
    surge: NOT_APPLICABLE,
    temperature: NOT_APPLICABLE,
  };
  return { rectifier, reference: view.name, kind: 'capacitor', part: view.element.value !== undefined ? `${displayNumber(view.element.value * 1e6)} µF` : '(no value)', stresses, verdict: worstOf(Object.values(stresses)) };
}

function ratioStress(label: string, unit: string, figure: WorstValue | undefined, rated: { value: number; origin: RatingOrigin } | undefined, fraction: PolicyEntry<number>): ReviewStress {
  const base = { label, unit, ratingOrigin: rated ? describeOrigin(rated.origin) : 'not rated', limitOrigin: describePolicyOrigin(fraction.origin) };
  if (!figure) return { ...base, verdict: 'not computed' };
  if (!rated) return { ...base, figure: figure.value, corner: figure.corner, verdict: 'not rated' };
  return {
    ...base, figure: figure.value, corner: figure.corner, rating: rated.value, used: figure.value / rated.value, limit: rated.value * fraction.value,
    verdict: ratioSeverity(figure.value, rated.value, fraction.value) ?? 'pass',
  };
}

const RANK: Readonly<Record<ReviewVerdict, number>> = { error: 0, runaway: 1, warning: 2, 'not rated': 3, 'not computed': 4, pass: 5, 'not applicable': 6 };

function worstOf(stresses: readonly ReviewStress[]): ReviewVerdict {
  return stresses.reduce<ReviewVerdict>((worst, s) => (RANK[s.verdict] < RANK[worst] ? s.verdict : worst), 'not applicable');
}

/** The junction limit in °C a device is held to (its policy and its Tjmax), for readers of the record. */
export function junctionLimitOf(device: DeviceAnalysis, policy: DeratingPolicy): number {
  const r = device.ratings.ratings;
  return junctionLimitC(policy.tj.value, r.tjmaxC?.value);
}
