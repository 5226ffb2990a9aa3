/**
 * `rectilens check`: the netlists named (files, folders, patterns, `-` for standard input), each
 * analysed with its project configuration — the nearest `rectilens.json` above it, or `--config` —
 * and the parts files it names plus those given with `--parts`, exactly as the editor reads them.
 */
import { readFileSync } from 'node:fs';
import { isAbsolute, relative as relativePath, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { FileText } from '../circuit/index';
import { reaches } from '../findings/index';
import { parseArgs, UsageError } from './args';
import { analyseByConfiguration, STDIN_PATH } from './configured-analysis';
import type { CommandIo } from './command-io';
import { cachedReader, collectNetlistFiles, emptyFolderMessage, unreadReason } from './netlist-files';
import { toCiAnnotations } from './report-ci';
import { toJsonReport } from './report-json';
import { toSarif } from './report-sarif';
import { toTextReport } from './report-text';
import { TOOL_VERSION } from './tool-version';

export const CHECK_USAGE = 'rectilens check <files, folders, patterns or -> [--format text|json|sarif|ci] [--fail-on error|warning|never] [--config FILE] [--parts FILE]… [--output FILE]';

export const CHECK_HELP = `${CHECK_USAGE}

Checks every rectifier in the netlists named: folders are searched for netlist files, patterns
(quoted, e.g. 'designs/**/*.cir') are expanded, and - reads one netlist from standard input.

  --format text|json|sarif|ci   text (default): file:line:col lines; json: findings and figures;
                                sarif: SARIF 2.1.0 for code-scanning services; ci: workflow-command
                                annotations (::error file=…::) that CI runners show on the change
  --fail-on error|warning|never the least severity that makes the exit code 1 (default: error)
  --config FILE                 the project configuration to use, instead of the nearest
                                rectilens.json above each netlist
  --parts FILE                  a parts file, in addition to those the configuration names
                                (repeatable)
  --output FILE                 write the report to FILE instead of standard output

Exit codes: 0 nothing reached --fail-on; 1 a finding did; 2 a usage error, an unreadable input,
or nothing to check.
`;

const FLAGS = {
  format: { values: ['text', 'json', 'sarif', 'ci'] },
  'fail-on': { values: ['error', 'warning', 'never'] },
  config: {},
  parts: { repeatable: true },
  output: {},
  help: { boolean: true, short: 'h' },
} as const;

/** Runs the check and returns the exit code: 0 clean, 1 a finding reached --fail-on, 2 usage, unreadable input or nothing to check. */
export function runCheck(argv: readonly string[], io: CommandIo): number {
  const args = parseArgs(argv, FLAGS);
  if (args.flags.get('help')) {
    io.stdout(CHECK_HELP);
    return 0;
  }
  if (args.positional.length === 0) throw new UsageError(`check needs at least one file or folder\nusage: ${CHECK_USAGE}`);
  const fromStdin = args.positional.includes(STDIN_PATH);
  const { files, problems, empty } = collectNetlistFiles(args.positional.filter((p) => p !== STDIN_PATH));
  if (fromStdin) files.push(STDIN_PATH);
  const disk = cachedReader();
  const stdin = fromStdin ? readFileSync(0, 'utf8') : '';
  const read = (path: string): FileText => (path === STDIN_PATH ? stdin : disk(path));
  const { snapshot, extra } = analyseByConfiguration(files, read, { config: args.flags.get('config') as string | undefined, parts: args.lists.get('parts') ?? [] }, io);
  for (const problem of problems) io.stderr(`rectilens: cannot read ${problem.path}: ${problem.reason}\n`);
  for (const folder of empty) io.stderr(emptyFolderMessage(folder));
  for (const path of snapshot.unreadable) io.stderr(`rectilens: cannot read ${path}: ${unreadReason(read, path)}\n`);
  const format = args.flags.get('format') ?? 'text';
  const report = toJsonReport(snapshot, { extra, withFixes: format === 'sarif' });
  const out = format === 'json' ? JSON.stringify(report, null, 2) + '\n'
    : format === 'sarif' ? JSON.stringify(toSarif(report, TOOL_VERSION, toRelativeUri, `${pathToFileURL(process.cwd()).href}/`), null, 2) + '\n'
      : format === 'ci' ? toCiAnnotations(report)
        : toTextReport(report);
  const output = args.flags.get('output') as string | undefined;
  if (output) {
    if (!io.writeFile) throw new UsageError('--output is not available here');
    io.writeFile(output, out);
  } else io.stdout(out);
  if (problems.length || empty.length || snapshot.unreadable.length || files.length === 0) return 2;
  const failOn = (args.flags.get('fail-on') as string | undefined) ?? 'error';
  if (failOn === 'never') return 0;
  const failing = report.files.some((f) => f.diagnostics.some((d) => reaches(d.severity as 'error', failOn as 'error')));
  return failing ? 1 : 0;
}

/** SARIF artifact locations are URIs; relative paths stay relative to the working folder, as scanning services expect. */
function toRelativeUri(path: string): string {
  const relative = isAbsolute(path) ? relativePath(process.cwd(), path) : path;
  return relative.split(sep).map(encodeURIComponent).join('/');
}
