/**
 * The figures of one rectifier as tables of formatted cells, one column per corner, with the
 * worst corner of each row marked: the one model behind the HTML report and the terminal text.
 */
import type { DeviceAnalysis, RectifierAnalysis } from '../equivalent/index';
import type { CornerSolution, DeviceSolution, WorstFigures, WorstValue } from '../solve/index';
import { formatCelsius, formatFixed, formatPercent, formatSi, trim } from '../presentation/format';
import { halfSineI2tA2s } from '../ratings/index';
import { loadAmountText, namesText, partVertexShort } from '../presentation/operating-conditions';

export interface FigureRow {
  label: string;
  cells: string[];
  /** Index of the worst corner's column, when the row has one. */
  worstIndex?: number;
  /** The part's rating for this figure, formatted, when known. */
  rating?: string;
}

export interface FigureTable {
  title: string;
  corners: string[];
  rows: FigureRow[];
}

type CornerFigure = {
  label: string;
  key: keyof WorstFigures;
  get: (c: CornerSolution) => number | undefined;
  show: (v: number | undefined) => string;
};

const RECTIFIER_FIGURES: readonly CornerFigure[] = [
  { label: 'Output, average', key: 'vOutAvgV', get: (c) => c.vOutAvgV, show: (v) => formatSi(v, 'V') },
  { label: 'Output ripple, peak to peak', key: 'rippleVpp', get: (c) => c.rippleVpp, show: (v) => formatSi(v, 'V') },
  { label: 'Capacitor ripple current, RMS', key: 'capRippleIrmsA', get: (c) => c.capRippleIrmsA, show: (v) => formatSi(v, 'A') },
  { label: 'Rectifier loss', key: 'rectifierLossW', get: (c) => c.rectifierLossW, show: (v) => formatSi(v, 'W') },
  { label: 'Efficiency', key: 'efficiency', get: (c) => c.efficiency, show: formatPercent },
  { label: 'Source current, RMS (mains side)', key: 'sourceIrmsA', get: (c) => c.sourceIrmsA, show: (v) => formatSi(v, 'A') },
  { label: 'Power factor', key: 'powerFactor', get: (c) => c.powerFactor, show: (v) => formatFixed(v, 3) },
  { label: 'Current THD (orders 2–40)', key: 'thd', get: (c) => c.thd, show: formatPercent },
  { label: 'Inrush peak', key: 'inrushPeakA', get: (c) => c.inrushPeakA, show: (v) => formatSi(v, 'A') },
  { label: 'Inrush I²t, first half-cycle (largest device)', key: 'inrushI2tA2s', get: (c) => c.inrushI2tA2s, show: formatI2t },
  { label: 'Hold-up to load vmin', key: 'holdUpS', get: (c) => c.holdUpS, show: (v) => formatSi(v, 's') },
];

/**
 * What each corner solved: its line (and frequency), ambient and load, and the part vertex when
 * any part carries a spread (solve/corners.ts says which vertex is worst for what).
 */
export function cornerConditionTable(analysis: RectifierAnalysis): FigureTable {
  const { corners } = analysis.solution;
  const fixed = analysis.rectifier.surroundings.load.fixed;
  const beside = fixed ? ` + ${namesText(fixed.elements)}` : '';
  const rows: FigureRow[] = [
    { label: 'Line', cells: corners.map((c) => `${formatSi(c.lineVrms, 'V')}${c.freqHz !== undefined ? ` ${formatSi(c.freqHz, 'Hz')}` : ''}`) },
    { label: 'Ambient', cells: corners.map((c) => formatCelsius(c.ambientC)) },
    { label: 'Load', cells: corners.map((c) => `${loadAmountText(c.load)}${beside}`) },
  ];
  if (corners.some((c) => c.parts)) rows.push({ label: 'Parts', cells: corners.map((c) => partVertexShort(c.parts)) });
  return { title: 'Corners', corners: corners.map((c) => c.name), rows };
}

/** The rectifier-level figures per corner; rows with no value at any corner are left out. */
export function rectifierFigureTable(analysis: RectifierAnalysis): FigureTable {
  const { corners, worst } = analysis.solution;
  const names = corners.map((c) => c.name);
  const rows = RECTIFIER_FIGURES.filter((f) => corners.some((c) => f.get(c) !== undefined)).map((f): FigureRow => ({
    label: f.label, cells: corners.map((c) => f.show(f.get(c))), ...worstIndexOf(worst[f.key], names),
  }));
  // Which inrush case gave the peak (both crests; with an NTC limiter, cold start and hot restart).
  if (corners.some((c) => c.inrushCase)) rows.push({ label: 'Inrush case of the peak', cells: corners.map((c) => c.inrushCase ?? '') });
  return { title: 'Rectifier figures per corner', corners: names, rows };
}

/** I²t always in A²s (an SI prefix on a squared unit reads wrongly: "mA²s" is not 10⁻³ A²s). */
export function formatI2t(value: number | undefined): string {
  return value === undefined || !Number.isFinite(value) ? '—' : `${trim(value)} A²s`;
}

type DeviceFigure = { label: string; key: keyof DeviceSolution & keyof DeviceRowWorst; show: (v: number | undefined) => string; rating?: (d: DeviceAnalysis) => number | undefined; ratingUnit?: string };
type DeviceRowWorst = { pivV?: WorstValue; ipkA?: WorstValue; iavgA?: WorstValue; irmsA?: WorstValue; lossW?: WorstValue; tjC?: WorstValue };

const DEVICE_FIGURES: readonly DeviceFigure[] = [
  { label: 'PIV', key: 'pivV', show: (v) => formatSi(v, 'V'), rating: (d) => reverseRatingV(d), ratingUnit: 'V' },
  { label: 'Peak current', key: 'ipkA', show: (v) => formatSi(v, 'A') },
  { label: 'Average current', key: 'iavgA', show: (v) => formatSi(v, 'A'), rating: (d) => (d.ratings.ratings.kind === 'diode' ? d.ratings.ratings.ifavA?.value : d.ratings.ratings.kind === 'mosfet' ? d.ratings.ratings.idA?.value : undefined), ratingUnit: 'A' },
  { label: 'RMS current', key: 'irmsA', show: (v) => formatSi(v, 'A') },
  { label: 'Loss', key: 'lossW', show: (v) => formatSi(v, 'W') },
  { label: 'Junction temperature', key: 'tjC', show: formatCelsius, rating: (d) => (d.ratings.ratings.kind === 'diode' || d.ratings.ratings.kind === 'mosfet' ? d.ratings.ratings.tjmaxC?.value : undefined), ratingUnit: '°C' },
];

/**
 * One table per device: its stresses per corner, the worst marked, and its rating beside.
 * Devices whose tables are identical (the symmetric halves of a bridge) share one table.
 */
export function deviceFigureTables(analysis: RectifierAnalysis): FigureTable[] {
  const names = analysis.solution.corners.map((c) => c.name);
  const groups = new Map<string, { devices: string[]; model?: string; rows: FigureRow[] }>();
  for (const device of analysis.devices) {
    const worst = device.figures.worst;
    if (!worst) continue;
    const rows = deviceRows(device, names);
    const model = device.model?.name;
    const signature = JSON.stringify([model, rows]);
    const group = groups.get(signature);
    if (group) group.devices.push(worst.name);
    else groups.set(signature, { devices: [worst.name], model, rows });
  }
  return [...groups.values()].map((g) => ({ title: `${g.devices.join(', ')}${g.model ? ` (${g.model})` : ''}`, corners: names, rows: g.rows }));
}

function deviceRows(device: DeviceAnalysis, names: readonly string[]): FigureRow[] {
  const worst = device.figures.worst!;
  return DEVICE_FIGURES.map((f): FigureRow => {
    const rated = f.rating ? f.rating(device) : undefined;
    const cells = device.figures.corners.map((c) => f.show(c.figures?.[f.key] as number | undefined));
    const row: FigureRow = { label: f.label, cells, ...worstIndexOf(worst[f.key], names) };
    if (rated !== undefined) row.rating = f.ratingUnit === '°C' ? formatCelsius(rated) : formatSi(rated, f.ratingUnit ?? '');
    return row;
  }).concat(surgeRows(device, names));
}

/** The device's own switch-on surge per corner (its worse crest, and cold or hot with an NTC), the worst marked. */
function surgeRows(device: DeviceAnalysis, names: readonly string[]): FigureRow[] {
  const surge = device.figures.surge;
  if (!surge) return [];
  const worst = worstIndexOf({ value: surge.figureA, corner: surge.corner }, names);
  const r = device.ratings.ratings;
  const peak: FigureRow = { label: 'Inrush peak', cells: device.figures.corners.map((c) => formatSi(c.figures?.inrushPeakA, 'A')), ...worst };
  const i2t: FigureRow = { label: 'Inrush I²t, first half-cycle', cells: device.figures.corners.map((c) => formatI2t(c.figures?.inrushI2tA2s)), ...worst };
  if (r.kind === 'diode' && r.ifsmA) {
    const ratedS = r.ifsmDurationS?.value;
    peak.rating = `IFSM ${formatSi(r.ifsmA.value, 'A')}`;
    if (ratedS !== undefined) i2t.rating = `${formatI2t(halfSineI2tA2s(r.ifsmA.value, ratedS))} (IFSM²·t/2)`;
  }
  const inrushCase: FigureRow = { label: 'Inrush case', cells: device.figures.corners.map((c) => c.figures?.inrushCase ?? '') };
  return [peak, i2t, inrushCase];
}

/** The reverse rating a device's PIV is held against: VRRM for a diode, VDS for a MOSFET. */
export function reverseRatingV(d: DeviceAnalysis): number | undefined {
  const r = d.ratings.ratings;
  return r.kind === 'diode' ? r.vrrmV?.value : r.kind === 'mosfet' ? r.vdsV?.value : undefined;
}

function worstIndexOf(worst: WorstValue | undefined, names: readonly string[]): { worstIndex?: number } {
  if (!worst) return {};
  const index = names.indexOf(worst.corner);
  return index >= 0 ? { worstIndex: index } : {};
}
