/** The `rectilens/view` request: the waveform or comparison view of a rectifier, rendered by the core. */
import type { FileAnalysis } from '../analysis/analyze';

export interface ViewRequest {
  kind: 'waveforms' | 'comparison';
  uri: string;
  rectifierId?: string;
}

export interface ViewContent {
  title: string;
  body: string;
}

/** Filled in once the view renderers land; until then the view says so. */
export function renderView(file: FileAnalysis | undefined, request: ViewRequest): ViewContent | null {
  if (!file || file.rectifiers.length === 0) return null;
  return { title: `Rectilens ${request.kind}`, body: '<p>Views are not available yet.</p>' };
}
