import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

// The packaged extension in a real VS Code (code-server 4.100.3 = VS Code 1.100.3), driven by
// playwright-core in Debian's Chromium. setup-vscode.sh is idempotent (about 2 minutes on a fresh
// machine, a second after that); `npm test` runs it first through the prerequisites script.
const ROOT = resolve(__dirname, '../..');
const OUT = join(ROOT, 'tests/e2e/out');

function run(command: string, args: string[], timeoutMs: number) {
  return spawnSync(command, args, { cwd: ROOT, encoding: 'utf8', timeout: timeoutMs, env: { ...process.env, CI: process.env.CI ?? '' } });
}

describe('the extension in a real VS Code', () => {
  it('activates, shows hints, squiggles, hover, lenses, quick fix, views, follows a settings change, shows an include\'s finding and renames across files', () => {
    const setup = run('bash', [join(__dirname, 'setup-vscode.sh')], 600_000);
    expect(setup.status, setup.stdout + setup.stderr).toBe(0);
    const pack = run('npm', ['run', '--silent', 'package'], 300_000);
    expect(pack.status, pack.stdout + pack.stderr).toBe(0);
    // A short workspace path: code-server puts a unix socket under it.
    const workspace = mkdtempSync('/tmp/rlws-');
    for (const name of readdirSync(join(ROOT, 'examples'))) cpSync(join(ROOT, 'examples', name), join(workspace, name));
    // A root with two includes (our own): one defines its model, one is cut short.
    for (const name of readdirSync(join(__dirname, 'workspace'))) cpSync(join(__dirname, 'workspace', name), join(workspace, name));
    rmSync(OUT, { recursive: true, force: true });
    mkdirSync(OUT, { recursive: true });
    const e2e = run('bash', [join(__dirname, 'run-vscode.sh'), join(ROOT, 'rectilens.vsix'), workspace, join(__dirname, 'driver.js'), OUT], 900_000);
    const lines = (e2e.stdout + e2e.stderr).split('\n').filter((l) => /^\[e2e|\d+ passed, \d+ failed/.test(l));
    console.log(lines.join('\n'));
    rmSync(workspace, { recursive: true, force: true });
    expect(lines.filter((l) => / FAIL /.test(l))).toEqual([]);
    expect(lines.some((l) => /^\d+ passed, 0 failed$/.test(l))).toBe(true);
    expect(e2e.status).toBe(0);
    expect(existsSync(join(OUT, '04-hover.png'))).toBe(true);
  });
});
