/**
 * HTML pieces shared by the report page and the editor views: figure tables with the worst
 * corner marked, the findings list, the caution box and a rectifier's display name. Every text
 * that reaches the markup goes through `escapeMarkup`.
 */
import type { FileAnalysis } from '../analysis/analyze';
import type { Finding } from '../findings/index';
import { LineIndex } from '../../../grammar/src/index';
import type { RectifierAnalysis } from '../equivalent/index';
import { isAboveExtraLowVoltage, MAINS_CAUTION } from '../ratings/index';
import type { FigureTable } from './figure-tables';
import { KIND_NAMES } from '../presentation/format';
import { escapeMarkup } from '../presentation/markup';

/** "diode bridge D1, D2, D3, D4". */
export function rectifierLabel(analysis: RectifierAnalysis): string {
  const kind = KIND_NAMES[analysis.rectifier.kind] ?? analysis.rectifier.kind;
  return `${kind} ${analysis.rectifier.devices.map((d) => d.name).join(', ')}`;
}

/** Whether outputs about this rectifier carry the mains caution (a source or output above ELV). */
export function needsCaution(analysis: RectifierAnalysis): boolean {
  const source = analysis.circuit.source;
  return isAboveExtraLowVoltage({ acRmsV: source.mainsVrms, dcV: analysis.solution.worst.vOutMaxV?.value })
    || isAboveExtraLowVoltage({ acRmsV: source.vrms });
}

/** Whether a file's outputs carry the caution: a rectifier above ELV, or a hazardous-voltage finding. */
export function fileNeedsCaution(file: FileAnalysis): boolean {
  return file.rectifiers.some(needsCaution) || file.findings.some((f) => f.code === 'hazardous-voltage');
}

/** The caution box (DESIGN.md §1). */
export function renderCautionHtml(): string {
  return `<div class="rl-caution" role="note" data-caution="mains"><strong>Caution.</strong> ${escapeMarkup(MAINS_CAUTION)}</div>`;
}

/** A figure table: one column per corner, the worst cell marked, and a rating column when any row has one. */
export function renderFigureTableHtml(table: FigureTable): string {
  const withRating = table.rows.some((r) => r.rating !== undefined);
  const head = ['Figure', ...table.corners, ...(withRating ? ['Rating'] : [])]
    .map((h) => `<th scope="col">${escapeMarkup(h)}</th>`).join('');
  const body = table.rows.map((row) => {
    const cells = row.cells.map((cell, k) => (k === row.worstIndex
      ? `<td class="rl-worst" title="worst corner">${escapeMarkup(cell)}</td>`
      : `<td>${escapeMarkup(cell)}</td>`));
    const rating = withRating ? `<td>${escapeMarkup(row.rating ?? '—')}</td>` : '';
    return `<tr><th scope="row">${escapeMarkup(row.label)}</th>${cells.join('')}${rating}</tr>`;
  });
  return `<table class="rl-table" data-table="${escapeMarkup(table.title)}"><caption class="rl-sub">${escapeMarkup(table.title)} · worst corner shaded</caption><thead><tr>${head}</tr></thead><tbody>${body.join('')}</tbody></table>`;
}

/** The findings of a file as a list with 1-based line:column and severity. */
export function renderFindingsHtml(file: FileAnalysis, findings: readonly Finding[] = file.findings): string {
  if (findings.length === 0) return '<p class="rl-sub" data-findings="0">No findings.</p>';
  const lines = new LineIndex(file.text);
  const items = findings.map((f) => {
    const at = f.uri === file.uri ? lines.positionAt(f.span.start) : undefined;
    const where = at ? `${at.line + 1}:${at.character + 1}` : f.uri;
    return `<li data-code="${escapeMarkup(f.code)}"><span class="rl-sev-${escapeMarkup(f.severity)}">${escapeMarkup(f.severity)}</span> <code>${escapeMarkup(f.code)}</code> at ${escapeMarkup(where)}: ${escapeMarkup(f.message)}</li>`;
  });
  return `<ul class="rl-findings" data-findings="${findings.length}">${items.join('\n')}</ul>`;
}

/** The solver's notes and the assumptions it made for one rectifier. */
export function renderNotesHtml(analysis: RectifierAnalysis): string {
  const notes = analysis.solution.notes;
  if (notes.length === 0) return '';
  return `<ul class="rl-assumptions">${notes.map((n) => `<li>${escapeMarkup(n)}</li>`).join('')}</ul>`;
}
