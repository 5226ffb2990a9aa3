/**
 * Everything the VS Code client and the language server must spell alike: Rectilens' own requests
 * and notifications, and the command ids the server's code lenses name and the client registers.
 * Declared once here, imported by both sides (and by the manifest test); plain constants and types.
 */

/** Commands the extension contributes (package.json `contributes.commands`). */
export const COMMANDS = {
  showWaveforms: 'rectilens.showWaveforms',
  compareTopologies: 'rectilens.compareTopologies',
  writeReport: 'rectilens.writeReport',
} as const;

/**
 * `rectilens/view`: a rectifier's waveform or comparison view, rendered by the server; `report`
 * is the whole file's HTML report (`body` a complete page), which the client writes and opens.
 */
export const VIEW_REQUEST = 'rectilens/view';

export type ViewKind = 'waveforms' | 'comparison' | 'report';

export interface ViewRequest {
  kind: ViewKind;
  uri: string;
  rectifierId?: string;
}

/** A view's title (for the panel tab) and its body (an HTML fragment with inline SVG, no scripts). */
export interface ViewContent {
  title: string;
  body: string;
}

/** `rectilens/documentText`: the server's copy of an open document (a test and diagnostic aid). */
export const DOCUMENT_TEXT_REQUEST = 'rectilens/documentText';
