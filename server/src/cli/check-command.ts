/** `rectilens check <files or folders…> [--format text|json] [--fail-on error|warning|never]`. */
import { isAbsolute, relative as relativePath, sep } from 'node:path';
import { analyze, type FileAnalysis, type Snapshot } from '../analysis/analyze';
import { reaches } from '../findings/index';
import { parseArgs, UsageError } from './args';
import { cachedReader, collectNetlistFiles, emptyFolderMessage, unreadReason } from './netlist-files';
import { toJsonReport } from './report-json';
import { toSarif } from './report-sarif';
import { toTextReport } from './report-text';
import type { CommandIo } from './command-io';
import type { FileText } from '../circuit/index';
import { TOOL_VERSION } from './tool-version';

export const CHECK_USAGE = 'rectilens check <files or folders…> [--format text|json|sarif] [--fail-on error|warning|never]';

/** Runs the check and returns the exit code: 0 clean, 1 a finding reached --fail-on, 2 usage, unreadable input or a folder with no netlist. */
export function runCheck(argv: readonly string[], io: CommandIo): number {
  const args = parseArgs(argv, { format: { values: ['text', 'json', 'sarif'] }, 'fail-on': { values: ['error', 'warning', 'never'] } });
  if (args.positional.length === 0) throw new UsageError(`check needs at least one file or folder\nusage: ${CHECK_USAGE}`);
  const { files, problems, empty } = collectNetlistFiles(args.positional);
  const read = cachedReader();
  const snapshot = files.length >= PROGRESS_MIN_FILES && io.stderrIsTty
    ? analyzeWithProgress(files, read, io)
    : analyze({ roots: files, readText: read });
  for (const problem of problems) io.stderr(`rectilens: cannot read ${problem.path}: ${problem.reason}\n`);
  for (const folder of empty) io.stderr(emptyFolderMessage(folder));
  for (const path of snapshot.unreadable) io.stderr(`rectilens: cannot read ${path}: ${unreadReason(read, path)}\n`);
  const report = toJsonReport(snapshot);
  const format = args.flags.get('format') ?? 'text';
  if (format === 'json') io.stdout(JSON.stringify(report, null, 2) + '\n');
  else if (format === 'sarif') io.stdout(JSON.stringify(toSarif(report, TOOL_VERSION, toRelativeUri), null, 2) + '\n');
  else io.stdout(toTextReport(report));
  if (problems.length || empty.length || snapshot.unreadable.length) return 2;
  const failOn = (args.flags.get('fail-on') as string | undefined) ?? 'error';
  if (failOn === 'never') return 0;
  const failing = report.files.some((f) => f.diagnostics.some((d) => reaches(d.severity as 'error', failOn as 'error')));
  return failing ? 1 : 0;
}

/** From this many files on, a terminal gets a progress line (a handful finishes before it would be read). */
export const PROGRESS_MIN_FILES = 5;

/**
 * Analyses file by file so a progress line can be drawn on stderr between them; it is
 * overwritten in place with a carriage return and cleared at the end, so logs stay clean.
 */
function analyzeWithProgress(files: readonly string[], read: (path: string) => FileText, io: CommandIo): Snapshot {
  const all = new Map<string, FileAnalysis>();
  const unreadable: string[] = [];
  files.forEach((path, k) => {
    io.stderr(`\r\x1b[Krectilens: checking ${k + 1}/${files.length} ${path}`);
    const one = analyze({ roots: [path], readText: read });
    for (const [uri, file] of one.files) all.set(uri, file);
    unreadable.push(...one.unreadable);
  });
  io.stderr('\r\x1b[K');
  return { files: all, unreadable };
}

/** SARIF artifact locations are URIs; relative paths stay relative to the working folder, as scanning services expect. */
function toRelativeUri(path: string): string {
  const relative = isAbsolute(path) ? relativePath(process.cwd(), path) : path;
  return relative.split(sep).map(encodeURIComponent).join('/');
}
