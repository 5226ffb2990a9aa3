/**
 * Test helpers for the editor features, run in-process against the core: a fixture with a `$0`
 * cursor (tests/helpers/cursor.ts) is analysed by `analyze()` as the root file `URI`, and the
 * tests call the editor functions (server/src/editor) the way the language server's handlers do
 * (lsp/editor-features.ts, lsp/navigation-features.ts), without the protocol or the worker.
 */
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import type { AnalysisSettings } from '../../server/src/analysis/settings';
import type { Span } from '../../grammar/src/index';
import { readCursor, type Cursor } from '../helpers/cursor';

export const URI = 'file:///w/editor.cir';

export interface AtCursor extends Cursor {
  file: FileAnalysis;
}

export interface AnalyseOptions {
  /** Other files by URI, e.g. an included library. */
  extra?: Record<string, string>;
  settings?: AnalysisSettings;
}

/** Analyses `text` as the root file `URI`. */
export function analyseFile(text: string, options: AnalyseOptions = {}): FileAnalysis {
  const texts: Record<string, string> = { [URI]: text, ...options.extra };
  return analyze({ roots: [URI], readText: (uri) => texts[uri], settings: options.settings }).files.get(URI)!;
}

/** Analyses a fixture with a `$0` cursor. */
export function analyseAt(fixture: string, options: AnalyseOptions = {}): AtCursor {
  const cursor = readCursor(fixture);
  return { ...cursor, file: analyseFile(cursor.text, options) };
}

/** The text under a span. */
export function textOf(text: string, span: Span): string {
  return text.slice(span.start, span.end);
}

/** The line (0-based) an offset falls on, for readable expectations. */
export function lineOf(text: string, offset: number): number {
  return text.slice(0, offset).split('\n').length - 1;
}
