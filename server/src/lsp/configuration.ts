/**
 * The editor's side of configuration: the initialize handshake (capabilities, trust, settings
 * given up front), settings pushed or pulled afterwards, and the parts files they name. Every
 * change of settings re-reads the parts files and re-analyses the open documents.
 */
import { CodeActionKind, TextDocumentSyncKind, type InitializeParams, type InitializeResult } from 'vscode-languageserver/node';
import type { AnalysisSettings } from '../analysis/settings';
import { askToWatchFiles, registerFileWatching } from './file-watching';
import { applySettings } from './project-settings';
import type { ServerState } from './server-state';

const CAPABILITIES: InitializeResult['capabilities'] = {
  textDocumentSync: TextDocumentSyncKind.Incremental,
  hoverProvider: true,
  inlayHintProvider: true,
  codeLensProvider: { resolveProvider: false },
  codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix], resolveProvider: true },
  documentSymbolProvider: true,
  definitionProvider: true,
  referencesProvider: true,
  renameProvider: { prepareProvider: true },
  foldingRangeProvider: true,
  documentLinkProvider: { resolveProvider: false },
  completionProvider: { triggerCharacters: ['@', ' ', '='] },
};

export function registerConfiguration(state: ServerState): void {
  const { connection } = state;
  connection.onInitialize((params: InitializeParams): InitializeResult => {
    const options = (params.initializationOptions ?? {}) as { trusted?: boolean; settings?: AnalysisSettings };
    state.trust = { trusted: options.trusted !== false, folders: (params.workspaceFolders ?? []).map((f) => f.uri) };
    state.editorSettings = options.settings ?? {};
    state.pullConfiguration = Boolean(params.capabilities.workspace?.configuration);
    state.progressSupport = Boolean(params.capabilities.window?.workDoneProgress);
    const formats = params.capabilities.textDocument?.hover?.contentFormat;
    state.hoverMarkdown = !formats || formats.includes('markdown');
    // The edit is left to `codeAction/resolve` only for an editor that resolves it and keeps `data` for the resolve.
    const codeAction = params.capabilities.textDocument?.codeAction;
    state.codeActionResolve = {
      edit: Boolean(codeAction?.dataSupport && codeAction.resolveSupport?.properties.includes('edit')),
      disabled: Boolean(codeAction?.disabledSupport),
    };
    state.watchSupport = Boolean(params.capabilities.workspace?.didChangeWatchedFiles?.dynamicRegistration);
    state.refreshSupport = {
      inlayHints: Boolean(params.capabilities.workspace?.inlayHint?.refreshSupport),
      codeLenses: Boolean(params.capabilities.workspace?.codeLens?.refreshSupport),
    };
    return { capabilities: CAPABILITIES, serverInfo: { name: 'rectilens' } };
  });
  // One handler per notification: a second onInitialized would replace this one.
  connection.onInitialized(() => {
    // The project configuration applies from the start, with the settings given up front on top.
    applySettings(state, state.editorSettings);
    // Analyses wait for the first pull, but not for an editor that never answers it.
    state.settingsReady = Promise.race([refreshConfiguration(state), new Promise<void>((r) => setTimeout(r, SETTINGS_PATIENCE_MS).unref())]);
    askToWatchFiles(state);
  });
  registerFileWatching(state);
  connection.onDidChangeConfiguration((change) => {
    // A pushed value has no scope: an editor that answers scoped pulls is asked again, folder by folder.
    const pushed = (change.settings as { rectilens?: AnalysisSettings } | undefined)?.rectilens;
    if (state.pullConfiguration || !pushed) void refreshConfiguration(state);
    else applySettings(state, pushed);
  });
}

/** How long the first analyses wait for the editor to answer the settings pull. */
const SETTINGS_PATIENCE_MS = 2000;

/** Pulls the window's settings and each folder's (scoped to it), then applies them. */
async function refreshConfiguration(state: ServerState): Promise<void> {
  if (!state.pullConfiguration) return;
  try {
    const folders = state.trust.folders;
    const [pulled, ...perFolder] = (await state.connection.workspace.getConfiguration([
      { section: 'rectilens' }, ...folders.map((scopeUri) => ({ scopeUri, section: 'rectilens' })),
    ])) as (AnalysisSettings | null)[];
    const scoped = new Map(folders.flatMap((folder, k) => (perFolder[k] ? [[folder, perFolder[k]!] as const] : [])));
    applySettings(state, pulled ?? {}, scoped);
  } catch (error) {
    state.connection.console.error(`rectilens: could not read settings: ${String(error)}`);
  }
}
