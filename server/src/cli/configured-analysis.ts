/**
 * The command line's analyses, each with its project configuration — the nearest `rectilens.json`
 * above the netlist, or the one `--config` names — and the parts files the configuration names
 * plus those given with `--parts`: the same settings and ratings the editor reads, so both reach
 * the same findings.
 */
import { dirname, resolve } from 'node:path';
import { analyze, type FileAnalysis, type Snapshot } from '../analysis/analyze';
import { partsFileFindings } from '../analysis/parts-file-findings';
import { projectConfigFindings } from '../analysis/project-config-findings';
import type { FileText } from '../circuit/index';
import { findProjectConfig } from '../io/project-config-file';
import type { AnalysisSettings, PartsFile } from '../ratings/index';
import type { CheckConfiguration } from './check-file';
import type { CommandIo } from './command-io';
import type { ReportedFile } from './report-json';

/** The name standard input is reported under. */
export const STDIN_PATH = '-';

/** From this many files on, a terminal gets a progress line (a handful finishes before it would be read). */
export const PROGRESS_MIN_FILES = 5;

export interface ConfigurationOptions {
  /** `--config FILE`: this configuration for every netlist, instead of the nearest one. */
  config?: string;
  /** `--parts FILE`…: parts files beside those the configuration names. */
  parts?: readonly string[];
}

export interface Configurations {
  /** The configuration key of each file, in the files' order ('' for none). */
  keyOf: Map<string, string>;
  /** Settings and parts files by key, in the order the files first name them. */
  byKey: Map<string, CheckConfiguration>;
  /** The configuration and parts files' own findings, once each. */
  extra: ReportedFile[];
}

/** Each file's project configuration, read once per configuration with the parts files it names. */
export function loadConfigurations(files: readonly string[], read: (path: string) => FileText, options: ConfigurationOptions): Configurations {
  const forced = options.config;
  const extraParts = options.parts ?? [];
  const keyOf = new Map<string, string>();
  for (const file of files) keyOf.set(file, forced ?? findProjectConfig(file === STDIN_PATH ? resolve('stdin') : file) ?? '');
  const byKey = new Map<string, CheckConfiguration>();
  const extra: ReportedFile[] = [];
  const seenExtra = new Set<string>();
  const report = (path: string, text: string, findings: ReportedFile['findings']) => {
    if (seenExtra.has(path) || findings.length === 0) return;
    seenExtra.add(path);
    extra.push({ path, text, findings });
  };
  for (const configPath of new Set(keyOf.values())) {
    let settings: AnalysisSettings = {};
    const partsPaths = extraParts.map((p) => resolve(p));
    if (configPath) {
      const result = projectConfigFindings(configPath, read(configPath));
      report(configPath, result.text, result.findings);
      settings = result.config.settings;
      partsPaths.unshift(...result.config.partsFiles.map((p) => resolve(dirname(configPath), p)));
    }
    const partsFiles: PartsFile[] = [];
    for (const path of partsPaths) {
      const result = partsFileFindings(path, read(path));
      report(path, result.text, result.findings);
      if (result.file) partsFiles.push(result.file);
    }
    byKey.set(configPath, { settings, partsFiles });
  }
  return { keyOf, byKey, extra };
}

/** One analysis per project configuration, each with its settings and parts files; the configuration and parts files' own findings are reported too. */
export function analyseByConfiguration(
  files: readonly string[], read: (path: string) => FileText, options: ConfigurationOptions, io: CommandIo,
): { snapshot: Snapshot; extra: ReportedFile[] } {
  const { keyOf, byKey, extra } = loadConfigurations(files, read, options);
  const all = new Map<string, FileAnalysis>();
  const unreadable: string[] = [];
  let done = 0;
  for (const [configPath, { settings, partsFiles }] of byKey) {
    for (const root of files.filter((f) => keyOf.get(f) === configPath)) {
      if (io.stderrIsTty && files.length >= PROGRESS_MIN_FILES) io.stderr(`\r\x1b[Krectilens: checking ${++done}/${files.length} ${root}`);
      const one = analyze({ roots: [root], readText: read, settings, partsFiles });
      for (const [uri, file] of one.files) all.set(uri, file);
      unreadable.push(...one.unreadable);
    }
  }
  if (io.stderrIsTty && files.length >= PROGRESS_MIN_FILES) io.stderr('\r\x1b[K');
  return { snapshot: { files: all, unreadable }, extra };
}
