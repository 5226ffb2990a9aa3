/**
 * The command line against inputs that used to hang it or end it badly: a named pipe given as a
 * netlist or included, devices, a 1 GiB sparse file, a full or closed standard output, and file
 * names that look like options. Each runs the bundled CLI (`dist/cli.js`, built by `npm test`) as
 * a real process with a time limit, so a hang fails the test instead of stalling the suite.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { closeSync, ftruncateSync, mkdirSync, mkdtempSync, openSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const CLI = resolve(__dirname, '../../dist/cli.js');
/** Far above a normal run (well under a second here); only a hang reaches it. */
const HANG_MS = 30_000;
const dir = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-hostile-')));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const CLEAN = 'clean\nR1 a 0 1k\n';
writeFileSync(join(dir, 'clean.cir'), CLEAN);
execFileSync('mkfifo', [join(dir, 'pipe.cir')]);
mkdirSync(join(dir, 'walked'));
execFileSync('mkfifo', [join(dir, 'walked', 'inner.cir')]);
const fd = openSync(join(dir, 'huge.cir'), 'w');
ftruncateSync(fd, 2 ** 30);
closeSync(fd);

function cli(args: string[], options: { cwd?: string; stdout?: number } = {}) {
  const result = spawnSync(process.execPath, [CLI, ...args], {
    cwd: options.cwd ?? dir, encoding: 'utf8', timeout: HANG_MS, stdio: ['ignore', options.stdout ?? 'pipe', 'pipe'],
  });
  return { code: result.status, signal: result.signal, stdout: result.stdout ?? '', stderr: result.stderr };
}

describe('rectilens check: files that are not regular files', () => {
  it('a named pipe given as the netlist is refused at once: exit 2, one line', () => {
    expect(cli(['check', 'pipe.cir'])).toMatchObject({ code: 2, signal: null, stderr: 'rectilens: cannot read pipe.cir: it is a named pipe, not a regular file\n' });
  });

  it('a named pipe met while walking a folder is refused the same way', () => {
    expect(cli(['check', 'walked'])).toMatchObject({ code: 2, stderr: `rectilens: cannot read ${join('walked', 'inner.cir')}: it is a named pipe, not a regular file\n` });
  });

  it('a 1 GiB sparse netlist is refused by its size, not read', () => {
    expect(cli(['check', 'huge.cir'])).toMatchObject({ code: 2, stderr: 'rectilens: cannot read huge.cir: it is 1.0 GiB, above the file-size limit of 8.0 MiB (limit: file size)\n' });
  });

  it('report and compare refuse a named pipe too', () => {
    for (const command of ['report', 'compare']) {
      expect(cli([command, 'pipe.cir'])).toMatchObject({ code: 2, stderr: 'rectilens: cannot read pipe.cir: it is a named pipe, not a regular file\n' });
    }
  });

  it('includes of a pipe, devices, /dev/stdin and a sparse file are findings on their cards', () => {
    writeFileSync(join(dir, 'includes.cir'), ['includes', '.include "pipe.cir"', '.include "/dev/zero"', '.include "/dev/stdin"', '.lib "huge.cir" low', 'R1 a 0 1k', ''].join('\n'));
    const result = cli(['check', 'includes.cir', '--format', 'json']);
    expect(result.code).toBe(1);
    const diagnostics = JSON.parse(result.stdout).files[0].diagnostics as { line: number; code: string; message: string }[];
    expect(diagnostics.map((d) => [d.line, d.code, d.message])).toEqual([
      [2, 'unreadable-file', "'pipe.cir' is not read: it is a named pipe, not a regular file; what it defines is missing from the analysis"],
      [3, 'unreadable-file', expect.stringContaining("'/dev/zero' is not read: it lies in /dev")],
      [4, 'unreadable-file', expect.stringContaining("'/dev/stdin' is not read: it lies in /dev")],
      [5, 'limit-exceeded', expect.stringContaining("'huge.cir' is not read: it is 1.0 GiB, above the file-size limit")],
    ]);
  });
});

describe('rectilens: standard output that cannot be written', () => {
  it('a full device (> /dev/full) exits 2 with the reason on stderr', () => {
    const full = openSync('/dev/full', 'w');
    try {
      expect(cli(['check', 'clean.cir'], { stdout: full })).toMatchObject({ code: 2, stderr: 'rectilens: cannot write the output: no space left on the device (ENOSPC)\n' });
    } finally {
      closeSync(full);
    }
  });

  it('a pipe whose reader has gone exits 2 with the reason on stderr', async () => {
    const child = spawn(process.execPath, [CLI, 'check', 'clean.cir', '--format', 'json'], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'], timeout: HANG_MS });
    child.stdout.destroy(); // the reader leaves before the first byte is written
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    const code = await new Promise<number | null>((done) => child.on('close', done));
    expect({ code, stderr }).toEqual({ code: 2, stderr: 'rectilens: cannot write the output: the reading end of the pipe was closed (EPIPE)\n' });
  });
});

describe('rectilens: -- ends the options', () => {
  writeFileSync(join(dir, '-x.cir'), CLEAN);
  writeFileSync(join(dir, '--format'), CLEAN);

  it('reads a file named -x.cir after --', () => {
    const result = cli(['check', '--format', 'json', '--', '-x.cir']);
    expect(result.code).toBe(0);
    expect(JSON.parse(result.stdout).files.map((f: { path: string }) => f.path)).toEqual(['-x.cir']);
  });

  it('after --, even --format is a file name', () => {
    const result = cli(['check', '--', '--format', 'json']);
    expect(result).toMatchObject({ code: 2, stderr: 'rectilens: cannot read json: no such file or folder\n' });
    expect(result.stdout).toContain('1 file checked');
  });

  it('before --, a name starting with - is an unknown option, and the message says where files go', () => {
    expect(cli(['check', '-x.cir'])).toMatchObject({ code: 2, stderr: "rectilens: unknown option -x.cir; known: --format, --fail-on, --config, --parts, --output, --jobs, --shard, --help (a file whose name starts with '-' goes after --)\n" });
  });
});
