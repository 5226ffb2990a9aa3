/** A status-bar item shown only while an analysis runs for longer than a moment. */
import * as vscode from 'vscode';

const SHOW_AFTER_MS = 400;

export class BusyIndicator implements vscode.Disposable {
  private readonly item = vscode.window.createStatusBarItem(vscode.StatusBarAlignment.Left, 10);
  private timer: NodeJS.Timeout | undefined;

  update(busy: boolean, pending: number): void {
    clearTimeout(this.timer);
    if (!busy) {
      this.item.hide();
      return;
    }
    this.item.text = `$(sync~spin) Rectilens: analysing ${pending} file${pending === 1 ? '' : 's'}`;
    this.timer = setTimeout(() => this.item.show(), SHOW_AFTER_MS);
  }

  dispose(): void {
    clearTimeout(this.timer);
    this.item.dispose();
  }
}
