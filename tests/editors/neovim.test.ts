import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ROOT, runnableSnippet } from './readme-snippet';

// A real editor client that no one here wrote: Neovim from Debian (installed by
// scripts/install-test-prerequisites.sh; a missing nvim fails the test), headless, configured by
// nothing but the README's Neovim snippet as its init.lua. tests/editors/neovim-lsp.lua only
// observes: the snippet starts and attaches the client.
describe("the README's Neovim snippet in Neovim's built-in language client", () => {
  const made: string[] = [];
  afterEach(() => made.splice(0).forEach((dir) => rmSync(dir, { recursive: true, force: true })));

  it('starts one server per project, which publishes our diagnostics and answers a hover', () => {
    const dir = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-nvim-')));
    made.push(dir);
    const config = join(dir, 'xdg-config');
    mkdirSync(join(config, 'nvim'), { recursive: true });
    writeFileSync(join(config, 'nvim', 'init.lua'), runnableSnippet('neovim'));
    // A project folder (found by its .git) with a netlist one folder down and one at its root.
    const project = join(dir, 'project');
    mkdirSync(join(project, '.git'), { recursive: true });
    mkdirSync(join(project, 'boards'));
    const first = join(project, 'boards', 'demo.cir');
    writeFileSync(first, 'Neovim fixture (our own)\nR2 out 0 4k7\nD1 ac out DGEN\n.model DGEN D(IS=2.5n N=1.75)\n');
    const second = join(project, 'other.cir');
    writeFileSync(second, 'Second Neovim fixture (our own)\nR3 a 0 2k2\n');
    const out = join(dir, 'result.json');
    const run = spawnSync('nvim', ['--headless', '-i', 'NONE', '-n', '-c', `luafile ${join(ROOT, 'tests/editors/neovim-lsp.lua')}`, first], {
      cwd: dir,
      env: {
        ...process.env,
        XDG_CONFIG_HOME: config,
        XDG_DATA_HOME: join(dir, 'xdg-data'),
        XDG_STATE_HOME: join(dir, 'xdg-state'),
        XDG_CACHE_HOME: join(dir, 'xdg-cache'),
        RECTILENS_OUT: out,
        RECTILENS_HOVER_WORD: 'DGEN',
        RECTILENS_SECOND: second,
      },
      timeout: 30_000,
      encoding: 'utf8',
    });
    expect(run.error).toBeUndefined();
    expect(run.status, run.stderr).toBe(0);
    const result = JSON.parse(readFileSync(out, 'utf8'));
    expect(result.error).toBeUndefined();
    expect(result.filetype).toBe('spice');
    expect(result.clients).toEqual([expect.objectContaining({ name: 'rectilens', root_dir: project })]);
    // The fixture's `4k7` is RKM notation: value-notation on its first character (0-based line 1, column 9).
    expect(result.diagnostics).toContainEqual(expect.objectContaining({ lnum: 1, col: 9, code: 'value-notation', source: 'rectilens' }));
    expect(result.hover).toContain('model DGEN');
    expect(result.hover).toContain('IS=2.5n');
    // The second netlist of the project is served by the same client and server.
    expect(result.second.filetype).toBe('spice');
    expect(result.second.clients).toEqual([expect.objectContaining({ id: result.clients[0].id })]);
    expect(result.running).toBe(1);
    // `2k2` at 0-based line 1, column 7.
    expect(result.second.diagnostics).toContainEqual(expect.objectContaining({ lnum: 1, col: 7, code: 'value-notation' }));
  });
});
