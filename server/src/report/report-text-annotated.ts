/**
 * The terminal report of `rectilens report <file>`: the netlist as written with the worst
 * figures of each rectifier device beside its card (after `;`, so the text stays a valid
 * netlist), then the tables per rectifier, the findings and the caution.
 */
import { escapeControlChars } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import { LineIndex } from '../../../grammar/src/index';
import type { RectifierAnalysis } from '../equivalent/index';
import { MAINS_CAUTION } from '../ratings/index';
import { cornerConditionTable, deviceFigureTables, rectifierFigureTable, reverseRatingV, type FigureTable } from './figure-tables';
import { capacitorFigureTables } from './capacitor-tables';
import { loadCompositionText } from '../presentation/operating-conditions';
import { formatCelsius, formatSi } from '../presentation/format';
import { fileNeedsCaution, rectifierLabel } from './html-blocks';

/** Widest column the annotations are aligned to; longer cards get theirs two spaces after. */
const ANNOTATION_COLUMN_MAX = 44;

/**
 * The annotation of each annotated line (0-based line → text without the leading `; `): every
 * rectifier device's worst PIV against its rating, loss and junction temperature. A device inside
 * a subcircuit is annotated on the top-level X card that places it, with its name.
 */
export function annotateDeviceLines(file: FileAnalysis): Map<number, string> {
  const lines = new LineIndex(file.text);
  const byLine = new Map<number, string[]>();
  for (const analysis of file.rectifiers) {
    analysis.devices.forEach((device, k) => {
      const origin = device.ref.origin;
      const outer = origin.chain[0];
      const place = outer ? { uri: outer.uri, start: outer.span.start } : { uri: origin.uri, start: origin.span.start };
      if (place.uri !== file.uri) return;
      const line = lines.positionAt(place.start).line;
      const text = deviceAnnotation(analysis, k, outer !== undefined);
      byLine.set(line, [...(byLine.get(line) ?? []), text]);
    });
  }
  return new Map([...byLine].map(([line, notes]) => [line, notes.join(' | ')]));
}

function deviceAnnotation(analysis: RectifierAnalysis, k: number, named: boolean): string {
  const device = analysis.devices[k];
  const worst = device?.figures.worst;
  if (!worst || !device) return 'not solved';
  const rating = reverseRatingV(device);
  const piv = `PIV ${formatSi(worst.pivV?.value, 'V')}${rating !== undefined ? `/${formatSi(rating, 'V')}` : ''}`;
  const tj = worst.thermalRunaway ? 'Tj runaway' : `Tj ${formatCelsius(worst.tjC?.value)}`;
  const text = `${piv} · ${formatSi(worst.lossW?.value, 'W')} · ${tj}`;
  return named ? `${worst.name}: ${text}` : text;
}

/**
 * The whole terminal report of one file. Netlist text can hold control characters (an escape
 * sequence in a name or a comment); they are written as escapes (`\x1B`) so they cannot drive
 * the terminal.
 */
export function renderAnnotatedText(file: FileAnalysis, displayPath: string = file.uri): string {
  const out: string[] = [`== ${displayPath}`, ''];
  out.push(...annotatedNetlist(file), '');
  if (file.rectifiers.length === 0) out.push('No rectifier recognised.', '');
  for (const analysis of file.rectifiers) out.push(...rectifierSection(analysis));
  out.push(...findingLines(file, displayPath));
  if (fileNeedsCaution(file)) out.push('', `CAUTION: ${MAINS_CAUTION}`);
  return escapeControlChars(out.join('\n') + '\n');
}

function annotatedNetlist(file: FileAnalysis): string[] {
  // A file in another encoding was not parsed; its text read as UTF-8 is noise, so it is not printed.
  const encoding = file.findings.find((f) => f.code === 'file-encoding' && f.uri === file.uri);
  if (encoding) return [`(the netlist is not shown: ${encoding.message})`];
  const notes = annotateDeviceLines(file);
  const text = file.text.replace(/\r\n?/g, '\n').replace(/\n$/, '');
  const rows = text.split('\n');
  const width = Math.min(ANNOTATION_COLUMN_MAX, Math.max(0, ...[...notes.keys()].map((l) => (rows[l] ?? '').trimEnd().length)));
  return rows.map((row, line) => {
    const note = notes.get(line);
    if (!note) return row;
    const card = row.trimEnd();
    return `${card.padEnd(width)}  ; ${note}`;
  });
}

function rectifierSection(analysis: RectifierAnalysis): string[] {
  const out = [`-- ${rectifierLabel(analysis)} [${analysis.rectifier.id}]`, '   corners: line low/nom/high × ambient nom/hot (and load, part vertex where given); * marks the worst corner of a row', ''];
  out.push(`   load: ${loadCompositionText(analysis.rectifier.surroundings.load)}`, '');
  out.push(...formatTextTable(cornerConditionTable(analysis)), '');
  out.push(...formatTextTable(rectifierFigureTable(analysis)), '');
  for (const table of [...deviceFigureTables(analysis), ...capacitorFigureTables(analysis)]) out.push(...formatTextTable(table), '');
  if (analysis.solution.notes.length) out.push('Notes:', ...analysis.solution.notes.map((n) => `  - ${n}`), '');
  return out;
}

function findingLines(file: FileAnalysis, displayPath: string): string[] {
  const lines = new LineIndex(file.text);
  const out = [`Findings: ${file.findings.length}`];
  for (const f of file.findings) {
    const at = lines.positionAt(f.span.start);
    const where = f.uri === file.uri ? `${displayPath}:${at.line + 1}:${at.character + 1}` : f.uri;
    out.push(`${where}: ${f.severity} ${f.code}: ${f.message}`);
  }
  return out;
}

/** Short column heads for the corners: "high-line hot" → "high hot", "nominal-line nominal" → "nom nom". */
export function shortCornerName(name: string): string {
  return name.replace('-line', '').replace(/nominal/g, 'nom').replace('-load', '');
}

/** A plain-text table: the worst cell of each row marked with `*`, a rating column when any row has one. */
export function formatTextTable(table: FigureTable): string[] {
  const withRating = table.rows.some((r) => r.rating !== undefined);
  const head = [table.title, ...table.corners.map(shortCornerName), ...(withRating ? ['rating'] : [])];
  const body = table.rows.map((row) => [
    row.label,
    ...row.cells.map((cell, k) => (k === row.worstIndex ? `${cell}*` : cell)),
    ...(withRating ? [row.rating ?? '—'] : []),
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...body.map((r) => (r[c] ?? '').length)));
  const fmt = (cells: string[]) => cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join('  ').trimEnd();
  return [fmt(head), widths.map((w) => '-'.repeat(w)).join('  '), ...body.map(fmt)];
}
