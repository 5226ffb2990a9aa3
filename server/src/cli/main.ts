/** The `rectilens` command: a thin adapter from argv to the core's commands. */
import { UsageError } from './args';
import { CHECK_USAGE, runCheck } from './check-command';
import { exitOnOutputFailure, processIo, type CommandIo } from './command-io';
import { COMPARE_USAGE, runCompare } from './compare-command';
import { REPORT_USAGE, runReport } from './report-command';
import { startStdioOrIpcServer } from '../lsp/start';
import { TOOL_VERSION } from './tool-version';

const LSP_USAGE = 'rectilens lsp --stdio';
const USAGE = `usage:
  ${CHECK_USAGE}
  ${REPORT_USAGE}
  ${COMPARE_USAGE}
  ${LSP_USAGE}
  rectilens --version

Each command takes --help (-h) for its options.
`;

/**
 * Runs one command line in this process; returns the exit code, or −1 when a long-running server
 * was started. `check` stays in this process here (an `io` with a worker script goes through
 * `runCommand`).
 */
export function runCommandLine(argv: readonly string[], io: CommandIo): number {
  const code = runCommand(argv, { ...io, checkWorker: undefined });
  if (typeof code !== 'number') throw new Error('unreachable: check without a worker script answers synchronously');
  return code;
}

/** Runs one command line; `check` with worker threads answers with a promise of its exit code. */
export function runCommand(argv: readonly string[], io: CommandIo): number | Promise<number> {
  const [command, ...rest] = argv;
  try {
    switch (command) {
      case 'check':
        return runCheck(rest, io);
      case 'report':
        return runReport(rest, io);
      case 'compare':
        return runCompare(rest, io);
      case 'lsp':
        if (!rest.includes('--stdio')) throw new UsageError(`the language server speaks over standard input and output: ${LSP_USAGE}`);
        startLanguageServer();
        return -1;
      case undefined:
      case 'help':
      case '--help':
      case '-h':
        io.stdout(USAGE);
        return command === undefined ? 2 : 0;
      case '--version':
        io.stdout(`rectilens ${TOOL_VERSION}\n`);
        return 0;
      default:
        throw new UsageError(`unknown command '${command}'\n${USAGE}`);
    }
  } catch (error) {
    if (error instanceof UsageError) {
      io.stderr(`rectilens: ${error.message}\n`);
      return 2;
    }
    throw error;
  }
}

if (require.main === module) {
  // The language server owns its standard output (the protocol); every other command reports a failed write.
  if (process.argv[2] !== 'lsp') exitOnOutputFailure();
  const code = runCommand(process.argv.slice(2), processIo);
  if (typeof code === 'number') {
    if (code >= 0) process.exitCode = code;
  } else {
    // A failed write to standard output may have set 2 already; it wins, as above.
    code.then((c) => void (process.exitCode ??= c), (error: unknown) => {
      process.stderr.write(`rectilens: ${error instanceof Error ? error.stack ?? error.message : String(error)}\n`);
      process.exitCode = 2;
    });
  }
}

function startLanguageServer(): void {
  startStdioOrIpcServer();
}
