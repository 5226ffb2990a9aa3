/** Helpers for the limit and pathological-value suites: analyse inline netlists and read the results. */
import { expect } from 'vitest';
import { analyze, type AnalysisInput, type FileAnalysis } from '../../server/src/analysis/analyze';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { inlayHintsOf } from '../../server/src/editor/inlay-hints';
import { toJsonReport } from '../../server/src/cli/report-json';
import { assertFiniteNumbers } from '../fuzz/document-properties';

export const ROOT = 'file:///work/limits/root.cir';

/** Analyses `text` as the root, with other files by URI; extra input fields (limits, clock) as given. */
export function analyseText(text: string, extra: Partial<AnalysisInput> = {}, files: Record<string, string> = {}): FileAnalysis {
  const all: Record<string, string> = { ...files, [ROOT]: text };
  const file = analyze({ roots: [ROOT], readText: (uri) => all[uri], ...extra }).files.get(ROOT);
  if (!file) throw new Error('root not analysed');
  return file;
}

/** Findings of one code, as `[code, text under the span, message]`. */
export function findingsOf(file: FileAnalysis, code: string) {
  return file.findings.filter((f) => f.code === code).map((f) => ({ text: f.uri === ROOT ? file.text.slice(f.span.start, f.span.end) : f.uri, message: f.message, span: f.span }));
}

/** Nothing shown for the file says NaN or Infinity, and every reported figure is finite. */
export function expectNoNonFinite(file: FileAnalysis): void {
  const shown = [
    ...inlayHintsOf(file, 'full').flatMap((h) => [h.label, h.tooltip]),
    ...codeLensesOf(file).map((l) => l.title),
    ...file.findings.map((f) => f.message),
  ];
  expect(shown.filter((s) => /\bNaN\b|Infinity/.test(s))).toEqual([]);
  assertFiniteNumbers(toJsonReport({ files: new Map([[ROOT, file]]), unreadable: [] }), 'report');
}

/** A diode bridge on 230 V mains with index `i` in its names (a fixture of our own). */
export function bridge(i: number, cap = '100u', load = '1k'): string {
  return [
    `V${i} a${i} b${i} SIN(0 325 50)`, `D${i}1 a${i} p${i} DM`, `D${i}2 b${i} p${i} DM`, `D${i}3 0 a${i} DM`, `D${i}4 0 b${i} DM`,
    `C${i} p${i} 0 ${cap}`, ...(load ? [`RL${i} p${i} 0 ${load}`] : []),
  ].join('\n');
}

export const DIODE_MODEL = '.model DM D(IS=2n N=1.8 RS=0.04)';
