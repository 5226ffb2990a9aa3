/**
 * Our time chart: one or more panels stacked on a shared time axis, each with its own labelled
 * value axis and a legend row above it. Voltages and currents get separate panels rather than
 * two scales on one plot, so every trace can be read against the axis beside it.
 */
import { coord, escapeMarkup, niceTicks, tickLabel } from '../presentation/markup';

/** One trace: `id` goes into `data-series` so tests and styles can find it. */
export interface ChartSeries {
  id: string;
  name: string;
  colour: string;
  /** Time of each sample, in the chart's time unit. */
  t: readonly number[];
  y: readonly number[];
  dashed?: boolean;
  /** Leave out the stretches where the trace rests at zero. */
  hideIdle?: boolean;
  /** Line width; wider traces drawn first stay visible under narrower ones that coincide. */
  strokeWidthPx?: number;
}

export interface ChartPanel {
  /** Axis title without the unit, e.g. "Voltage". */
  quantity: string;
  unit: string;
  series: ChartSeries[];
}

export interface TimeChart {
  /** Used for the SVG's accessible title. */
  title: string;
  /** Stable id of the chart (`data-chart`), e.g. "period" or "inrush". */
  chartId: string;
  timeUnit: string;
  panels: ChartPanel[];
  widthPx?: number;
}

const MARGIN = { left: 64, right: 20, top: 12, bottom: 40 };
const PANEL_HEIGHT_PX = 170;
const LEGEND_HEIGHT_PX = 22;
const PANEL_GAP_PX = 14;

/** Renders a stacked time chart as a standalone `<svg>` element. */
export function renderTimeChart(chart: TimeChart): string {
  const width = chart.widthPx ?? 720;
  const plotW = width - MARGIN.left - MARGIN.right;
  const allT = chart.panels.flatMap((p) => p.series.flatMap((s) => s.t));
  const t0 = allT.length ? Math.min(...allT) : 0;
  const t1 = allT.length ? Math.max(...allT) : 1;
  const time = niceTicks(t0, t1, 8);
  const x = (t: number) => MARGIN.left + ((t - time.lo) / (time.hi - time.lo)) * plotW;
  const parts: string[] = [];
  let top = MARGIN.top;
  chart.panels.forEach((panel, index) => {
    parts.push(renderPanel(panel, top, width, x, time.ticks, index === chart.panels.length - 1));
    top += LEGEND_HEIGHT_PX + PANEL_HEIGHT_PX + PANEL_GAP_PX;
  });
  const height = top - PANEL_GAP_PX + MARGIN.bottom;
  const axisY = height - MARGIN.bottom + 30;
  parts.push(`<text class="rl-axis-title" x="${coord(MARGIN.left + plotW / 2)}" y="${axisY}" text-anchor="middle">Time (${escapeMarkup(chart.timeUnit)})</text>`);
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" class="rl-chart" data-chart="${escapeMarkup(chart.chartId)}" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeMarkup(chart.title)}">`,
    `<title>${escapeMarkup(chart.title)}</title>`,
    CHART_STYLE,
    `<rect class="rl-bg" x="0" y="0" width="${width}" height="${height}" rx="6"/>`,
    ...parts,
    '</svg>',
  ].join('\n');
}

function renderPanel(panel: ChartPanel, top: number, width: number, x: (t: number) => number, timeTicks: number[], last: boolean): string {
  const plotTop = top + LEGEND_HEIGHT_PX;
  const plotBottom = plotTop + PANEL_HEIGHT_PX;
  const left = MARGIN.left;
  const right = width - MARGIN.right;
  const ys = panel.series.flatMap((s) => s.y).filter(Number.isFinite);
  const values = niceTicks(Math.min(0, ...ys), Math.max(0, ...ys), 5);
  const y = (v: number) => plotBottom - ((v - values.lo) / (values.hi - values.lo)) * PANEL_HEIGHT_PX;
  const out: string[] = [`<g class="rl-panel" data-quantity="${escapeMarkup(panel.quantity.toLowerCase())}">`];
  out.push(`<rect class="rl-plot" x="${left}" y="${plotTop}" width="${right - left}" height="${PANEL_HEIGHT_PX}"/>`);
  for (const v of values.ticks) {
    const yy = coord(y(v));
    out.push(`<line class="${v === 0 ? 'rl-zero' : 'rl-grid'}" x1="${left}" x2="${right}" y1="${yy}" y2="${yy}"/>`);
    out.push(`<text class="rl-tick" x="${left - 6}" y="${yy}" text-anchor="end" dominant-baseline="middle">${escapeMarkup(tickLabel(v, values.ticks))}</text>`);
  }
  for (const t of timeTicks) {
    const xx = coord(x(t));
    out.push(`<line class="rl-grid rl-vgrid" x1="${xx}" x2="${xx}" y1="${plotTop}" y2="${plotBottom}"/>`);
    if (last) out.push(`<text class="rl-tick" x="${xx}" y="${plotBottom + 15}" text-anchor="middle">${escapeMarkup(tickLabel(t, timeTicks))}</text>`);
  }
  const axisX = 16;
  const midY = coord((plotTop + plotBottom) / 2);
  out.push(`<text class="rl-axis-title" x="${axisX}" y="${midY}" text-anchor="middle" transform="rotate(-90 ${axisX} ${midY})">${escapeMarkup(`${panel.quantity} (${panel.unit})`)}</text>`);
  for (const s of panel.series) out.push(renderTrace(s, x, y));
  out.push(renderLegend(panel.series, left, top + 14));
  out.push('</g>');
  return out.join('\n');
}

function renderTrace(s: ChartSeries, x: (t: number) => number, y: (v: number) => number): string {
  const dash = s.dashed ? ' stroke-dasharray="6 4"' : '';
  const width = s.strokeWidthPx !== undefined ? ` stroke-width="${coord(s.strokeWidthPx)}"` : '';
  return `<path class="rl-trace" data-series="${escapeMarkup(s.id)}" fill="none" stroke="${escapeMarkup(s.colour)}"${dash}${width} d="${tracePath(s, x, y)}"><title>${escapeMarkup(s.name)}</title></path>`;
}

/**
 * The path data of a trace. With `hideIdle`, stretches where the trace rests at zero are left
 * out (a device current is zero most of the period, and a dozen zero lines would bury the axis);
 * the sample on either side of a pulse is kept so each pulse starts and ends on the axis.
 */
function tracePath(s: ChartSeries, x: (t: number) => number, y: (v: number) => number): string {
  const peak = Math.max(0, ...s.y.filter(Number.isFinite).map(Math.abs));
  const idle = (k: number) => !(Math.abs(s.y[k] ?? 0) > peak * 1e-3);
  const shown = (k: number) => Number.isFinite(s.y[k]) && (!s.hideIdle || !idle(k) || (k > 0 && !idle(k - 1)) || (k + 1 < s.y.length && !idle(k + 1)));
  const parts: string[] = [];
  let pen = false;
  for (let k = 0; k < s.t.length; k++) {
    if (!shown(k)) { pen = false; continue; }
    parts.push(`${pen ? 'L' : 'M'}${coord(x(s.t[k]!))},${coord(y(s.y[k]!))}`);
    pen = true;
  }
  return parts.join(' ');
}

/** The legend: a short stroke sample and the name of each trace, laid out left to right. */
function renderLegend(series: readonly ChartSeries[], left: number, baseline: number): string {
  const out: string[] = ['<g class="rl-legend">'];
  let at = left;
  for (const s of series) {
    const dash = s.dashed ? ' stroke-dasharray="6 4"' : '';
    out.push(`<line x1="${at}" x2="${at + 18}" y1="${baseline - 4}" y2="${baseline - 4}" stroke="${escapeMarkup(s.colour)}" stroke-width="3"${dash}/>`);
    out.push(`<text class="rl-legend-text" data-legend="${escapeMarkup(s.id)}" x="${at + 23}" y="${baseline}">${escapeMarkup(s.name)}</text>`);
    at += 23 + Math.max(60, s.name.length * 6.6) + 16;
  }
  out.push('</g>');
  return out.join('\n');
}

/** Styles inside the SVG, so a chart reads the same pasted anywhere. */
const CHART_STYLE = `<style>
.rl-bg{fill:#fcfbf8}
.rl-plot{fill:#ffffff;stroke:#c9c4b8;stroke-width:1}
.rl-grid{stroke:#ebe7de;stroke-width:1}
.rl-zero{stroke:#9c968a;stroke-width:1}
.rl-tick{font:11px system-ui,sans-serif;fill:#5b574f}
.rl-axis-title{font:600 12px system-ui,sans-serif;fill:#34312c}
.rl-legend-text{font:12px system-ui,sans-serif;fill:#34312c}
.rl-trace{stroke-linejoin:round}
.rl-trace:not([stroke-width]){stroke-width:1.8}
</style>`;

/** Trace colours of our own: a calm set that stays apart on a light background. */
export const TRACE_COLOURS = {
  sourceVoltage: '#1f6f78',
  outputVoltage: '#c2571a',
  sourceCurrent: '#5a4fa0',
  devices: ['#b0305c', '#3d7d2e', '#a07a12', '#2f5da8', '#7a3f98', '#4f6b6b'],
} as const;
