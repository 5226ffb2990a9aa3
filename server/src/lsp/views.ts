/** The `rectilens/view` request: the waveform or comparison view of a rectifier, rendered by the core. */
import type { FileAnalysis } from '../analysis/analyze';
import { renderComparisonView, renderWaveformView } from '../features/view-content';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';

export type { ViewRequest };

export function renderView(file: FileAnalysis | undefined, request: ViewRequest): ViewContent | null {
  if (!file || file.rectifiers.length === 0) return null;
  return request.kind === 'comparison' ? renderComparisonView(file, request.rectifierId) : renderWaveformView(file, request.rectifierId);
}
