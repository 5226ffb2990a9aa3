/**
 * Reads the parts files named in the settings (paths relative to the first workspace folder)
 * through the server's reader — the trust gate and the safe reader — and reports every problem
 * as diagnostics on the parts file and as a log line.
 */
import { isAbsolute, resolve } from 'node:path';
import { URI } from 'vscode-uri';
import type { Connection } from 'vscode-languageserver/node';
import type { FileText } from '../circuit/index';
import { LineIndex } from '../../../grammar/src/index';
import { partsFileFindings, type PartsFileResult } from '../analysis/parts-file-findings';
import type { PartsFile } from '../ratings/index';
import { toDiagnostic } from './convert';
import type { ServerState } from './server-state';
import type { TrustPolicy } from './trust';

export interface PartsFilesReading {
  /** The usable files, in the order of the setting. */
  files: PartsFile[];
  /** One result per named file, with or without findings, for publishing. */
  results: PartsFileResult[];
  /** Settings entries that name no file at all (a relative path with no workspace folder). */
  unplaced: string[];
}

export function readPartsFiles(paths: readonly string[], trust: TrustPolicy, readText: (uri: string) => FileText): PartsFilesReading {
  const reading: PartsFilesReading = { files: [], results: [], unplaced: [] };
  for (const path of paths) {
    const uri = partsFileUri(path, trust.folders[0]);
    if (!uri) {
      reading.unplaced.push(path);
      continue;
    }
    const result = partsFileFindings(uri, readText(uri));
    reading.results.push(result);
    if (result.file) reading.files.push(result.file);
  }
  return reading;
}

/**
 * A URI as given, else the path joined onto the folder (an absolute path stays itself; the gate
 * judges it), written as the editor writes URIs (vscode-uri), so a watched-file event names it alike.
 */
function partsFileUri(path: string, folder: string | undefined): string | undefined {
  if (/^[a-z][a-z0-9+.-]+:/i.test(path)) return path;
  if (isAbsolute(path)) return URI.file(path).toString();
  if (!folder) return undefined;
  try {
    return URI.file(resolve(URI.parse(folder).fsPath, path)).toString();
  } catch {
    return undefined;
  }
}

/**
 * Publishes each parts file's findings on it and logs them; clears the files published last time
 * that are no longer named or now clean. Returns the URIs that now carry findings.
 */
export function publishPartsFiles(connection: Connection, reading: PartsFilesReading, previous: ReadonlySet<string>): Set<string> {
  const now = new Set<string>();
  for (const { uri, text, findings } of reading.results) {
    // The log line goes first, so a client that has the diagnostics has the log too.
    for (const f of findings) connection.console.warn(`rectilens: parts file ${uri}: ${f.severity} ${f.code}: ${f.message}`);
    const lines = new LineIndex(text);
    void connection.sendDiagnostics({ uri, diagnostics: findings.map((f) => toDiagnostic(lines, f, () => undefined)) });
    if (findings.length) now.add(uri);
  }
  for (const path of reading.unplaced) connection.console.warn(`rectilens: parts file '${path}' is relative and there is no workspace folder to find it in; not read`);
  for (const uri of previous) if (!now.has(uri) && !reading.results.some((r) => r.uri === uri)) void connection.sendDiagnostics({ uri, diagnostics: [] });
  return now;
}

/** Reads the parts files the settings name (again), publishes their findings and re-analyses the open documents. */
export function reloadPartsFiles(state: ServerState): void {
  const reading = readPartsFiles(state.partsFilePaths, state.trust, state.readText);
  state.partsFiles = reading.files;
  state.partsFileUris = new Set(reading.results.map((r) => r.uri));
  state.partsFilesWithFindings = publishPartsFiles(state.connection, reading, state.partsFilesWithFindings);
  state.scheduler.schedule(state.documents.all().map((d) => d.uri));
}
