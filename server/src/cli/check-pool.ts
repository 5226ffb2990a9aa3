/**
 * `check --jobs N`: N worker threads, each taking the next unchecked root as it finishes one, and
 * the results handed on in the order of the file list, each as soon as it and every earlier one
 * are in. Workers run at most `window` files ahead of the oldest unfinished one, so one slow file
 * cannot make the finished results behind it pile up. A worker that dies (out of memory, a crash)
 * turns its file into an `internal-error` entry and is replaced; the run goes on.
 */
import { Worker } from 'node:worker_threads';
import type { CheckConfiguration, CheckedFile, CheckTask, ResultShape } from './check-file';

export interface CheckWorkerSetup {
  shape: ResultShape;
  /** The settings and parts files of every configuration in this run, by key. */
  configurations: Record<string, CheckConfiguration>;
}

export type CheckWorkerAnswer = { result: CheckedFile } | { failed: { index: number; message: string } };

export interface PoolOptions {
  /** The bundled worker (`dist/check-worker.js`). */
  script: string;
  jobs: number;
  setup: CheckWorkerSetup;
}

/** Checks `tasks` (whose `index` is their place, 0…n−1) in worker threads; `onResult` sees them in order. */
export function checkInWorkers(tasks: readonly CheckTask[], options: PoolOptions, onResult: (result: CheckedFile) => void): Promise<void> {
  const window = Math.max(64, 8 * options.jobs);
  const finished = new Map<number, CheckedFile>();
  let nextTask = 0;
  let nextResult = 0;
  return new Promise((resolveRun, rejectRun) => {
    const workers = new Set<Worker>();
    let stopping = false;
    const stopAll = () => {
      stopping = true;
      return Promise.all([...workers].map((w) => w.terminate()));
    };
    const deliver = (result: CheckedFile) => {
      finished.set(result.index, result);
      try {
        while (finished.has(nextResult)) {
          const next = finished.get(nextResult)!;
          finished.delete(nextResult++);
          onResult(next);
        }
      } catch (error) {
        void stopAll().then(() => rejectRun(error));
        return;
      }
      if (nextResult === tasks.length) void stopAll().then(() => resolveRun());
    };
    const start = () => {
      const worker = new Worker(options.script, { workerData: options.setup });
      workers.add(worker);
      let current: CheckTask | undefined;
      const feed = () => {
        if (stopping) return;
        current = nextTask < tasks.length && nextTask < nextResult + window ? tasks[nextTask++] : undefined;
        if (current) worker.postMessage(current);
        else idle.add(feed);
      };
      worker.on('message', (answer: CheckWorkerAnswer) => {
        current = undefined;
        deliver('result' in answer ? answer.result : failedFile(tasks[answer.failed.index]!, answer.failed.message));
        feed();
        wakeIdle();
      });
      worker.on('error', (error) => died(error.message));
      worker.on('exit', (code) => died(`its thread exited with code ${code}`));
      let gone = false;
      const died = (reason: string) => {
        if (gone || stopping) return;
        gone = true;
        workers.delete(worker);
        idle.delete(feed);
        const lost = current;
        current = undefined;
        // A replacement for each lost file (bounded by the files), or when no worker is left.
        if (lost || (workers.size === 0 && nextTask < tasks.length)) start();
        if (lost) {
          deliver(failedFile(lost, reason));
          wakeIdle();
        }
      };
      feed();
    };
    // Workers waiting for the window to move on; woken whenever a result is handed on.
    const idle = new Set<() => void>();
    const wakeIdle = () => {
      for (const feed of [...idle]) {
        if (nextTask >= tasks.length || nextTask >= nextResult + window) return;
        idle.delete(feed);
        feed();
      }
    };
    if (tasks.length === 0) return resolveRun();
    for (let k = 0; k < Math.min(options.jobs, tasks.length); k++) start();
  });
}

/** The entry of a root whose check stopped, so it never passes as clean. */
export function failedFile(task: CheckTask, reason: string): CheckedFile {
  const message = `This file was not checked: ${reason.split('\n')[0]}. None of its rectifiers were analysed; please report the file if this persists.`;
  return {
    index: task.index, path: task.path, rectifiers: [],
    byFile: [[task.path, [{ line: 1, column: 1, endLine: 1, endColumn: 1, severity: 'error', code: 'internal-error', message }]]],
  };
}
