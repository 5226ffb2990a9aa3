/**
 * Deterministic results: every limit counts work (steps, periods, rectifiers), never time, so the
 * same file gives the same output on a loaded machine as on an idle one. The file here has more
 * rectifiers than one analysis may solve, so the solver budget's cut falls inside it — the place a
 * wall-clock budget would have moved with the load. `RECTILENS_DETERMINISM=1000` runs the issue's
 * 1,000-rectifier file (several minutes, the solver budget cutting it near rectifier 500); npm test runs 60.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const RECTIFIERS = Number(process.env.RECTILENS_DETERMINISM ?? 60);
const CLI = join(__dirname, '../../dist/cli.js');

/** N bridges of our own, each 230 V with its own source, filter and load. */
function manyBridges(n: number): string {
  const lines = ['Many bridges (synthetic, our own)', '*@ mains 230V 50Hz', '.model DG D(IS=2.5n N=1.75 RS=0.04)', '*@ rate DG vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=100'];
  for (let k = 0; k < n; k++) {
    lines.push(`V${k} l${k} n${k} SIN(0 325 50)`, `RS${k} l${k} a${k} ${1 + (k % 7)}`, `D${k}a a${k} p${k} DG`, `D${k}b n${k} p${k} DG`,
      `D${k}c m${k} a${k} DG`, `D${k}d m${k} n${k} DG`, `C${k} p${k} m${k} ${47 + (k % 5) * 10}u`, `RL${k} p${k} m${k} ${2000 + 100 * (k % 11)}`);
  }
  return `${lines.join('\n')}\n`;
}

const burners: ChildProcess[] = [];
afterAll(() => burners.forEach((b) => b.kill('SIGKILL')));

describe(`the same ${RECTIFIERS}-rectifier file`, () => {
  it('gives byte-identical output three times, one of them with every core busy', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-determinism-'));
    const path = join(dir, 'many.cir');
    writeFileSync(path, manyBridges(RECTIFIERS));
    const check = () => spawnSync(process.execPath, [CLI, 'check', '--format', 'json', path], { encoding: 'utf8', maxBuffer: 1 << 30 });
    const idle = check();
    // Load: a busy loop per core while the second run goes.
    for (let k = 0; k < availableParallelism(); k++) burners.push(spawn(process.execPath, ['-e', 'for (;;) {}'], { stdio: 'ignore' }));
    const loaded = check();
    burners.forEach((b) => b.kill('SIGKILL'));
    const again = check();
    expect(idle.stdout.length).toBeGreaterThan(1000);
    expect(loaded.stdout).toBe(idle.stdout);
    expect(again.stdout).toBe(idle.stdout);
    expect([idle.status, loaded.status, again.status]).toEqual([idle.status, idle.status, idle.status]);
    // The budget's cut is inside the file: some rectifiers were solved, the rest named by a limit finding.
    const report = JSON.parse(idle.stdout);
    const solved = report.files[0].rectifiers.length;
    expect(solved).toBeGreaterThan(0);
    if (RECTIFIERS > solved) expect(report.files[0].diagnostics.some((d: { code: string }) => d.code === 'limit-exceeded')).toBe(true);
  }, 600_000);
});
