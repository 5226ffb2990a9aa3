/** The `rectilens/view` request: the waveform or comparison view of a rectifier, rendered by the core. */
import type { FileAnalysis } from '../analysis/analyze';
import { renderComparisonView, renderWaveformView, type ViewContent } from '../features/view-content';

export interface ViewRequest {
  kind: 'waveforms' | 'comparison';
  uri: string;
  rectifierId?: string;
}

export function renderView(file: FileAnalysis | undefined, request: ViewRequest): ViewContent | null {
  if (!file || file.rectifiers.length === 0) return null;
  return request.kind === 'comparison' ? renderComparisonView(file, request.rectifierId) : renderWaveformView(file, request.rectifierId);
}
