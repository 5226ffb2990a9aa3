/** The `rectilens` command: a thin adapter from argv to the core's commands. */
import { UsageError } from './args';
import { CHECK_USAGE, runCheck } from './check-command';
import { processIo, type CommandIo } from './command-io';

const USAGE = `usage:
  ${CHECK_USAGE}
`;

/** Runs one command line; returns the exit code. */
export function runCommandLine(argv: readonly string[], io: CommandIo): number {
  const [command, ...rest] = argv;
  try {
    switch (command) {
      case 'check':
        return runCheck(rest, io);
      case undefined:
      case 'help':
      case '--help':
        io.stdout(USAGE);
        return command === undefined ? 2 : 0;
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
  const code = runCommandLine(process.argv.slice(2), processIo);
  process.exitCode = code;
}
