/**
 * Files that change on disk behind the editor's back: a parts file, or an include or library that
 * is not open. The server asks the editor to watch them (`workspace/didChangeWatchedFiles`,
 * registered dynamically) and, on a change, re-reads the project configuration or the parts files, or re-analyses the roots that
 * read the file; an open document is the editor's business and is left alone.
 */
import { DidChangeWatchedFilesNotification, WatchKind } from 'vscode-languageserver/node';
import type { ServerState } from './server-state';
import { reloadPartsFiles } from './parts-files';
import { applySettings } from './project-settings';

/**
 * What is watched: netlists, includes and libraries by the usual extensions, and JSON (parts
 * files may be named anything ending in .json).
 */
export const WATCHED_GLOBS = ['**/*.{cir,net,sp,spi,ckt,inc,lib,mod,sub,txt}', '**/*.json'];

/** Asks the editor to watch the files (after `initialized`, when it registers watchers dynamically). */
export function askToWatchFiles(state: ServerState): void {
  if (!state.watchSupport) return;
  const { connection } = state;
  void connection.client.register(DidChangeWatchedFilesNotification.type, {
    watchers: WATCHED_GLOBS.map((globPattern) => ({ globPattern, kind: WatchKind.Create | WatchKind.Change | WatchKind.Delete })),
  }).catch((error: unknown) => connection.console.error(`rectilens: could not register file watchers: ${String(error)}`));
}

/** Re-reads or re-analyses what a change on disk touches. */
export function registerFileWatching(state: ServerState): void {
  const { connection } = state;
  connection.onDidChangeWatchedFiles(({ changes }) => {
    const changed = changes.map((c) => c.uri);
    if (changed.some((uri) => state.configUris.has(uri))) {
      applySettings(state, state.editorSettings);
      return;
    }
    if (changed.some((uri) => state.partsFileUris.has(uri))) {
      reloadPartsFiles(state);
      return;
    }
    const open = new Set(state.documents.all().map((d) => d.uri));
    const roots = new Set(changed.filter((uri) => !open.has(uri)).flatMap((uri) => state.scheduler.dependentsOf(uri)));
    if (roots.size) state.scheduler.schedule(roots);
  });
}
