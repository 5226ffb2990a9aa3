/**
 * `check --jobs N` and `--shard K/N` on the bundled CLI (`dist/cli.js`, built by `npm test`): the
 * report is byte for byte the same for any number of worker threads, and the shards of a run deal
 * out its sorted file list so that together they check each file exactly once.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';

const CLI = resolve(__dirname, '../../dist/cli.js');

function cli(args: string[], input?: string) {
  const result = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', maxBuffer: 1 << 28, ...(input === undefined ? {} : { input }) });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** A bridge of our own with its own line resistance and capacitor, so each file's figures differ. */
function bridge(k: number): string {
  return [
    `Bridge ${k} (synthetic, our own)`, '*@ mains 230V 50Hz', '.model DG D(IS=2.5n N=1.75 RS=0.04)',
    '*@ rate DG vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=100', 'V1 l n SIN(0 325 50)', `RS l a ${1 + k}`,
    'D1 a p DG', 'D2 n p DG', 'D3 m a DG', 'D4 m n DG', `C1 p m ${47 + 10 * k}u`, `RL p m ${2000 + 300 * k}`, '',
  ].join('\n');
}

/**
 * Roots with rectifiers, findings in a library that several roots include, with `crossIncludes` a
 * root that an earlier root includes and one that a later root includes, a broken file, and a sub-folder with its own
 * configuration (with a finding of its own) and parts file.
 */
function library(crossIncludes: boolean): string {
  const dir = mkdtempSync(join(tmpdir(), 'rectilens-jobs-'));
  for (let k = 1; k <= 5; k++) writeFileSync(join(dir, `b${k}.cir`), bridge(k));
  writeFileSync(join(dir, 'common.inc'), 'R9 q 0 2k2\n');
  if (crossIncludes) {
    writeFileSync(join(dir, 'a-first.cir'), 'First (our own)\n.include "b2.cir"\n.include "common.inc"\nR1 a 0 1k\n');
    writeFileSync(join(dir, 'z-last.cir'), 'Last (our own)\n.include "b1.cir"\n.include "common.inc"\nR1 a 0 4k7\n');
  }
  writeFileSync(join(dir, 'broken.cir'), 'broken\nD1 a\n');
  mkdirSync(join(dir, 'sub'));
  writeFileSync(join(dir, 'sub', 'rectilens.json'), JSON.stringify({ partsFiles: ['parts.json'], notASetting: 1 }));
  writeFileSync(join(dir, 'sub', 'parts.json'), JSON.stringify({ version: 1, parts: [] }));
  writeFileSync(join(dir, 'sub', 'c.cir'), `${bridge(6)}.include "../common.inc"\n`);
  return dir;
}

describe('check --jobs', () => {
  const dir = library(true);

  it.each(['text', 'json', 'sarif', 'ci'])('writes the same %s report, stderr and exit code with 1, 2 and 3 jobs', (format) => {
    const runs = [1, 2, 3].map((jobs) => cli(['check', dir, '--format', format, '--jobs', String(jobs)]));
    // The broken file's syntax error makes every run exit 1 (the default --fail-on error).
    expect(runs.map((r) => r.code)).toEqual([1, 1, 1]);
    expect(runs[0]!.stdout.length).toBeGreaterThan(200);
    expect(runs[1]!.stdout).toBe(runs[0]!.stdout);
    expect(runs[2]!.stdout).toBe(runs[0]!.stdout);
    expect(runs[1]!.stderr).toBe(runs[0]!.stderr);
    expect(runs[2]!.stderr).toBe(runs[0]!.stderr);
  }, 120_000);

  it('lists the files in the sorted order, each root once, and the shared library once after them', () => {
    const report = JSON.parse(cli(['check', dir, '--format', 'json', '--jobs', '2']).stdout);
    const paths: string[] = report.files.map((f: { path: string }) => f.path);
    const roots = ['a-first.cir', 'b1.cir', 'b2.cir', 'b3.cir', 'b4.cir', 'b5.cir', 'broken.cir', 'sub/c.cir', 'z-last.cir'].map((n) => join(dir, n));
    expect(paths.slice(0, roots.length)).toEqual(roots);
    expect(paths.filter((p) => p === join(dir, 'common.inc'))).toHaveLength(1);
    // Every bridge was solved: one rectifier in each of b1…b5 and sub/c, and in a-first and z-last,
    // which include b2 and b1.
    expect(report.files.filter((f: { rectifiers: unknown[] }) => f.rectifiers.length === 1)).toHaveLength(8);
  }, 60_000);

  it('shows a root that an earlier root includes as that root reads it, and adds a later includer\'s findings after the roots', () => {
    const report = JSON.parse(cli(['check', dir, '--format', 'json', '--jobs', '2']).stdout);
    const entries = (name: string) => (report.files as { path: string; diagnostics: { code: string; line: number }[] }[]).filter((f) => f.path === join(dir, name));
    // Included, a file has no title line, so 'Bridge 2 …' reads as a B card: a-first (before b2)
    // reads b2 that way, and b2's one entry shows it.
    const titleAsCard = (d: { code: string; line: number }) => d.code === 'unknown-element' && d.line === 1;
    expect(entries('b2.cir')).toHaveLength(1);
    expect(entries('b2.cir')[0]!.diagnostics.some(titleAsCard)).toBe(true);
    // b1 is written before z-last (which includes it) is checked: its own entry, then z-last's new finding in it.
    const b1 = entries('b1.cir');
    expect(b1).toHaveLength(2);
    expect(b1[0]!.diagnostics.some(titleAsCard)).toBe(false);
    expect(b1[1]!.diagnostics.filter((d) => !titleAsCard(d))).toEqual([]);
    expect(b1[1]!.diagnostics.some(titleAsCard)).toBe(true);
  }, 60_000);

  it('writes the same report to --output as to standard output', () => {
    const out = join(dir, 'report.json');
    const toFile = cli(['check', dir, '--format', 'json', '--jobs', '2', '--output', out]);
    expect(toFile.stdout).toBe('');
    expect(readFileSync(out, 'utf8')).toBe(cli(['check', dir, '--format', 'json', '--jobs', '2']).stdout);
  }, 60_000);

  it('gives, in a worker thread, the JSON report the in-process check gives', () => {
    let stdout = '';
    runCommandLine(['check', dir, '--format', 'json'], { stdout: (t) => (stdout += t), stderr: () => {}, stderrIsTty: false });
    expect(cli(['check', dir, '--format', 'json', '--jobs', '3']).stdout).toBe(stdout);
  }, 60_000);
});

describe('check --shard', () => {
  // No root includes another here, so the report's netlist entries are exactly the roots checked.
  const dir = library(false);
  const all = JSON.parse(cli(['check', dir, '--format', 'json', '--jobs', '1']).stdout).files.map((f: { path: string }) => f.path) as string[];
  const roots = all.filter((p) => p.endsWith('.cir'));

  it('deals the sorted list round-robin: shard K of 3 has the files at places i with i mod 3 = K − 1', () => {
    const shards = [1, 2, 3].map((k) => cli(['check', dir, '--format', 'json', '--shard', `${k}/3`]));
    const checked = shards.map((s) => (JSON.parse(s.stdout).files as { path: string }[]).map((f) => f.path).filter((p) => p.endsWith('.cir')));
    // The definition of --shard, applied to the unsharded run's nine roots.
    for (const k of [0, 1, 2]) expect(checked[k]).toEqual(roots.filter((_p, i) => i % 3 === k));
    expect(checked.flat().sort()).toEqual([...roots].sort());
    // Exit code over the shard only: broken.cir's syntax error is at place 5 (after b1…b5), so in
    // shard 3; the other shards hold warnings only.
    expect(roots.indexOf(join(dir, 'broken.cir'))).toBe(5);
    expect(shards.map((s) => s.code)).toEqual([0, 0, 1]);
  }, 120_000);

  it('exits 0 and says so for a shard left without a file, and 2 when nothing matched at all', () => {
    const one = join(dir, 'b1.cir');
    const empty = cli(['check', one, '--shard', '2/2']);
    expect(empty.code).toBe(0);
    expect(empty.stderr).toBe('rectilens: shard 2/2 is empty: the 1 file matched went to the other shards\n');
    expect(empty.stdout).toBe('0 files checked: 0 error(s), 0 warning(s), 0 info, 0 hint(s)\n');
    expect(cli(['check', join(dir, 'none-*.cir'), '--shard', '1/2']).code).toBe(2);
  }, 60_000);

  it.each(['0/3', '3/2', 'x', '1/0', '2', '-1/3'])('refuses --shard %s with a usage error (exit 2)', (value) => {
    const result = cli(['check', dir, `--shard=${value}`]);
    expect(result.code).toBe(2);
    expect(result.stderr).toContain('--shard takes K/N with 1 ≤ K ≤ N');
    expect(result.stdout).toBe('');
  });

  it.each(['0', 'two', '1.5'])('refuses --jobs %s with a usage error (exit 2)', (value) => {
    const result = cli(['check', dir, `--jobs=${value}`]);
    expect(result.code).toBe(2);
    expect(result.stderr).toContain('--jobs takes a whole number');
  });

  it('--help documents both options', () => {
    const help = cli(['check', '--help']).stdout;
    expect(help).toContain('--jobs N');
    expect(help).toContain('--shard K/N');
  });
});
