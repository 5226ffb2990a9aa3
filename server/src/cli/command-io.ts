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

export const processIo: CommandIo = {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  stderrIsTty: Boolean(process.stderr.isTTY),
  writeFile: (path, text) => writeFileSync(path, text, 'utf8'),
};
