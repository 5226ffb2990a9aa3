/** The `rectilens/view` request: the waveform or comparison view of a rectifier, rendered by the core. */
import type { FileAnalysis } from '../analysis/analyze';
import type { SolveFn } from '../solve/index';
import { renderComparisonView, renderWaveformView } from '../report/view-content';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';

export type { ViewRequest };

/** `solve` is the worker's memoised solver, so a comparison opened twice solves its variants once. */
export function renderView(file: FileAnalysis | undefined, request: ViewRequest, solve: SolveFn): ViewContent | null {
  if (!file || file.rectifiers.length === 0) return null;
  return request.kind === 'comparison' ? renderComparisonView(file, request.rectifierId, solve) : renderWaveformView(file, request.rectifierId);
}
