/**
 * `analyze(input, settings) → Snapshot`: the whole pipeline as one pure function. The caller
 * supplies the text of every file through `readText` (the editor's open documents, or the disk
 * for the command line); nothing here touches the file system, the clock or the settings store.
 */
import { parseNetlist, type Netlist } from '../../../grammar/src/index';
import type { Finding } from './findings';
import type { AnalysisSettings } from './settings';

export interface AnalysisInput {
  /** The files to analyse as top-level netlists (URIs or paths, as the adapter names them). */
  roots: readonly string[];
  /** Text of a file, or undefined when it cannot be read. */
  readText: (uri: string) => string | undefined;
  settings?: AnalysisSettings;
}

export interface FileAnalysis {
  uri: string;
  text: string;
  netlist: Netlist;
  findings: Finding[];
  /** Every other file this analysis read (includes and libraries), for re-analysis on change. */
  dependencies: string[];
}

export interface Snapshot {
  files: ReadonlyMap<string, FileAnalysis>;
  /** Roots that could not be read. */
  unreadable: readonly string[];
}

export function analyze(input: AnalysisInput): Snapshot {
  const files = new Map<string, FileAnalysis>();
  const unreadable: string[] = [];
  for (const uri of input.roots) {
    const text = input.readText(uri);
    if (text === undefined) {
      unreadable.push(uri);
      continue;
    }
    files.set(uri, analyzeFile(uri, text));
  }
  return { files, unreadable };
}

function analyzeFile(uri: string, text: string): FileAnalysis {
  const netlist = parseNetlist(text);
  const findings: Finding[] = netlist.diagnostics.map((d) => ({ uri, ...d }));
  return { uri, text, netlist, findings, dependencies: [] };
}
