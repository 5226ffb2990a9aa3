import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

// A real editor client that no one here wrote: Neovim from Debian (installed by .ci/run), headless,
// with its built-in language client attached to `rectilens lsp --stdio`.
const ROOT = resolve(__dirname, '../..');

describe('Neovim built-in language client', () => {
  it('attaches, receives our diagnostics and shows our hover text', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-nvim-'));
    const netlist = join(dir, 'demo.cir');
    writeFileSync(netlist, 'Neovim fixture (our own)\nR2 out 0 4k7\nD1 ac out DGEN\n.model DGEN D(IS=2.5n N=1.75)\n');
    const out = join(dir, 'result.json');
    const run = spawnSync('nvim', ['--headless', '--clean', '-n', '-c', `luafile ${join(ROOT, 'tests/editors/neovim-lsp.lua')}`, netlist], {
      cwd: dir,
      env: { ...process.env, RECTILENS_CLI: join(ROOT, 'dist/cli.js'), RECTILENS_OUT: out, RECTILENS_HOVER_WORD: 'DGEN' },
      timeout: 60_000,
      encoding: 'utf8',
    });
    expect(run.error).toBeUndefined();
    const result = JSON.parse(readFileSync(out, 'utf8'));
    expect(result.error).toBeUndefined();
    expect(result.attached).toBe(true);
    expect(result.diagnostics).toContainEqual(expect.objectContaining({ lnum: 1, col: 9, code: 'value-notation' }));
    expect(result.hover).toContain('model DGEN');
    expect(result.hover).toContain('IS=2.5n');
  });
});
