/**
 * The two editor views as self-contained HTML fragments (inline SVG and one `<style>` element, no
 * scripts, no external resources): the waveforms of a rectifier and its topology comparison.
 * The VS Code webview and the language server's `rectilens/view` request show these as they are.
 */
import type { ViewContent } from '../protocol/custom-protocol';
import type { FileAnalysis } from '../analysis/analyze';
import type { RectifierAnalysis } from '../equivalent/index';
import { memoisedSolver, type CornerSolution, type SolveFn } from '../solve/index';
import { compareEnergy, compareTopologies, operatingProfileOf, sweepLoad, SWEEP_VIEW_BUDGET, type OperatingProfile, type SweepBudget } from '../compare/index';
import { renderEnergyHtml } from './energy-table';
import { renderSweepHtml } from './sweep-svg';
import type { DeratingPolicy } from '../ratings/index';
import { renderComparisonSvg, renderComparisonTable } from './comparison-svg';
import { needsCaution, rectifierLabel, renderCautionHtml, renderNotesHtml } from './html-blocks';
import { escapeMarkup } from '../presentation/markup';
import { PAGE_CSS } from './page-style';
import { drawnCorners } from './drawn-solution';
import { renderInrushSvg, renderPeriodSvg } from './waveform-svg';
import { formatFixed, formatPercent, formatSi } from '../presentation/format';
import { formatI2t } from './figure-tables';

export type { ViewContent };

/** Without a rectifier id, at most this many rectifiers are drawn, so a huge file stays quick. */
export const MAX_RECTIFIERS_PER_VIEW = 8;

/**
 * Waveforms of one rectifier (by `Rectifier.id`), or of every rectifier in the file when no id
 * is given: a steady-state period at the nominal corner and the inrush half-cycle at the corner
 * with the largest inrush. `solve` draws a rectifier its analysis solved without waveforms
 * (drawn-solution.ts); the adapter's memoised solver solves it once.
 */
export function renderWaveformView(file: FileAnalysis, rectifierId?: string, solve: SolveFn = memoisedSolver(undefined)): ViewContent {
  return renderView(file, rectifierId, 'Waveforms', (analysis) => {
    const label = rectifierLabel(analysis);
    const { period, inrush } = drawnCorners(analysis, solve);
    const periodSvg = period && renderPeriodSvg(period, { rectifierLabel: label });
    const inrushSvg = inrush && renderInrushSvg(inrush, { rectifierLabel: label });
    return [
      `<h3>One period at ${escapeMarkup(period?.name ?? '—')}</h3>`,
      period ? `<p class="rl-sub">${escapeMarkup(periodSummary(period))}</p>` : '',
      periodSvg ?? '<p class="rl-na">No steady-state waveform: the solver found no solution for this rectifier.</p>',
      `<h3>Switch-on inrush at ${escapeMarkup(inrush?.name ?? '—')}</h3>`,
      inrush ? `<p class="rl-sub">${escapeMarkup(capitalised(inrush.inrushCase ?? 'switch-on at the crest'))}, the capacitor empty: peak ${escapeMarkup(formatSi(inrush.inrushPeakA, 'A'))}, I²t ${escapeMarkup(formatI2t(inrush.inrushI2tA2s))} (largest device).</p>` : '',
      inrushSvg ?? '<p class="rl-na">No inrush waveform for this rectifier.</p>',
      renderNotesHtml(analysis),
    ].join('\n');
  });
}

/**
 * The topology comparison of one bridge (or of every rectifier in the file without an id), under
 * the file's policy. `solve` is the adapter's memoised solver; without it the variants are solved afresh.
 */
export function renderComparisonView(file: FileAnalysis, rectifierId?: string, solve: SolveFn = memoisedSolver(undefined)): ViewContent {
  const profile = operatingProfileOf(file.flat.directives);
  return renderView(file, rectifierId, 'Topology comparison', (analysis) => renderComparisonSection(analysis, file.policy, solve, profile, SWEEP_VIEW_BUDGET));
}

/**
 * The comparison chart and table of one rectifier under its file's policy, its cost against
 * energy and its load sweep, or a line saying why there is none.
 */
export function renderComparisonSection(
  analysis: RectifierAnalysis, policy: DeratingPolicy, solve: SolveFn = memoisedSolver(new Map()), profile?: OperatingProfile,
  sweepBudget?: SweepBudget,
): string {
  const comparison = compareTopologies(analysis, policy, solve);
  if (!comparison.applicable) return `<p class="rl-na" data-comparison="not-applicable">No comparison: ${escapeMarkup(comparison.reason ?? '')}.</p>`;
  return [
    '<p class="rl-sub">The same source, filter, load and corners with four bridge constructions; worst corner of each figure shown under it.</p>',
    renderComparisonSvg(comparison),
    renderComparisonTable(comparison),
    '<h3>Cost against energy</h3>',
    renderEnergyHtml(compareEnergy(comparison, profile)),
    '<h3>Across the load range</h3>',
    '<p class="rl-sub">Each construction with the parts above, solved at the file\'s corners at each load; the worst corner\'s figure at each load.</p>',
    renderSweepHtml(sweepLoad(analysis, policy, solve, sweepBudget)),
  ].join('\n');
}

function renderView(file: FileAnalysis, rectifierId: string | undefined, what: string, section: (a: RectifierAnalysis) => string): ViewContent {
  const chosen = rectifierId === undefined
    ? file.rectifiers.slice(0, MAX_RECTIFIERS_PER_VIEW)
    : file.rectifiers.filter((r) => r.rectifier.id === rectifierId);
  const name = fileName(file.uri);
  const title = chosen.length === 1 ? `${what}: ${rectifierLabel(chosen[0]!)} (${name})` : `${what}: ${name}`;
  const parts = [`<style>${PAGE_CSS}</style>`, `<div class="rl-page" data-view="${what === 'Waveforms' ? 'waveforms' : 'comparison'}">`, `<h1>${escapeMarkup(title)}</h1>`];
  if (chosen.length === 0) {
    parts.push(rectifierId === undefined
      ? '<p class="rl-na">No rectifier was recognised in this file.</p>'
      : `<p class="rl-na">No rectifier with id ${escapeMarkup(rectifierId)} in this file (it may have changed since the view was asked for).</p>`);
  }
  for (const analysis of chosen) {
    parts.push(`<section class="rl-card" data-rectifier="${escapeMarkup(analysis.rectifier.id)}">`, `<h2>${escapeMarkup(rectifierLabel(analysis))}</h2>`);
    if (needsCaution(analysis)) parts.push(renderCautionHtml());
    parts.push(section(analysis), '</section>');
  }
  if (rectifierId === undefined && file.rectifiers.length > chosen.length) {
    parts.push(`<p class="rl-sub">Showing the first ${chosen.length} of ${file.rectifiers.length} rectifiers; open the view from a rectifier's code lens for the others.</p>`);
  }
  parts.push('</div>');
  return { title, body: parts.join('\n') };
}

function periodSummary(c: CornerSolution): string {
  return `Output ${formatSi(c.vOutAvgV, 'V')} average, ripple ${formatSi(c.rippleVpp, 'V')} p-p, efficiency ${formatPercent(c.efficiency)}, power factor ${formatFixed(c.powerFactor, 3)}.`;
}

function fileName(uri: string): string {
  const tail = uri.split(/[\\/]/).pop() ?? uri;
  try {
    return decodeURIComponent(tail);
  } catch {
    return tail;
  }
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
