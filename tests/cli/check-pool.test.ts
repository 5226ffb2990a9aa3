/**
 * The worker pool of `check --jobs N` on a stand-in worker script of the test's own: results are
 * handed on in the order of the file list whatever order they finish in, and a worker thread that
 * dies turns its file into an `internal-error` entry and is replaced, so the run goes on.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CheckedFile, CheckTask } from '../../server/src/cli/check-file';
import { checkInWorkers } from '../../server/src/cli/check-pool';

/**
 * Answers each task with its path as the one finding's message, after an amount of busy work that
 * falls with the index (so later files tend to finish first); a path containing "crash" ends the
 * thread instead.
 */
const STAND_IN = `
const { parentPort } = require('node:worker_threads');
parentPort.on('message', (task) => {
  if (task.path.includes('crash')) process.exit(3);
  let x = 0;
  for (let i = 0; i < (40 - task.index) * 20000; i++) x += i % 7;
  const d = { line: 1, column: 1, endLine: 1, endColumn: 1, severity: 'info', code: 'stand-in', message: task.path + ':' + (x >= 0) };
  parentPort.postMessage({ result: { index: task.index, path: task.path, rectifiers: [], byFile: [[task.path, [d]]] } });
});
`;

function standIn(): string {
  const path = join(mkdtempSync(join(tmpdir(), 'rectilens-pool-')), 'stand-in-worker.js');
  writeFileSync(path, STAND_IN);
  return path;
}

async function runPool(paths: string[], jobs: number): Promise<CheckedFile[]> {
  const tasks: CheckTask[] = paths.map((path, index) => ({ index, path, configKey: '' }));
  const seen: CheckedFile[] = [];
  await checkInWorkers(tasks, { script: standIn(), jobs, setup: { shape: { withRectifiers: false, withFixes: false }, configurations: {} } }, (r) => seen.push(r));
  return seen;
}

describe('the check worker pool', () => {
  it('hands the results on in the order of the list with 1, 2 and 3 threads', async () => {
    const paths = Array.from({ length: 30 }, (_, k) => `f${k}.cir`);
    for (const jobs of [1, 2, 3]) {
      const seen = await runPool(paths, jobs);
      expect(seen.map((r) => r.path)).toEqual(paths);
      expect(seen.map((r) => r.byFile[0]![1][0]!.message)).toEqual(paths.map((p) => `${p}:true`));
    }
  }, 60_000);

  it('gives a file whose thread died an internal-error entry, and checks the rest on a new thread', async () => {
    const paths = ['a.cir', 'b-crash.cir', 'c.cir', 'd-crash.cir', 'e.cir'];
    const seen = await runPool(paths, 2);
    expect(seen.map((r) => r.path)).toEqual(paths);
    const codes = seen.map((r) => r.byFile[0]![1][0]!.code);
    expect(codes).toEqual(['stand-in', 'internal-error', 'stand-in', 'internal-error', 'stand-in']);
    expect(seen[1]!.byFile[0]![1][0]!.message).toContain('exited with code 3');
  }, 60_000);
});
