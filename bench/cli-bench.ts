/**
 * The command line at scale (issue 18): `check` over folders of 10, 100, 200 and 1,000 generated
 * netlists, run as the user runs it (`node dist/cli.js check DIR --format json --output /dev/null`,
 * a child process, one worker thread per core by default). Each row is the child's wall time, its
 * CPU time (user + system, all threads) and CPU/wall, and its peak RSS: the process's resident
 * high-water mark, which covers every worker thread since they share the process. The child
 * reports its own `process.resourceUsage()` at exit through a preloaded script, so nothing here
 * depends on a `time` program being installed.
 *
 * CPU/wall is only as high as the machine lets it be: Linux shares the CPUs between sessions
 * (autogroups), so while other sessions are busy the child gets its session's share whatever its
 * thread count. Hence the row "ready workers/wall", from the scheduler's own counters: time on a
 * CPU plus time ready to run but waiting for one, summed over the threads that check files (the
 * busiest by CPU time: one per job), per second of wall time — the parallelism the command
 * offers, which an idle machine turns into CPU/wall.
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { BenchFigure } from './measure';

const SIZES = [10, 100, 200, 1000] as const;
const CLI = resolve(__dirname, 'cli.js');

/** Writes the child's own resource use to the file its environment names, as it exits. */
const PRELOAD = `process.on('exit', () => require('node:fs').writeFileSync(process.env.RECTILENS_BENCH_USAGE, JSON.stringify(process.resourceUsage())));\n`;

/** How often the child's threads are sampled. */
const SAMPLE_MS = 20;

interface RunFigures {
  wallS: number;
  cpuS: number;
  /** Summed over the threads that check files: time on a CPU plus time ready to run but waiting for one. */
  readyS: number;
  peakRssMB: number;
  exitCode: number | null;
}

export async function runCliBench(): Promise<BenchFigure[]> {
  const root = mkdtempSync(join(tmpdir(), 'rectilens-cli-bench-'));
  const preload = join(root, 'usage-at-exit.js');
  writeFileSync(preload, PRELOAD);
  const figures: BenchFigure[] = [];
  const measured = new Map<number, RunFigures>();
  try {
    for (const count of SIZES) {
      const dir = join(root, `n${count}`);
      writeLibrary(dir, count);
      if (count === SIZES[0]) expectRectifierInEach(dir);
      const run = await checkFolder(dir, preload, join(root, 'usage.json'), Math.min(availableParallelism(), count));
      measured.set(count, run);
      // Other work on the machine takes cores from the workers; the load beside each row says how much.
      const note = `${availableParallelism()} cores, load ${loadavg()[0]!.toFixed(1)}, exit ${run.exitCode}`;
      figures.push(
        { name: `check ${count} files: wall`, value: run.wallS, unit: 's', note },
        { name: `check ${count} files: CPU (user+sys)`, value: run.cpuS, unit: 's' },
        { name: `check ${count} files: CPU/wall`, value: run.cpuS / run.wallS, unit: '×', ...(count === 200 ? { target: '≥ 1.7 on 2 cores', met: run.cpuS / run.wallS >= 1.7 } : {}) },
        // Contention cannot lower this one: a thread waiting for a core counts. On an idle machine CPU/wall comes up to it.
        { name: `check ${count} files: ready workers/wall`, value: run.readyS / run.wallS, unit: '×', note: 'worker threads on a CPU or waiting for one' },
        { name: `check ${count} files: peak RSS`, value: run.peakRssMB, unit: 'MB' },
        { name: `check ${count} files: per file`, value: (1000 * run.wallS) / count, unit: 'ms' },
      );
    }
    // The same 200 files on one thread, in process: the speed-up the worker threads bring.
    const serial = await checkFolder(join(root, 'n200'), preload, join(root, 'usage.json'), 1, ['--jobs', '1']);
    figures.push(
      { name: 'check 200 files --jobs 1: wall', value: serial.wallS, unit: 's', note: `load ${loadavg()[0]!.toFixed(1)}` },
      { name: 'check 200 files --jobs 1: ready thread/wall', value: serial.readyS / serial.wallS, unit: '×' },
      { name: 'check 200 files: speed-up over --jobs 1', value: serial.wallS / measured.get(200)!.wallS, unit: '×' },
    );
    const ratio = measured.get(1000)!.peakRssMB / measured.get(100)!.peakRssMB;
    figures.push({ name: 'peak RSS 1,000 files / 100 files', value: ratio, unit: '×', target: '≤ 1.5', met: ratio <= 1.5 });
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
  return figures;
}

/** The generated files are what the rows claim: every one holds a recognised rectifier. */
function expectRectifierInEach(dir: string): void {
  const child = spawnSync(process.execPath, [CLI, 'check', dir, '--format', 'json'], { encoding: 'utf8', maxBuffer: 1 << 28 });
  const files = (JSON.parse(child.stdout) as { files: { path: string; rectifiers: unknown[] }[] }).files;
  const without = files.filter((f) => f.rectifiers.length === 0).map((f) => f.path);
  if (without.length) throw new Error(`generated netlists without a recognised rectifier: ${without.join(', ')}`);
}

async function checkFolder(dir: string, preload: string, usagePath: string, checkingThreads: number, extraArgs: string[] = []): Promise<RunFigures> {
  const start = process.hrtime.bigint();
  const child = spawn(process.execPath, ['--require', preload, CLI, 'check', dir, '--format', 'json', '--output', '/dev/null', ...extraArgs], {
    env: { ...process.env, RECTILENS_BENCH_USAGE: usagePath }, stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (chunk) => (stderr += chunk));
  const threads = new Map<string, [number, number]>();
  const timer = setInterval(() => sampleThreads(child.pid!, threads), SAMPLE_MS);
  const exitCode = await new Promise<number | null>((resolveExit) => child.on('exit', (code) => resolveExit(code)));
  clearInterval(timer);
  const wallS = Number(process.hrtime.bigint() - start) / 1e9;
  if (exitCode === 2 || exitCode === null) throw new Error(`check failed (${exitCode}): ${stderr}`);
  const usage = JSON.parse(readFileSync(usagePath, 'utf8')) as NodeJS.ResourceUsage;
  // The busiest threads by time on a CPU are the ones checking files; the rest are V8's helpers and the idle main thread.
  const busiest = [...threads.values()].sort((a, b) => b[0] - a[0]).slice(0, checkingThreads);
  const readyNs = busiest.reduce((sum, [onCpuNs, waitingNs]) => sum + onCpuNs + waitingNs, 0);
  return { wallS, cpuS: (usage.userCPUTime + usage.systemCPUTime) / 1e6, readyS: readyNs / 1e9, peakRssMB: usage.maxRSS / 1024, exitCode };
}

/**
 * The scheduler's counters of each of the child's threads (`/proc/PID/task/TID/schedstat`: time on
 * a CPU and time ready but waiting for one, in ns), the latest seen kept per thread; a thread
 * that ended since the last sample loses at most one sampling interval.
 */
function sampleThreads(pid: number, into: Map<string, [number, number]>): void {
  let tids: string[];
  try {
    tids = readdirSync(`/proc/${pid}/task`);
  } catch {
    return;
  }
  for (const tid of tids) {
    try {
      const [onCpuNs, waitingNs] = readFileSync(`/proc/${pid}/task/${tid}/schedstat`, 'utf8').split(' ').map(Number);
      into.set(tid, [onCpuNs!, waitingNs!]);
    } catch {
      // The thread ended between the listing and the read.
    }
  }
}

/**
 * `count` netlists, each with one rectifier and each different: full bridges and half-wave
 * rectifiers in turn, at 230 V 50 Hz or 120 V 60 Hz, with their own source resistance, capacitor
 * and load, and every fourth file padded with an RC ladder apart from the rectifier, to vary size.
 */
function writeLibrary(dir: string, count: number): void {
  mkdirSync(dir, { recursive: true });
  for (let k = 0; k < count; k++) {
    const [vrms, hz, vpk] = k % 2 === 0 ? [230, 50, 325] : [120, 60, 170];
    const lines = [
      `Generated rectifier ${k} (synthetic, our own)`, `*@ mains ${vrms}V ${hz}Hz`, '.model DGEN D(IS=2.5n N=1.75 RS=0.04)',
      '*@ rate DGEN vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=100',
    ];
    // A half-wave rectifier's source, capacitor and load share the ground; a bridge's source floats.
    const halfWave = k % 3 === 2;
    lines.push(`V1 l ${halfWave ? '0' : 'n'} SIN(0 ${vpk} ${hz})`, `RS l a ${1 + (k % 7)}`);
    if (halfWave) lines.push('D1 a p DGEN', `C1 p 0 ${100 + 20 * (k % 5)}u`, `RL p 0 ${3000 + 100 * (k % 11)}`);
    else lines.push('D1 a p DGEN', 'D2 n p DGEN', 'D3 m a DGEN', 'D4 m n DGEN', `C1 p m ${47 + 10 * (k % 5)}u`, `RL p m ${2000 + 100 * (k % 11)}`);
    if (k % 4 === 3) lines.push(...fillerLadder(20 + 10 * (k % 6)));
    writeFileSync(join(dir, `r${String(k).padStart(4, '0')}.cir`), `${lines.join('\n')}\n`);
  }
}

/** `stages` RC sections fed by a DC source of their own: cards to parse and elaborate, nothing to solve. */
function fillerLadder(stages: number): string[] {
  const lines = ['VF f0 0 DC 5'];
  for (let i = 0; i < stages; i++) lines.push(`RF${i} f${i} f${i + 1} 1.5k`, `CF${i} f${i + 1} 0 22n`);
  return lines;
}
