/**
 * The settings an analysis runs with in the editor: the workspace's project configuration
 * (`rectilens.json` at the first folder's root, the same file the command line reads), with the
 * editor's own settings on top where the user set them. Its problems are published on the file.
 */
import { URI, Utils } from 'vscode-uri';
import { projectConfigFindings } from '../analysis/project-config-findings';
import { DEFAULT_SETTINGS, validateSettings, type AnalysisSettings } from '../analysis/settings';
import { LineIndex } from '../../../grammar/src/index';
import { layerSettings, PROJECT_CONFIG_FILE } from '../ratings/index';
import { toDiagnostic } from './convert';
import { reloadPartsFiles } from './parts-files';
import type { ServerState } from './server-state';

/** Applies the editor's settings (kept for a later change of the configuration file) over the project configuration. */
export function applySettings(state: ServerState, editor: AnalysisSettings & { partsFiles?: unknown }): void {
  state.editorSettings = editor;
  const { partsFiles: editorParts, ...own } = validateSettings(editor);
  const project = readWorkspaceConfig(state);
  state.settings = { ...DEFAULT_SETTINGS, ...layerSettings(project?.settings ?? {}, own) };
  state.partsFilePaths = [...(project?.partsFiles ?? []), ...(editorParts ?? [])];
  reloadPartsFiles(state);
}

function readWorkspaceConfig(state: ServerState) {
  const folder = state.trust.folders[0];
  if (!folder) return undefined;
  const uri = Utils.joinPath(URI.parse(folder), PROJECT_CONFIG_FILE).toString();
  state.configUri = uri;
  const text = state.readText(uri);
  if (text === undefined) {
    void state.connection.sendDiagnostics({ uri, diagnostics: [] });
    return undefined;
  }
  const result = projectConfigFindings(uri, text);
  const lines = new LineIndex(result.text);
  void state.connection.sendDiagnostics({ uri, diagnostics: result.findings.map((f) => toDiagnostic(lines, f, () => undefined)) });
  return result.config;
}
