import { writeFileSync } from 'node:fs';

/** The command line's window on the world, passed in so commands stay testable in-process. */
export interface CommandIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Whether stderr is a terminal (progress is shown only then). */
  stderrIsTty: boolean;
  /** Writes a whole file (the HTML report); throws with the system's reason when it cannot. */
  writeFile?: (path: string, text: string) => void;
}

/** Set once standard output has failed; later output is dropped rather than failing again. */
let outputFailed = false;

export const processIo: CommandIo = {
  stdout: (text) => void (outputFailed || process.stdout.write(text)),
  stderr: (text) => process.stderr.write(text),
  stderrIsTty: Boolean(process.stderr.isTTY),
  writeFile: (path, text) => writeFileSync(path, text, 'utf8'),
};

/**
 * A failed write to standard output (a reader that closed the pipe, a full disk, `> /dev/full`)
 * ends the command with exit 2 and one line on stderr, instead of an unhandled 'error' event that
 * exits 1 with a stack trace. The error arrives after the command has set its own exit code, so
 * this one wins.
 */
export function exitOnOutputFailure(stream: NodeJS.WriteStream = process.stdout, stderr: (text: string) => void = (t) => void process.stderr.write(t)): void {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (!outputFailed) stderr(`rectilens: cannot write the output: ${describeWriteError(error)}\n`);
    outputFailed = true;
    process.exitCode = 2;
  });
}

function describeWriteError(error: NodeJS.ErrnoException): string {
  if (error.code === 'EPIPE') return 'the reading end of the pipe was closed (EPIPE)';
  if (error.code === 'ENOSPC') return 'no space left on the device (ENOSPC)';
  return error.code ? `${error.message} (${error.code})` : error.message;
}
