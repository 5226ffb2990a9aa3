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

/** Runs one command line; returns the exit code, or −1 when a long-running server was started. */
export function runCommandLine(argv: readonly string[], io: CommandIo): number {
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
  const code = runCommandLine(process.argv.slice(2), processIo);
  if (code >= 0) process.exitCode = code;
}

function startLanguageServer(): void {
  startStdioOrIpcServer();
}
