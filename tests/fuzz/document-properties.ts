/**
 * The properties every document must satisfy, whatever its text: the pipeline (parse → analyse →
 * every editor feature) does not throw, finishes within a bound, keeps every range inside the
 * document, reports only finite numbers (or omits the figure), and gives the same result when the
 * same text is analysed again. A violated property throws with the detail, so fast-check can shrink.
 */
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { completeAt, modelsOf } from '../../server/src/editor/completion';
import { hoverAt } from '../../server/src/editor/hover';
import { inlayHintsOf } from '../../server/src/editor/inlay-hints';
import { findDefinition, findReferences, prepareRename, rename } from '../../server/src/editor/navigation';
import { foldingRangesOf, outlineOf, type OutlineSymbol } from '../../server/src/editor/outline';
import { devicesAtCard } from '../../server/src/editor/rectifier-lookup';
import { renderAnnotatedText } from '../../server/src/report/report-text-annotated';
import { stressHover } from '../../server/src/editor/stress-hover';
import { renderComparisonView, renderWaveformView } from '../../server/src/report/view-content';
import { toJsonReport } from '../../server/src/cli/report-json';
import { unsafeHtmlParts } from '../security/html-safety';
import { MAX_MS_PER_DOCUMENT } from './fuzz-config';

export const FUZZ_URI = 'file:///fuzz/doc.cir';

export interface CheckOptions {
  /** Fractions in [0, 1) of the text length where position features are asked. */
  probes: readonly number[];
  /**
   * Also require that no shown text says NaN or Infinity. Only for generated netlists, whose
   * vocabulary holds neither word (random text may, and hovers rightly quote it).
   */
  noNanText?: boolean;
  /** Analyse twice and compare (the costly part; a suite may do it on a subset). */
  determinism?: boolean;
}

/** Runs everything on `text`; throws on the first violated property. */
export function checkDocument(text: string, options: CheckOptions): void {
  const started = performance.now();
  const file = analyseOnce(text);
  const shown: string[] = [];
  const within = (what: string, span: { start: number; end: number } | undefined) => {
    if (!span) return;
    if (!(Number.isInteger(span.start) && Number.isInteger(span.end) && span.start >= 0 && span.start <= span.end && span.end <= text.length)) {
      throw new Error(`${what}: span ${JSON.stringify(span)} outside 0..${text.length}`);
    }
  };
  for (const f of file.findings) {
    if (f.uri !== FUZZ_URI) continue;
    within(`finding ${f.code}`, f.span);
    shown.push(f.message);
    for (const fix of f.fixes ?? []) for (const e of fix.edits) if (e.uri === FUZZ_URI) within(`fix of ${f.code}`, e.span);
    for (const r of f.related ?? []) if (r.uri === FUZZ_URI) within(`related of ${f.code}`, r.span);
  }
  for (const detail of ['brief', 'full'] as const) {
    for (const h of inlayHintsOf(file, detail)) {
      within('inlay hint', { start: h.offset, end: h.offset });
      shown.push(h.label, h.tooltip);
    }
  }
  for (const lens of codeLensesOf(file)) {
    within('code lens', { start: lens.offset, end: lens.offset });
    shown.push(lens.title);
  }
  const walkOutline = (symbols: readonly OutlineSymbol[]) => symbols.forEach((s) => { within('outline', s.span); within('outline selection', s.selection); walkOutline(s.children); });
  walkOutline(outlineOf(file.netlist));
  for (const fold of foldingRangesOf(file.netlist)) within('folding range', fold);
  const models = modelsOf(file.netlist);
  for (const offset of offsetsOf(text, options.probes)) {
    const hover = hoverAt(file.netlist, offset, (card) => {
      const hits = devicesAtCard(file, card.span);
      return hits.length ? stressHover(file, hits) : undefined;
    });
    if (hover) { within('hover', hover.span); shown.push(hover.markdown); }
    completeAt(file.netlist, offset, models);
    for (const l of findDefinition([file], offset)) within('definition', l.span);
    for (const l of findReferences([file], offset, true)) within('reference', l.span);
    within('prepare rename', prepareRename([file], offset));
    const edits = rename([file], offset, 'renamed_1');
    if (Array.isArray(edits)) for (const e of edits) within('rename edit', e.span);
  }
  for (const view of [renderWaveformView(file), renderComparisonView(file)]) {
    shown.push(view.title);
    const unsafe = unsafeHtmlParts(view.body);
    if (unsafe.length) throw new Error(`a view body holds ${unsafe.join(', ')}`);
  }
  shown.push(renderAnnotatedText(file, 'doc.cir'));
  const report = toJsonReport({ files: new Map([[FUZZ_URI, file]]), unreadable: [] });
  assertFiniteNumbers(report, 'json report');
  if (options.noNanText) {
    const bad = shown.find((s) => /\bNaN\b|Infinity/.test(s));
    if (bad !== undefined) throw new Error(`shown text holds NaN/Infinity: ${bad.slice(0, 300)}`);
  }
  if (options.determinism) {
    const again = analyseOnce(text);
    const a = JSON.stringify(resultOf(file));
    const b = JSON.stringify(resultOf(again));
    if (a !== b) throw new Error(`two analyses of the same text differ:\n${a.slice(0, 400)}\n${b.slice(0, 400)}`);
  }
  const elapsed = performance.now() - started;
  if (elapsed > MAX_MS_PER_DOCUMENT) throw new Error(`took ${Math.round(elapsed)} ms (bound ${MAX_MS_PER_DOCUMENT} ms)`);
}

/** One analysis of the text as the only open document (no cache, so nothing is carried over). */
export function analyseOnce(text: string): FileAnalysis {
  const snapshot = analyze({ roots: [FUZZ_URI], readText: (uri) => (uri === FUZZ_URI ? text : undefined) });
  const file = snapshot.files.get(FUZZ_URI);
  if (!file) throw new Error('the root was not analysed');
  return file;
}

/** What "the same result" means: the findings and every reported figure. */
function resultOf(file: FileAnalysis) {
  return { findings: file.findings, report: toJsonReport({ files: new Map([[FUZZ_URI, file]]), unreadable: [] }) };
}

/** Every number reachable from `value` is finite (undefined figures are allowed: they are omitted). */
export function assertFiniteNumbers(value: unknown, path: string): void {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`${path} is ${value}`);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => assertFiniteNumbers(v, `${path}[${i}]`));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) assertFiniteNumbers(v, `${path}.${k}`);
  }
}

/** Probe offsets: the given fractions of the length, plus both ends. */
function offsetsOf(text: string, probes: readonly number[]): number[] {
  return [0, text.length, ...probes.map((p) => Math.min(text.length, Math.floor(p * (text.length + 1))))];
}
