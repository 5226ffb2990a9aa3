/** The `rectilens/view` request: the waveform or comparison view of a rectifier, or the file's report page, rendered by the core. */
import type { FileAnalysis } from '../analysis/analyze';
import type { SolveFn } from '../solve/index';
import { renderComparisonView, renderWaveformView } from '../report/view-content';
import { renderHtmlReport } from '../report/report-html';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';

export type { ViewRequest };

/** `solve` is the worker's memoised solver, so a comparison opened twice solves its variants once. */
export function renderView(file: FileAnalysis | undefined, request: ViewRequest, solve: SolveFn): ViewContent | null {
  if (file && request.kind === 'report') return renderReportPage(file, solve);
  if (!file || file.rectifiers.length === 0) return null;
  return request.kind === 'comparison' ? renderComparisonView(file, request.rectifierId, solve) : renderWaveformView(file, request.rectifierId, solve);
}

/** The file's HTML report as one page (the same renderer as `rectilens report --html`), named after the file. */
function renderReportPage(file: FileAnalysis, solve: SolveFn): ViewContent {
  const tail = file.uri.split('/').pop() ?? file.uri;
  let name = tail;
  try { name = decodeURIComponent(tail); } catch { /* a malformed escape: the name as written */ }
  return { title: `Rectilens report: ${name}`, body: renderHtmlReport([{ file, displayPath: name }], { generator: 'the Rectilens language server', solve }) };
}
