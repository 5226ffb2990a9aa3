import { closeSync, openSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';

/** The command line's window on the world, passed in so commands stay testable in-process. */
export interface CommandIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Whether stderr is a terminal (progress is shown only then). */
  stderrIsTty: boolean;
  /** Writes a whole file (the HTML report); throws with the system's reason when it cannot. */
  writeFile?: (path: string, text: string) => void;
  /** Opens a file to be written piece by piece (`check --output`); throws with the system's reason when it cannot. */
  openOutput?: (path: string) => { write: (text: string) => void; close: () => void };
  /** The bundled `check` worker; without it `check` runs in this process whatever `--jobs` says. */
  checkWorker?: string;
}

/** Set once standard output has failed; later output is dropped rather than failing again. */
let outputFailed = false;

export const processIo: CommandIo = {
  stdout: (text) => void (outputFailed || process.stdout.write(text)),
  stderr: (text) => process.stderr.write(text),
  stderrIsTty: Boolean(process.stderr.isTTY),
  writeFile: (path, text) => writeFileSync(path, text, 'utf8'),
  openOutput: (path) => {
    const fd = openSync(path, 'w');
    return {
      write: (text) => {
        const bytes = Buffer.from(text, 'utf8');
        for (let at = 0; at < bytes.length;) at += writeSync(fd, bytes, at);
      },
      close: () => closeSync(fd),
    };
  },
  // Beside dist/cli.js, which this module is bundled into.
  checkWorker: join(__dirname, 'check-worker.js'),
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
