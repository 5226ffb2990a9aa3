/**
 * A `check` worker thread (`dist/check-worker.js`): checks the roots the main thread hands it, one
 * at a time, and posts back each compact result (`check-file.ts`). Includes shared by several roots
 * are read once per thread; a root's own text is not kept after its check.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { checkFile, readerForTask, type CheckTask } from './check-file';
import type { CheckWorkerAnswer, CheckWorkerSetup } from './check-pool';
import { cachedReader } from './netlist-files';

const setup = workerData as CheckWorkerSetup;
const included = cachedReader();

parentPort?.on('message', (task: CheckTask) => {
  let answer: CheckWorkerAnswer;
  try {
    const configuration = setup.configurations[task.configKey] ?? { settings: {}, partsFiles: [] };
    answer = { result: checkFile(task, configuration, readerForTask(task, included), setup.shape) };
  } catch (error) {
    answer = { failed: { index: task.index, message: error instanceof Error ? error.message : String(error) } };
  }
  parentPort?.postMessage(answer);
});
