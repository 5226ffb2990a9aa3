/**
 * One `check` run's report as it is written: the checked files come in, in order, and go out at
 * once through the format's writer; what stays is what the exit code needs (whether a finding
 * reached `--fail-on`, whether a root was unreadable). Also the in-process loop that `--jobs 1`
 * uses, over the same per-file check the worker threads run.
 */
import { reaches } from '../findings/index';
import { CheckEntries } from './check-entries';
import { checkFile, readerForTask, type CheckConfiguration, type CheckedFile, type CheckTask, type ResultShape } from './check-file';
import { failedFile } from './check-pool';
import { entryWriter, type CheckFormat, type EntryWriter, type SarifContext } from './check-writers';
import type { CommandIo } from './command-io';
import { PROGRESS_MIN_FILES } from './configured-analysis';
import { cachedReader } from './netlist-files';
import type { JsonFile, ReportedFile } from './report-json';

export interface CheckRunOptions {
  format: CheckFormat;
  sink: { write: (text: string) => void; close: () => void };
  io: CommandIo;
  /** Files this run checks (for the progress line). */
  total: number;
  failOn: string;
  sarif: SarifContext;
  /** A path could not be listed, a folder held no netlist, or nothing matched: the exit code is 2 whatever is found. */
  setupFailed: boolean;
}

export class CheckRun {
  private readonly entries = new CheckEntries();
  private readonly writer: EntryWriter;
  private readonly progress: boolean;
  private done = 0;
  private unreadable = 0;
  private failing = false;

  constructor(private readonly options: CheckRunOptions) {
    this.progress = options.io.stderrIsTty && options.total >= PROGRESS_MIN_FILES;
    // The progress line is cleared before each piece of report, so the two never share a line of a terminal.
    this.writer = entryWriter(options.format, (text) => {
      if (this.progress) options.io.stderr('\r\x1b[K');
      options.sink.write(text);
    }, options.sarif);
  }

  /** The next file in order. */
  add(result: CheckedFile): void {
    if (this.progress) this.options.io.stderr(`\r\x1b[Krectilens: checking ${++this.done}/${this.options.total} ${result.path}`);
    if (result.unreadable !== undefined) {
      this.unreadable++;
      if (this.progress) this.options.io.stderr('\r\x1b[K');
      this.options.io.stderr(`rectilens: cannot read ${result.path}: ${result.unreadable}\n`);
      return;
    }
    const entry = this.entries.add(result);
    if (entry) this.write(entry);
  }

  /** Writes the entries after the roots and the end of the report; returns the exit code. */
  finish(extra: readonly ReportedFile[]): number {
    for (const entry of this.entries.finish(extra)) this.write(entry);
    if (this.progress) this.options.io.stderr('\r\x1b[K');
    this.writer.end();
    this.options.sink.close();
    if (this.options.setupFailed || this.unreadable > 0) return 2;
    if (this.options.failOn === 'never') return 0;
    return this.failing ? 1 : 0;
  }

  private write(entry: JsonFile): void {
    if (this.options.failOn !== 'never') this.failing ||= entry.diagnostics.some((d) => reaches(d.severity as 'error', this.options.failOn as 'error'));
    this.writer.entry(entry);
  }
}

/** `--jobs 1`: the files checked one after the other in this process, by the function the workers run. */
export function checkInProcess(
  tasks: readonly CheckTask[], configurations: ReadonlyMap<string, CheckConfiguration>, shape: ResultShape, onResult: (result: CheckedFile) => void,
): void {
  const included = cachedReader();
  for (const task of tasks) {
    const configuration = configurations.get(task.configKey) ?? { settings: {}, partsFiles: [] };
    let result: CheckedFile;
    try {
      result = checkFile(task, configuration, readerForTask(task, included), shape);
    } catch (error) {
      result = failedFile(task, error instanceof Error ? error.message : String(error));
    }
    onResult(result);
  }
}
