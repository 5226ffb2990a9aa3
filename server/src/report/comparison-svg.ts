/**
 * The topology comparison drawn: horizontal bars of the worst rectifier loss per construction
 * (efficiency written beside each bar), and the full table as HTML. Every row carries
 * `data-variant="<id>"` (`as-drawn`, `silicon`, `schottky`, `hybrid`, `synchronous`).
 */
import { verdictSummary, type ComparisonRow, type TopologyComparison } from '../compare/index';
import { coord, escapeMarkup, niceTicks, tickLabel } from '../presentation/markup';
import { formatCelsius, formatFixed, formatPercent, formatSi } from '../presentation/format';

/** One colour per construction, shared by the bars and the load-sweep charts. */
export const SERIES_COLOURS: Readonly<Record<ComparisonRow['id'], string>> = {
  'as-drawn': '#5b574f',
  silicon: '#b36b2c',
  schottky: '#3f7f8c',
  hybrid: '#6d5aa8',
  synchronous: '#3d7d2e',
};

const LABEL_W = 170;
const ROW_H = 34;
const TOP = 34;

/** The loss bars as a standalone `<svg>`. */
export function renderComparisonSvg(comparison: TopologyComparison, widthPx = 720): string {
  const rows = comparison.rows;
  const losses = rows.map((r) => r.rectifierLossW?.value ?? 0);
  const scale = niceTicks(0, Math.max(...losses, 1e-6), 5);
  const plotW = widthPx - LABEL_W - 120;
  const x = (v: number) => LABEL_W + (v / scale.hi) * plotW;
  const height = TOP + rows.length * ROW_H + 40;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" class="rl-compare" data-chart="comparison" viewBox="0 0 ${widthPx} ${height}" width="${widthPx}" height="${height}" role="img" aria-label="Rectifier loss by construction">`,
    '<title>Rectifier loss by construction (worst corner)</title>',
    COMPARE_STYLE,
    `<rect class="rc-bg" x="0" y="0" width="${widthPx}" height="${height}" rx="6"/>`,
    `<text class="rc-head" x="${LABEL_W}" y="20">Rectifier loss at the worst corner (W) · efficiency beside each bar</text>`,
  ];
  for (const t of scale.ticks) {
    const xx = coord(x(t));
    out.push(`<line class="rc-grid" x1="${xx}" x2="${xx}" y1="${TOP - 4}" y2="${TOP + rows.length * ROW_H}"/>`);
    out.push(`<text class="rc-tick" x="${xx}" y="${TOP + rows.length * ROW_H + 16}" text-anchor="middle">${escapeMarkup(tickLabel(t, scale.ticks))}</text>`);
  }
  rows.forEach((row, k) => out.push(renderBarRow(row, TOP + k * ROW_H, x)));
  out.push(`<text class="rc-axis" x="${coord(LABEL_W + plotW / 2)}" y="${height - 6}" text-anchor="middle">Loss (W)</text>`);
  out.push('</svg>');
  return out.join('\n');
}

function renderBarRow(row: ComparisonRow, top: number, x: (v: number) => number): string {
  const mid = top + ROW_H / 2;
  const parts = [`<g class="rc-row" data-variant="${escapeMarkup(row.id)}">`];
  parts.push(`<text class="rc-label" x="${LABEL_W - 10}" y="${coord(mid)}" text-anchor="end" dominant-baseline="middle">${escapeMarkup(row.label)}</text>`);
  if (!row.applicable || row.rectifierLossW === undefined) {
    parts.push(`<rect class="rc-na" x="${LABEL_W}" y="${top + 7}" width="${coord(x(0) - LABEL_W + 150)}" height="${ROW_H - 14}"/>`);
    parts.push(`<text class="rc-note" x="${LABEL_W + 8}" y="${coord(mid)}" dominant-baseline="middle">not applicable</text>`);
  } else {
    const w = Math.max(2, x(row.rectifierLossW.value) - LABEL_W);
    parts.push(`<rect class="rc-bar" x="${LABEL_W}" y="${top + 7}" width="${coord(w)}" height="${ROW_H - 14}" fill="${SERIES_COLOURS[row.id]}" rx="3"><title>${escapeMarkup(`${row.label}: ${formatSi(row.rectifierLossW.value, 'W')} at ${row.rectifierLossW.corner}`)}</title></rect>`);
    const text = `${formatSi(row.rectifierLossW.value, 'W')} · η ${formatPercent(row.efficiency?.value)}`;
    parts.push(`<text class="rc-value" x="${coord(LABEL_W + w + 6)}" y="${coord(mid)}" dominant-baseline="middle">${escapeMarkup(text)}</text>`);
  }
  parts.push('</g>');
  return parts.join('');
}

/** The comparison as an HTML table (a fragment), with the shared and per-row assumptions under it. */
export function renderComparisonTable(comparison: TopologyComparison): string {
  const hasCost = comparison.rows.some((r) => r.cost !== undefined);
  const head = ['Construction', 'Parts', 'Verdict', 'Efficiency (worst)', 'Rectifier loss (worst)', 'Hottest Tj', 'Inrush peak', ...(hasCost ? ['Cost'] : [])];
  const body = comparison.rows.map((row) => {
    const cells = row.applicable
      ? [
        verdictCell(row),
        cornerCell(formatPercent(row.efficiency?.value), row.efficiency?.corner),
        cornerCell(formatSi(row.rectifierLossW?.value, 'W'), row.rectifierLossW?.corner),
        cornerCell(`${formatCelsius(row.hottestTjC?.value)}${row.thermalRunaway ? ' (runaway)' : ''}`, row.hottestTjC ? `${row.hottestTjC.device}, ${row.hottestTjC.corner}` : undefined),
        cornerCell(formatSi(row.inrushPeakA?.value, 'A'), row.inrushPeakA?.corner),
        ...(hasCost ? [`<td>${row.cost === undefined ? '—' : escapeMarkup(formatFixed(row.cost, 2))}</td>`] : []),
      ]
      : [`<td colspan="${hasCost ? 6 : 5}" class="rl-na">not applicable: ${escapeMarkup(row.reason ?? '')}</td>`];
    return `<tr data-variant="${escapeMarkup(row.id)}"><th scope="row">${escapeMarkup(row.label)}</th><td>${escapeMarkup(row.construction)}</td>${cells.join('')}</tr>`;
  });
  const notes = comparison.rows.flatMap((r) => [
    ...(r.verdict?.failures ?? []).map((f) => `<li class="rl-fails"><b>${escapeMarkup(r.label)}:</b> ${escapeMarkup(`${f.code}: ${f.devices.join(', ')}: ${f.text}`)}</li>`),
    ...(r.verdict?.unrated ?? []).map((u) => `<li><b>${escapeMarkup(r.label)}:</b> ${escapeMarkup(`${u.devices.join(', ')}: generic parts of the comparison's own; a part here needs ${u.needs}`)}</li>`),
    ...r.assumptions.map((a) => `<li><b>${escapeMarkup(r.label)}:</b> ${escapeMarkup(a)}</li>`),
  ]);
  const shared = comparison.assumptions.map((a) => `<li>${escapeMarkup(a)}</li>`);
  return [
    '<table class="rl-table rl-compare-table">',
    `<thead><tr>${head.map((h) => `<th scope="col">${escapeMarkup(h)}</th>`).join('')}</tr></thead>`,
    `<tbody>${body.join('\n')}</tbody></table>`,
    `<ul class="rl-assumptions">${[...shared, ...notes].join('\n')}</ul>`,
  ].join('\n');
}

function cornerCell(value: string, corner: string | undefined): string {
  return `<td>${escapeMarkup(value)}${corner ? `<span class="rl-corner">${escapeMarkup(corner)}</span>` : ''}</td>`;
}

const COMPARE_STYLE = `<style>
.rc-bg{fill:#fcfbf8}
.rc-grid{stroke:#ebe7de;stroke-width:1}
.rc-tick{font:11px system-ui,sans-serif;fill:#5b574f}
.rc-head{font:600 12px system-ui,sans-serif;fill:#34312c}
.rc-axis{font:600 12px system-ui,sans-serif;fill:#34312c}
.rc-label{font:600 13px system-ui,sans-serif;fill:#34312c}
.rc-value{font:12px system-ui,sans-serif;fill:#34312c}
.rc-note{font:italic 12px system-ui,sans-serif;fill:#7a756b}
.rc-na{fill:none;stroke:#c9c4b8;stroke-dasharray:4 3}
</style>`;

/** Pass, the rules it fails, or that its parts are not rated: only a passing row is proposed. */
function verdictCell(row: ComparisonRow): string {
  const v = row.verdict;
  if (!v) return '<td></td>';
  const cls = v.status === 'pass' ? 'rl-pass' : v.status === 'fail' ? 'rl-fail' : 'rl-unjudged';
  return `<td class="${cls}">${escapeMarkup(verdictSummary(v))}</td>`;
}
