/**
 * The load sweep drawn: one chart per figure (efficiency, rectifier loss, hottest junction,
 * output voltage, ripple) with the constructions as series over a shared load axis (log where the
 * sweep is), the file's own load marked by a dashed upright line, and the crossovers listed
 * under the charts. Each chart carries `data-chart="sweep-<figure>"`, each trace
 * `data-series="<construction id>"`.
 */
import type { Crossover, LoadSweep, SeriesId, SweepFigures } from '../compare/index';
import { coord, escapeMarkup, niceTicks, tickLabel } from '../presentation/markup';
import { formatSi } from '../presentation/format';
import { SERIES_COLOURS } from './comparison-svg';

export interface SweepFigure {
  id: 'efficiency' | 'loss' | 'tj' | 'vout' | 'ripple';
  title: string;
  unit: string;
  /** Value plotted, in the axis unit. */
  value: (f: SweepFigures) => number | undefined;
}

/** The charted figures, in order (worst over the corners at each load, as the comparison's rows). */
export const SWEEP_FIGURES: readonly SweepFigure[] = [
  { id: 'efficiency', title: 'Efficiency (lowest over the corners)', unit: '%', value: (f) => (f.efficiency !== undefined ? f.efficiency * 100 : undefined) },
  { id: 'loss', title: 'Rectifier loss (highest over the corners)', unit: 'W', value: (f) => f.rectifierLossW },
  { id: 'tj', title: 'Hottest junction', unit: '°C', value: (f) => f.hottestTjC },
  { id: 'vout', title: 'Output voltage, average (lowest over the corners)', unit: 'V', value: (f) => f.vOutAvgV },
  { id: 'ripple', title: 'Output ripple, peak to peak (largest over the corners)', unit: 'V', value: (f) => f.rippleVpp },
];

const W = 600;
const H = 250;
const M = { left: 60, right: 16, top: 44, bottom: 40 };

/** Every figure's chart, and the crossovers in words. */
export function renderSweepHtml(sweep: LoadSweep): string {
  if (!sweep.applicable) return `<p class="rl-na" data-sweep="not-applicable">No load sweep: ${escapeMarkup(sweep.reason ?? '')}.</p>`;
  const charts = SWEEP_FIGURES.map((f) => renderSweepChart(sweep, f));
  return [
    `<div class="rl-sweep" data-sweep="${escapeMarkup(sweep.rectifierId)}" style="display:flex;flex-wrap:wrap;gap:10px">`,
    ...charts,
    '</div>',
    `<p class="rl-sub" data-crossovers="${sweep.crossovers.length}">${escapeMarkup(crossoverSentence(sweep))}</p>`,
    sweep.limited ? `<p class="rl-sub">${escapeMarkup(`The sweep took ${sweep.limited}.`)}</p>` : '',
  ].join('\n');
}

/** The crossovers as one sentence (shared by the terminal and the pages). */
export function crossoverSentence(sweep: LoadSweep): string {
  if (sweep.crossovers.length === 0) return 'No construction overtakes another in efficiency over the swept loads.';
  const label = (id: SeriesId) => sweep.series.find((s) => s.id === id)?.label ?? id;
  const one = (c: Crossover) => `${label(c.above)} overtakes ${label(c.below)} above ${formatSi(c.amount, sweep.unit)}`;
  return `Crossovers in efficiency (${sweep.quantity === 'resistance' ? 'a smaller resistance is more load' : 'from light to heavy load'}): ${sweep.crossovers.map(one).join('; ')}.`;
}

/** One figure's chart as a standalone `<svg>`. */
export function renderSweepChart(sweep: LoadSweep, figure: SweepFigure): string {
  const xs = sweep.points.map((p) => p.amount);
  const reverse = sweep.quantity === 'resistance';
  const t = (a: number) => (sweep.logScale ? Math.log10(a) : reverse ? 1 / a : a);
  const [t0, t1] = [Math.min(...xs.map(t)), Math.max(...xs.map(t))];
  const plotW = W - M.left - M.right;
  const plotH = H - M.top - M.bottom;
  // A resistance sweep runs from light (large Ω) on the left to heavy (small Ω) on the right.
  const flip = reverse && sweep.logScale;
  const x = (a: number) => M.left + ((flip ? t1 - t(a) : t(a) - t0) / (t1 - t0 || 1)) * plotW;
  const values = sweep.points.flatMap((p) => sweep.series.map((s) => (p.figures[s.id] ? figure.value(p.figures[s.id]!) : undefined))).filter((v): v is number => v !== undefined && Number.isFinite(v));
  const scale = niceTicks(values.length ? Math.min(...values) : 0, values.length ? Math.max(...values) : 1, 5);
  const y = (v: number) => M.top + plotH - ((v - scale.lo) / (scale.hi - scale.lo || 1)) * plotH;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" class="rl-chart rl-sweep-chart" data-chart="sweep-${figure.id}" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${escapeMarkup(figure.title)} against load">`,
    `<title>${escapeMarkup(`${figure.title} against load`)}</title>`,
    SWEEP_STYLE,
    `<rect class="sw-bg" x="0" y="0" width="${W}" height="${H}" rx="6"/>`,
    `<text class="sw-head" x="${M.left}" y="16">${escapeMarkup(`${figure.title} (${figure.unit})`)}</text>`,
    `<rect class="sw-plot" x="${M.left}" y="${M.top}" width="${plotW}" height="${plotH}"/>`,
  ];
  for (const v of scale.ticks) {
    const yy = coord(y(v));
    out.push(`<line class="sw-grid" x1="${M.left}" x2="${M.left + plotW}" y1="${yy}" y2="${yy}"/>`);
    out.push(`<text class="sw-tick" x="${M.left - 6}" y="${yy}" text-anchor="end" dominant-baseline="middle">${escapeMarkup(tickLabel(v, scale.ticks))}</text>`);
  }
  for (const a of loadTicks(Math.min(...xs), Math.max(...xs), sweep.logScale)) {
    const xx = coord(x(a));
    out.push(`<line class="sw-grid" x1="${xx}" x2="${xx}" y1="${M.top}" y2="${M.top + plotH}"/>`);
    out.push(`<text class="sw-tick" x="${xx}" y="${M.top + plotH + 14}" text-anchor="middle">${escapeMarkup(formatSi(a, sweep.unit))}</text>`);
  }
  out.push(`<text class="sw-axis" x="${coord(M.left + plotW / 2)}" y="${H - 6}" text-anchor="middle">${escapeMarkup(axisTitle(sweep))}</text>`);
  if (sweep.fileAmount !== undefined) {
    const xx = coord(x(sweep.fileAmount));
    // The label sits inside the plot, on the side of the mark with room for it.
    const right = x(sweep.fileAmount) > M.left + plotW / 2;
    const tx = coord(x(sweep.fileAmount) + (right ? -4 : 4));
    out.push(`<g data-file-load="${escapeMarkup(formatSi(sweep.fileAmount, sweep.unit))}"><line class="sw-mark" x1="${xx}" x2="${xx}" y1="${M.top}" y2="${M.top + plotH}"/><text class="sw-mark-text" x="${tx}" y="${M.top + 12}" text-anchor="${right ? 'end' : 'start'}">file's load</text></g>`);
  }
  for (const s of sweep.series) {
    const path = sweep.points.flatMap((p) => {
      const f = p.figures[s.id];
      const v = f ? figure.value(f) : undefined;
      return v === undefined || !Number.isFinite(v) ? [] : [`${coord(x(p.amount))},${coord(y(v))}`];
    });
    if (path.length === 0) continue;
    const dash = s.id === 'as-drawn' ? ' stroke-dasharray="7 4" stroke-width="3"' : ' stroke-width="2"';
    out.push(`<path class="sw-trace" data-series="${escapeMarkup(s.id)}" fill="none" stroke="${SERIES_COLOURS[s.id]}"${dash} d="M${path.join(' L')}"><title>${escapeMarkup(s.label)}</title></path>`);
  }
  out.push(renderLegend(sweep));
  out.push('</svg>');
  return out.join('\n');
}

function renderLegend(sweep: LoadSweep): string {
  const out = ['<g class="sw-legend">'];
  let at = M.left;
  for (const s of sweep.series) {
    const dash = s.id === 'as-drawn' ? ' stroke-dasharray="7 4"' : '';
    out.push(`<line x1="${at}" x2="${at + 16}" y1="30" y2="30" stroke="${SERIES_COLOURS[s.id]}" stroke-width="3"${dash}/>`);
    // "Silicon bridge" → "Silicon": every series is a bridge, and five full names overflow the width.
    const name = s.label.replace(/ bridge$/, '');
    out.push(`<text class="sw-legend-text" data-legend="${escapeMarkup(s.id)}" x="${at + 20}" y="34">${escapeMarkup(name)}<title>${escapeMarkup(s.label)}</title></text>`);
    at += 20 + name.length * 6.4 + 16;
  }
  out.push('</g>');
  return out.join('');
}

function axisTitle(sweep: LoadSweep): string {
  const what = sweep.quantity === 'current' ? 'Load current' : sweep.quantity === 'power' ? 'Load power' : 'Load resistance (more load to the right)';
  return `${what} (${sweep.unit})${sweep.logScale ? ', log scale' : ''}`;
}

/** Load ticks: 1-2-5 steps of each decade on a log axis, else the usual nice steps. */
export function loadTicks(lo: number, hi: number, logScale: boolean): number[] {
  if (!logScale) return niceTicks(lo, hi, 6).ticks.filter((v) => v >= lo * 0.999 && v <= hi * 1.001);
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    for (const m of [1, 2, 5]) {
      const v = Number((m * 10 ** e).toPrecision(6));
      if (v >= lo * 0.999 && v <= hi * 1.001) out.push(v);
    }
  }
  return out;
}

const SWEEP_STYLE = `<style>
.sw-bg{fill:#fcfbf8}
.sw-plot{fill:#ffffff;stroke:#c9c4b8;stroke-width:1}
.sw-grid{stroke:#ebe7de;stroke-width:1}
.sw-tick{font:11px system-ui,sans-serif;fill:#5b574f}
.sw-head{font:600 12.5px system-ui,sans-serif;fill:#34312c}
.sw-axis{font:600 11.5px system-ui,sans-serif;fill:#34312c}
.sw-legend-text{font:11.5px system-ui,sans-serif;fill:#34312c}
.sw-mark{stroke:#8a4b2f;stroke-width:1.4;stroke-dasharray:3 3}
.sw-mark-text{font:italic 10.5px system-ui,sans-serif;fill:#8a4b2f}
.sw-trace{stroke-linejoin:round;stroke-linecap:round}
</style>`;
