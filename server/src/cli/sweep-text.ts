/** The load sweep and the cost against energy for the terminal and for `compare --format json`. */
import type { EnergyComparison, LoadSweep, SweepFigures } from '../compare/index';
import { formatCelsius, formatPercent, formatSi } from '../presentation/format';
import { energyCells, profileSentence } from '../report/energy-table';
import { crossoverSentence } from '../report/sweep-svg';

/** Aligned columns; the last cell is not padded. */
function table(head: string[], rows: string[][]): string[] {
  const widths = head.map((h, c) => Math.max(h.length, ...rows.map((r) => (r[c] ?? '').length)));
  const fmt = (cells: string[]) => cells.map((cell, c) => (c === cells.length - 1 ? cell : cell.padEnd(widths[c]!))).join('  ').trimEnd();
  return [fmt(head), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(fmt)];
}

export function energyText(energy: EnergyComparison): string[] {
  const { head, rows } = energyCells(energy);
  return [profileSentence(energy), ...table(head, rows)];
}

/**
 * One row per load, one column per construction: efficiency, then loss and hottest junction;
 * output voltage and ripple follow in a second table, so each stays within a terminal's width.
 */
export function sweepText(sweep: LoadSweep): string[] {
  if (!sweep.applicable) return [`No load sweep: ${sweep.reason ?? ''}.`];
  const load = (amount: number) => formatSi(amount, sweep.unit) + (sweep.fileAmount !== undefined && Math.abs(amount / sweep.fileAmount - 1) < 1e-9 ? ' *' : '');
  const cell = (f: SweepFigures | undefined, kind: 'heat' | 'output') => {
    if (!f) return 'n/a';
    return kind === 'heat'
      ? `${formatPercent(f.efficiency)} ${formatSi(f.rectifierLossW, 'W')} ${f.thermalRunaway ? 'runaway' : formatCelsius(f.hottestTjC)}`
      : `${formatSi(f.vOutAvgV, 'V')} ${formatSi(f.rippleVpp, 'V')}`;
  };
  const head = ['load', ...sweep.series.map((s) => s.label)];
  const rows = (kind: 'heat' | 'output') => sweep.points.map((p) => [load(p.amount), ...sweep.series.map((s) => cell(p.figures[s.id], kind))]);
  return [
    'Efficiency, rectifier loss, hottest Tj:',
    ...table(head, rows('heat')),
    '',
    'Output average, ripple p-p:',
    ...table(head, rows('output')),
    ...(sweep.points.some((p) => sweep.fileAmount !== undefined && Math.abs(p.amount / sweep.fileAmount - 1) < 1e-9) ? ['(* the file\'s load)'] : []),
    '',
    crossoverSentence(sweep),
    ...(sweep.limited ? [`The sweep took ${sweep.limited}.`] : []),
  ];
}

/** The sweep as JSON: SI units in the names, each point with its load and every construction's figures. */
export function sweepJson(sweep: LoadSweep): unknown {
  const unitKey = sweep.quantity === 'current' ? 'loadA' : sweep.quantity === 'power' ? 'loadW' : 'loadOhm';
  return {
    quantity: sweep.quantity, logScale: sweep.logScale, ...(sweep.fileAmount !== undefined ? { fileLoad: sweep.fileAmount } : {}),
    constructions: sweep.series,
    points: sweep.points.map((p) => ({ [unitKey]: p.amount, constructions: p.figures })),
    crossovers: sweep.crossovers.map((c) => ({ above: c.above, below: c.below, [unitKey]: c.amount })),
    ...(sweep.limited ? { limited: sweep.limited } : {}),
  };
}
