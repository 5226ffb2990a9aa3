/**
 * The analysis's busy state as standard protocol progress (`window/workDoneProgress/create`, then
 * `$/progress` begin, report and end), which any editor that announces `window.workDoneProgress`
 * shows (VS Code as a status-bar item); an editor that does not is told nothing. A batch shorter
 * than `SHOW_AFTER_MS` shows nothing, so typing does not make the status bar flicker; the delay
 * changes what is shown, never what is found.
 */
import type { Connection, WorkDoneProgressServerReporter } from 'vscode-languageserver/node';

export const PROGRESS_TITLE = 'Rectilens';

/** How long a batch of analyses runs before the editor is told (a keystroke's analysis is usually shorter). */
export const SHOW_AFTER_MS = 400;

export class AnalysisProgress {
  private reporter: Promise<WorkDoneProgressServerReporter | undefined> | undefined;
  private timer: NodeJS.Timeout | undefined;
  private message = '';

  constructor(private readonly connection: Connection, private readonly supported: () => boolean, private readonly delayMs = SHOW_AFTER_MS) {}

  update(busy: boolean, pending: number): void {
    if (!this.supported()) return;
    this.message = `analysing ${pending} netlist${pending === 1 ? '' : 's'}`;
    if (!busy) {
      clearTimeout(this.timer);
      this.timer = undefined;
      const ending = this.reporter;
      this.reporter = undefined;
      void ending?.then((r) => r?.done());
      return;
    }
    if (this.reporter) {
      const message = this.message;
      void this.reporter.then((r) => r?.report(message));
      return;
    }
    if (this.timer) return;
    this.timer = setTimeout(() => {
      this.timer = undefined;
      this.reporter = this.connection.window.createWorkDoneProgress().then(
        (r) => { r.begin(PROGRESS_TITLE, undefined, this.message); return r; },
        () => undefined,
      );
    }, this.delayMs);
  }
}
