/** The examples, analysed once per test file, and small helpers to run the command line in-process. */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { runCommandLine } from '../../server/src/cli/main';
import type { CommandIo } from '../../server/src/cli/command-io';

export const EXAMPLES_DIR = join(__dirname, '..', '..', 'examples');

/** Every example's path, sorted. */
export function examplePaths(): string[] {
  return readdirSync(EXAMPLES_DIR).filter((n) => n.endsWith('.cir')).sort().map((n) => join(EXAMPLES_DIR, n));
}

const cache = new Map<string, FileAnalysis>();

/** The analysis of one example by file name (e.g. `led-driver-230v.cir`). */
export function analyseExample(name: string): FileAnalysis {
  const path = join(EXAMPLES_DIR, name);
  let file = cache.get(path);
  if (!file) {
    file = analyze({ roots: [path], readText: (p) => readFileSync(p, 'utf8') }).files.get(path)!;
    cache.set(path, file);
  }
  return file;
}

export interface RunResult {
  code: number;
  stdout: string;
  stderr: string;
  written: Map<string, string>;
}

/** Runs `rectilens …` in-process; files the command writes are kept in `written`. */
export function run(argv: string[], options: { tty?: boolean; writeFails?: boolean } = {}): RunResult {
  const result: RunResult = { code: 0, stdout: '', stderr: '', written: new Map() };
  const io: CommandIo = {
    stdout: (t) => { result.stdout += t; },
    stderr: (t) => { result.stderr += t; },
    stderrIsTty: options.tty ?? false,
    writeFile: (path, text) => {
      if (options.writeFails) throw Object.assign(new Error('EACCES: permission denied'), { code: 'EACCES' });
      result.written.set(path, text);
    },
  };
  result.code = runCommandLine(argv, io);
  return result;
}
