/**
 * The design-review record (rules/review-record.ts) as the reviewer gets it: a CSV file, one row
 * per rectifier part (RFC 4180: comma-separated, double quotes around every field, quotes doubled),
 * and an HTML table for the report. Every cell is filled: a number, or the words "not rated",
 * "not applicable" or "not computed".
 */
import { displayNumber } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import { escapeMarkup } from '../presentation/markup';
import { REVIEW_STRESSES, reviewRecord, type ReviewRow, type ReviewStress } from '../rules/review-record';

const STRESS_FIELDS = ['what', 'figure', 'unit', 'worst corner', 'rating', 'rating origin', 'used %', 'limit', 'limit origin', 'verdict'] as const;

/** The header of the CSV: the part, then the same ten fields for each stress. */
export const REVIEW_CSV_HEADER: readonly string[] = [
  'file', 'rectifier', 'reference', 'kind', 'part', 'verdict',
  ...REVIEW_STRESSES.flatMap((s) => STRESS_FIELDS.map((f) => `${s} ${f}`)),
];

/** The record of an analysed file. */
export function reviewRowsOf(file: FileAnalysis): ReviewRow[] {
  return reviewRecord({ rootUri: file.uri, netlist: file.netlist, flat: file.flat, rectifiers: file.rectifiers, nearMisses: file.nearMisses, policy: file.policy, parsed: file.parsed });
}

export function reviewCsv(files: readonly { path: string; rows: readonly ReviewRow[] }[]): string {
  const lines = [REVIEW_CSV_HEADER, ...files.flatMap(({ path, rows }) => rows.map((row) => [
    path, row.rectifier, row.reference, row.kind, row.part, row.verdict,
    ...REVIEW_STRESSES.flatMap((id) => stressCells(row.stresses[id])),
  ]))];
  return lines.map((cells) => cells.map(quote).join(',')).join('\r\n') + '\r\n';
}

function stressCells(s: ReviewStress): string[] {
  if (s.verdict === 'not applicable') return STRESS_FIELDS.map(() => 'not applicable');
  const missing = s.verdict === 'not computed' ? 'not computed' : 'not rated';
  return [
    s.label,
    s.figure !== undefined ? displayNumber(s.figure) : 'not computed',
    s.unit,
    s.corner ?? 'not computed',
    s.rating !== undefined ? displayNumber(s.rating) : missing,
    s.ratingOrigin,
    s.used !== undefined ? displayNumber(s.used * 100) : missing,
    s.limit !== undefined ? displayNumber(s.limit) : missing,
    s.limitOrigin,
    s.verdict,
  ];
}

function quote(cell: string): string {
  return `"${cell.replace(/"/g, '""')}"`;
}

/**
 * The record as an HTML table: one row per part, each stress as its figure and corner, rating and
 * share used, limit and verdict; where ratings and limits come from is said once, in numbered notes
 * under the table, so a row stays a few lines tall on paper.
 */
export function renderReviewTableHtml(rows: readonly ReviewRow[]): string {
  if (rows.length === 0) return '<p class="rl-na">No rectifier part to review.</p>';
  const notes: string[] = [];
  const noteOf = (text: string) => {
    let k = notes.indexOf(text);
    if (k < 0) k = notes.push(text) - 1;
    return `<sup>[${k + 1}]</sup>`;
  };
  const head = ['Rectifier', 'Reference', 'Part', ...REVIEW_STRESSES.map((s) => s[0]!.toUpperCase() + s.slice(1)), 'Verdict'];
  const body = rows.map((row) => `<tr class="rl-review-${escapeMarkup(row.verdict.replace(/ /g, '-'))}">` + [
    `<td>${escapeMarkup(row.rectifier)}</td>`, `<th scope="row">${escapeMarkup(row.reference)}</th>`, `<td>${escapeMarkup(row.part)}</td>`,
    ...REVIEW_STRESSES.map((id) => `<td>${stressHtml(row.stresses[id], noteOf)}</td>`),
    `<td class="rl-verdict">${escapeMarkup(row.verdict)}</td>`,
  ].join('') + '</tr>');
  return [
    '<table class="rl-table rl-review">',
    `<thead><tr>${head.map((h) => `<th scope="col">${escapeMarkup(h)}</th>`).join('')}</tr></thead>`,
    `<tbody>${body.join('\n')}</tbody></table>`,
    `<ol class="rl-assumptions rl-review-notes">${notes.map((n) => `<li>${escapeMarkup(n)}</li>`).join('')}</ol>`,
  ].join('\n');
}

function stressHtml(s: ReviewStress, noteOf: (text: string) => string): string {
  if (s.verdict === 'not applicable') return '<span class="rl-na">not applicable</span>';
  const num = (v: number | undefined) => (v === undefined ? '—' : `${displayNumber(v)} ${s.unit}`);
  const symbol = /\((.+)\)$/.exec(s.label)?.[1] ?? s.label;
  return [
    `<span class="rl-corner">${escapeMarkup(symbol)}</span>${escapeMarkup(num(s.figure))}${s.corner ? ` <span class="rl-corner">at ${escapeMarkup(s.corner)}</span>` : ''}`,
    `rating ${escapeMarkup(s.rating !== undefined ? num(s.rating) : 'not rated')}${s.rating !== undefined ? noteOf(`rating: ${s.ratingOrigin}`) : ''}${s.used !== undefined ? ` · ${escapeMarkup(displayNumber(s.used * 100))} %` : ''}`,
    `limit ${escapeMarkup(s.limit !== undefined ? num(s.limit) : 'none')}${noteOf(`limit: ${s.limitOrigin}`)}`,
    `<span class="rl-verdict">${escapeMarkup(s.verdict)}</span>`,
  ].join('<br>');
}
