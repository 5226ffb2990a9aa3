/**
 * One table per filter capacitor with a computed stress: its ripple current, the loss in its ESR,
 * its core temperature and its life estimate per corner (equivalent/capacitor-stress.ts), the
 * worst marked (the shortest life for the life row), with the rating beside.
 */
import type { CapacitorAnalysis, RectifierAnalysis } from '../equivalent/index';
import type { WorstValue } from '../solve/index';
import { formatCelsius, formatHours, formatSi } from '../presentation/format';
import type { FigureRow, FigureTable } from './figure-tables';

export function capacitorFigureTables(analysis: RectifierAnalysis): FigureTable[] {
  const names = analysis.solution.corners.map((c) => c.name);
  return analysis.capacitors.flatMap((cap) => (cap.stress ? [tableOf(cap, names)] : []));
}

function tableOf(cap: CapacitorAnalysis, names: readonly string[]): FigureTable {
  const stress = cap.stress!;
  const at = (name: string) => stress.corners.find((c) => c.corner === name);
  const r = cap.ratings;
  const rows: FigureRow[] = [
    row('Ripple current, RMS', names.map((n) => formatSi(at(n)?.irmsA, 'A')), worstOf(stress.corners.map((c) => ({ value: c.irmsA, corner: c.corner }))), names,
      r.iRippleA && formatSi(r.iRippleA.value, 'A')),
  ];
  if (stress.lossW) rows.push(row(`Ripple loss (ESR ${formatSi(stress.esr?.ohm, 'Ω')}, ${stress.esr?.from})`, names.map((n) => formatSi(at(n)?.lossW, 'W')), stress.lossW, names));
  rows.push(row('Core temperature', names.map((n) => formatCelsius(at(n)?.coreC)), stress.coreC, names));
  if (stress.lifeH) {
    const e = r.endurance?.value;
    rows.push(row('Life estimate (10 °C rule)', names.map((n) => formatHours(at(n)?.lifeH)), stress.lifeH, names, e && `${formatHours(e.hours)} at ${formatCelsius(e.atC)}`));
  }
  return { title: `${cap.name} (filter capacitor)`, corners: [...names], rows };
}

function row(label: string, cells: string[], worst: WorstValue | undefined, names: readonly string[], rating?: string): FigureRow {
  const out: FigureRow = { label, cells };
  const index = worst ? names.indexOf(worst.corner) : -1;
  if (index >= 0) out.worstIndex = index;
  if (rating) out.rating = rating;
  return out;
}

function worstOf(values: readonly WorstValue[]): WorstValue | undefined {
  return values.reduce<WorstValue | undefined>((best, v) => (!best || v.value > best.value ? v : best), undefined);
}
