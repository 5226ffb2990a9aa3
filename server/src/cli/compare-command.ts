/** `rectilens compare <file> [--format text|json]`: the topology comparison of every bridge in a file. */
import { escapeControlChars } from '../../../grammar/src/index';
import { memoisedSolver } from '../solve/index';
import { compareEnergy, compareTopologies, operatingProfileOf, sweepLoad, verdictSummary, type ComparisonRow, type TopologyComparison } from '../compare/index';
import { energyText, sweepJson, sweepText } from './sweep-text';
import { formatCelsius, formatFixed, formatPercent, formatSi } from '../presentation/format';
import { rectifierLabel } from '../report/html-blocks';
import { shortCornerName } from '../report/report-text-annotated';
import { parseArgs } from './args';
import type { CommandIo } from './command-io';
import { analyseSingleNetlist } from './single-netlist';

export const COMPARE_USAGE = 'rectilens compare <file> [--format text|json]';

/** Runs the comparison; exit 0 when printed (also with no bridge to compare), 2 on a usage error or an unreadable file. */
export function runCompare(argv: readonly string[], io: CommandIo): number {
  const args = parseArgs(argv, { format: { values: ['text', 'json'] } });
  const file = analyseSingleNetlist(args.positional, 'compare', COMPARE_USAGE, io);
  if (!file) return 2;
  const path = args.positional[0]!;
  // One cache for the run: the sweep's point at the file's load reuses nothing else, but its constructions share their corners.
  const solve = memoisedSolver(new Map());
  const profile = operatingProfileOf(file.flat.directives);
  const comparisons = file.rectifiers.map((analysis) => {
    const comparison = compareTopologies(analysis, file.policy, solve);
    const extra = comparison.applicable ? { energy: compareEnergy(comparison, profile), sweep: sweepLoad(analysis, file.policy, solve) } : undefined;
    return { label: rectifierLabel(analysis), comparison, extra };
  });
  if (args.flags.get('format') === 'json') {
    const rectifiers = comparisons.map((c) => ({ ...c.comparison, ...(c.extra ? { energy: c.extra.energy, sweep: sweepJson(c.extra.sweep) } : {}) }));
    io.stdout(JSON.stringify({ version: 1, path, rectifiers }, null, 2) + '\n');
    return 0;
  }
  const out = [`== ${path}`];
  if (comparisons.length === 0) out.push('No rectifier recognised.');
  for (const { label, comparison, extra } of comparisons) {
    out.push('', `-- ${label} [${comparison.rectifierId}]`, ...comparisonText(comparison));
    if (extra) out.push('', 'Cost against energy:', ...energyText(extra.energy), '', 'Across the load range (worst corner at each load):', ...sweepText(extra.sweep));
  }
  // Labels and assumptions name netlist parts: no control character of theirs reaches the terminal.
  io.stdout(escapeControlChars(out.join('\n') + '\n'));
  return 0;
}

/** The comparison as aligned text: one row per construction, worst corner after each value. */
export function comparisonText(comparison: TopologyComparison): string[] {
  if (!comparison.applicable) return [`No comparison: ${comparison.reason ?? ''}.`];
  const hasCost = comparison.rows.some((r) => r.cost !== undefined);
  const head = ['construction', 'verdict', 'efficiency', 'loss', 'hottest Tj', 'inrush peak', ...(hasCost ? ['cost'] : []), 'parts'];
  const rows = comparison.rows.map((r) => rowCells(r, hasCost));
  const widths = head.map((h, c) => Math.max(h.length, ...rows.filter((r) => r.length > 2).map((r) => (r[c] ?? '').length)));
  const fmt = (cells: string[]) => cells.map((cell, c) => (c === cells.length - 1 ? cell : cell.padEnd(widths[c]!))).join('  ').trimEnd();
  const lines = [fmt(head), widths.map((w) => '-'.repeat(w)).join('  ')];
  for (const cells of rows) lines.push(cells.length > 2 ? fmt(cells) : `${cells[0]!.padEnd(widths[0]!)}  ${cells[1]}`);
  const judged = comparison.rows.flatMap((r) => [
    ...(r.verdict?.failures ?? []).map((f) => `  - ${r.label}: ${f.code}: ${f.devices.join(', ')}: ${f.text}`),
    ...(r.verdict?.unrated ?? []).map((u) => `  - ${r.label}: ${u.devices.join(', ')}: generic parts of the comparison's own; a part here needs ${u.needs}`),
  ]);
  if (judged.length) lines.push('', 'Verdicts under the file\'s policy:', ...judged);
  lines.push('', 'Assumptions:', ...comparison.assumptions.map((a) => `  - ${a}`));
  for (const r of comparison.rows) lines.push(...r.assumptions.map((a) => `  - ${r.label}: ${a}`));
  return lines;
}

function rowCells(r: ComparisonRow, hasCost: boolean): string[] {
  if (!r.applicable) return [r.label, `not applicable: ${r.reason ?? ''} (${r.construction})`];
  const at = (text: string, corner?: string) => (corner ? `${text} @${shortCornerName(corner)}` : text);
  return [
    r.label,
    r.verdict ? verdictSummary(r.verdict) : '',
    at(formatPercent(r.efficiency?.value), r.efficiency?.corner),
    at(formatSi(r.rectifierLossW?.value, 'W'), r.rectifierLossW?.corner),
    r.thermalRunaway ? 'runaway' : at(formatCelsius(r.hottestTjC?.value), r.hottestTjC?.corner),
    at(formatSi(r.inrushPeakA?.value, 'A'), r.inrushPeakA?.corner),
    ...(hasCost ? [formatFixed(r.cost, 2)] : []),
    r.construction,
  ];
}

