/**
 * `rectilens check`: the netlists named (files, folders, patterns, `-` for standard input), each
 * analysed with its project configuration — the nearest `rectilens.json` above it, or `--config` —
 * and the parts files it names plus those given with `--parts`, exactly as the editor reads them.
 */
import { existsSync, readFileSync } from 'node:fs';
import { isAbsolute, relative as relativePath, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import { parseArgs, UsageError } from './args';
import type { CheckTask } from './check-file';
import { checkInWorkers } from './check-pool';
import { CheckRun, checkInProcess } from './check-run';
import { filesOfShard, parseJobs, parseShard, type Shard } from './check-split';
import type { CheckFormat } from './check-writers';
import type { CommandIo } from './command-io';
import { loadConfigurations, STDIN_PATH } from './configured-analysis';
import { cachedReader, collectNetlistFiles, describeError, emptyFolderMessage } from './netlist-files';
import { TOOL_VERSION } from './tool-version';

export const CHECK_USAGE = 'rectilens check <files, folders, patterns or -> [--format text|json|sarif|ci] [--fail-on error|warning|never] [--config FILE] [--parts FILE]… [--output FILE] [--jobs N] [--shard K/N]';

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
  --jobs N                      check N files at a time, each in its own thread (default: one per
                                core); --jobs 1 checks them one by one in this process. The report
                                is the same for any N: files are listed in the order of the sorted
                                file list, each written as soon as it and every file before it are
                                done
  --shard K/N                   check only the K-th of N shares of the files (1 ≤ K ≤ N), for a CI
                                job matrix: the files whose place in the sorted list, counted from
                                0, leaves K−1 when divided by N. The N shards together check every
                                file once; the exit code and summary are this shard's. A shard left
                                without a file exits 0 and says so

Exit codes: 0 nothing reached --fail-on; 1 a finding did; 2 a usage error, an unreadable input,
or nothing to check.
`;

const FLAGS = {
  format: { values: ['text', 'json', 'sarif', 'ci'] },
  'fail-on': { values: ['error', 'warning', 'never'] },
  config: {},
  parts: { repeatable: true },
  output: {},
  jobs: {},
  shard: {},
  help: { boolean: true, short: 'h' },
} as const;

/**
 * Runs the check and returns the exit code: 0 clean, 1 a finding reached --fail-on, 2 usage,
 * unreadable input or nothing to check. It answers synchronously when it checks in this process
 * (`--jobs 1`, one file, or an `io` without a worker script), and with a promise when it starts
 * worker threads.
 */
export function runCheck(argv: readonly string[], io: CommandIo): number | Promise<number> {
  const args = parseArgs(argv, FLAGS);
  if (args.flags.get('help')) {
    io.stdout(CHECK_HELP);
    return 0;
  }
  if (args.positional.length === 0) throw new UsageError(`check needs at least one file or folder\nusage: ${CHECK_USAGE}`);
  const shard = parseShard(args.flags.get('shard') as string | undefined);
  const jobs = parseJobs(args.flags.get('jobs') as string | undefined);
  const format = ((args.flags.get('format') as string | undefined) ?? 'text') as CheckFormat;
  const { files, setupFailed, fromStdin } = listFiles(args.positional, shard, io);
  const stdin = fromStdin && files.includes(STDIN_PATH) ? readFileSync(0, 'utf8') : undefined;
  const configurations = loadConfigurations(files, cachedReader(), { config: args.flags.get('config') as string | undefined, parts: args.lists.get('parts') ?? [] });
  const tasks: CheckTask[] = files.map((path, index) => ({ index, path, configKey: configurations.keyOf.get(path)!, ...(path === STDIN_PATH ? { text: stdin } : {}) }));
  const output = args.flags.get('output') as string | undefined;
  let sink;
  try {
    sink = openSink(io, output);
  } catch (error) {
    if (error instanceof UsageError) throw error;
    io.stderr(`rectilens: cannot write ${output}: ${describeError(error)}\n`);
    return 2;
  }
  const run = new CheckRun({
    format, sink, io, total: tasks.length, failOn: (args.flags.get('fail-on') as string | undefined) ?? 'error',
    sarif: { toolVersion: TOOL_VERSION, toUri: toRelativeUri, baseUri: `${pathToFileURL(process.cwd()).href}/` },
    setupFailed,
  });
  const shape = { withRectifiers: format === 'json', withFixes: format === 'sarif' };
  const script = io.checkWorker;
  if (jobs === 1 || tasks.length <= 1 || !script) {
    checkInProcess(tasks, configurations.byKey, shape, (result) => run.add(result));
    return run.finish(configurations.extra);
  }
  if (!existsSync(script)) throw new Error(`the check worker ${script} is missing; run the build (node scripts/build.mjs)`);
  const setup = { shape, configurations: Object.fromEntries(configurations.byKey) };
  return checkInWorkers(tasks, { script, jobs, setup }, (result) => run.add(result)).then(() => run.finish(configurations.extra));
}

/**
 * The sorted file list, this shard's share of it, and whether the run must exit 2 whatever it finds
 * (a path that cannot be listed, a folder without a netlist, nothing matched at all); the reasons go
 * to stderr.
 */
function listFiles(positional: readonly string[], shard: Shard | undefined, io: CommandIo): { files: string[]; setupFailed: boolean; fromStdin: boolean } {
  const fromStdin = positional.includes(STDIN_PATH);
  const { files: listed, problems, empty } = collectNetlistFiles(positional.filter((p) => p !== STDIN_PATH));
  // A file named twice (itself and through its folder) is checked once, at its first place.
  const matched = [...new Set(listed)];
  if (fromStdin) matched.push(STDIN_PATH);
  const files = filesOfShard(matched, shard);
  for (const problem of problems) io.stderr(`rectilens: cannot read ${problem.path}: ${problem.reason}\n`);
  for (const folder of empty) io.stderr(emptyFolderMessage(folder));
  if (shard && files.length === 0 && matched.length > 0) {
    io.stderr(`rectilens: shard ${shard.index}/${shard.count} is empty: the ${matched.length} file${matched.length === 1 ? '' : 's'} matched went to the other shards\n`);
  }
  return { files, fromStdin, setupFailed: problems.length > 0 || empty.length > 0 || matched.length === 0 };
}

/** Where the report goes: standard output, or the `--output` file written as the report grows. */
function openSink(io: CommandIo, output: string | undefined): { write: (text: string) => void; close: () => void } {
  if (output === undefined) return { write: io.stdout, close: () => {} };
  if (io.openOutput) return io.openOutput(output);
  const writeFile = io.writeFile;
  if (!writeFile) throw new UsageError('--output is not available here');
  let text = '';
  return { write: (t) => void (text += t), close: () => writeFile(output, text) };
}

/** SARIF artifact locations are URIs; relative paths stay relative to the working folder, as scanning services expect. */
function toRelativeUri(path: string): string {
  const relative = isAbsolute(path) ? relativePath(process.cwd(), path) : path;
  return relative.split(sep).map(encodeURIComponent).join('/');
}
