/**
 * One root netlist checked, and turned at once into the compact result `check` reports: the JSON
 * diagnostics of each file it read and, for the JSON report, its rectifiers' figures. The analysis
 * itself is dropped here, so a thousand files cost the memory of one. The same function runs in a
 * worker thread (`check-worker.ts`) and in process (`--jobs 1`), which is what makes the output the
 * same for any number of jobs.
 */
import { analyze } from '../analysis/analyze';
import { findingsByFile } from '../analysis/findings-by-file';
import type { FileText } from '../circuit/index';
import { withoutRepeats } from '../findings/index';
import type { AnalysisSettings, PartsFile } from '../ratings/index';
import { LineIndex } from '../../../grammar/src/index';
import { readFileSafely } from '../io/read-file-safely';
import { unreadReason } from './netlist-files';
import { toJsonDiagnostic, toJsonRectifier, type JsonDiagnostic, type JsonRectifier } from './report-json';

/** What an analysis of one root needs besides the file: its configuration's settings and parts files. */
export interface CheckConfiguration {
  settings: AnalysisSettings;
  partsFiles: PartsFile[];
}

export interface CheckTask {
  /** Position in the sorted file list; results are written in this order. */
  index: number;
  path: string;
  /** The text of standard input, when `path` is `-`. */
  text?: string;
  configKey: string;
}

export interface ResultShape {
  /** The JSON report carries each rectifier's figures; the other formats need only the findings. */
  withRectifiers: boolean;
  /** SARIF carries quick fixes, which re-solve, so they are computed only for it. */
  withFixes: boolean;
}

export interface CheckedFile {
  index: number;
  path: string;
  /** Why the root was not read; nothing else is set then. */
  unreadable?: string;
  rectifiers: JsonRectifier[];
  /** Every file this root read (itself first) with this root's findings there, each once; empty lists included. */
  byFile: [string, JsonDiagnostic[]][];
}

/** Checks one root: analyse, convert to the report's shape, forget the analysis. */
export function checkFile(task: CheckTask, configuration: CheckConfiguration, read: (path: string) => FileText, shape: ResultShape): CheckedFile {
  const readRoot = (path: string): FileText => (path === task.path && task.text !== undefined ? task.text : read(path));
  // Nothing read below needs the whole flat circuit (the JSON rectifiers come from the analyses, the
  // fixes read what `compactAfterRules` keeps for the server's fixes). Cutting it costs an index
  // rebuild, worth it only when the fixes' trial solves keep this analysis alive for a while.
  const snapshot = analyze({
    roots: [task.path], readText: readRoot, settings: configuration.settings, partsFiles: configuration.partsFiles, compactFlat: shape.withFixes, waveforms: false,
  });
  const file = snapshot.files.get(task.path);
  if (!file) return { index: task.index, path: task.path, unreadable: unreadReason(readRoot, task.path), rectifiers: [], byFile: [] };
  const lineIndexes = new Map<string, LineIndex>();
  const linesOf = (uri: string) => {
    let index = lineIndexes.get(uri);
    if (!index) lineIndexes.set(uri, (index = new LineIndex(file.parsed.get(uri)?.text ?? '')));
    return index;
  };
  const byFile: [string, JsonDiagnostic[]][] = [];
  for (const [uri, findings] of findingsByFile(file)) {
    byFile.push([uri, withoutRepeats(findings).map((f) => toJsonDiagnostic(f, linesOf, shape.withFixes))]);
  }
  const rectifiers = shape.withRectifiers ? file.rectifiers.map((r) => toJsonRectifier(r, linesOf(file.uri))) : [];
  return { index: task.index, path: task.path, rectifiers, byFile };
}

/**
 * The reader of one task: the root read afresh (it is not kept after its check), everything else
 * through `included`, the thread's cache, so a library that many roots include is read once.
 */
export function readerForTask(task: CheckTask, included: (path: string) => FileText): (path: string) => FileText {
  return (path) => (path === task.path ? readFileSafely(path) : included(path));
}
