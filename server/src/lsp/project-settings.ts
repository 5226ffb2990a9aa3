/**
 * The settings an analysis runs with in the editor, per workspace folder: the folder's project
 * configuration (`rectilens.json` at its root, the same file the command line reads), with the
 * editor's settings for that folder on top where the user set them (pulled with the folder as
 * scope, else the ones pushed for the whole window). A configuration's problems are published on
 * it. Parts files are those of the first folder's configuration and the editor's.
 */
import { URI, Utils } from 'vscode-uri';
import { projectConfigFindings } from '../analysis/project-config-findings';
import { DEFAULT_SETTINGS, validateSettings, type AnalysisSettings } from '../analysis/settings';
import { LineIndex } from '../../../grammar/src/index';
import { layerSettings, PROJECT_CONFIG_FILE } from '../ratings/index';
import { toDiagnostic } from './convert';
import { reloadPartsFiles } from './parts-files';
import type { ServerState } from './server-state';

type EditorSettings = AnalysisSettings & { partsFiles?: unknown };

/**
 * Applies the editor's settings — for the window, and per folder where it gave them (both kept
 * for a later change of a configuration file) — over each folder's project configuration.
 */
export function applySettings(state: ServerState, editor: EditorSettings, perFolder?: ReadonlyMap<string, EditorSettings>): void {
  state.editorSettings = editor;
  if (perFolder) state.editorFolderSettings = perFolder;
  const window = validateSettings(editor);
  const folderSettings = new Map<string, AnalysisSettings>();
  state.configUris = new Set();
  let firstProject: ReturnType<typeof readFolderConfig>;
  state.trust.folders.forEach((folder, k) => {
    const project = readFolderConfig(state, folder);
    if (k === 0) firstProject = project;
    const { partsFiles: _parts, ...own } = validateSettings(state.editorFolderSettings.get(folder) ?? editor);
    folderSettings.set(folder, { ...DEFAULT_SETTINGS, ...layerSettings(project?.settings ?? {}, own) });
  });
  const { partsFiles: editorParts, ...own } = window;
  state.folderSettings = folderSettings;
  state.settings = { ...DEFAULT_SETTINGS, ...layerSettings(firstProject?.settings ?? {}, own) };
  state.partsFilePaths = [...(firstProject?.partsFiles ?? []), ...(editorParts ?? [])];
  reloadPartsFiles(state);
}

function readFolderConfig(state: ServerState, folder: string) {
  const uri = Utils.joinPath(URI.parse(folder), PROJECT_CONFIG_FILE).toString();
  (state.configUris as Set<string>).add(uri);
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
