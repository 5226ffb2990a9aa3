import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ROOT, runnableSnippet } from './readme-snippet';

// A second real editor client: Emacs 28 with eglot 1.9, both from Debian (installed by
// scripts/install-test-prerequisites.sh; a missing emacs fails the test), configured by nothing
// but the README's Emacs snippet. It runs in a terminal frame under a pseudo-terminal (`script`,
// util-linux, essential in Debian), not with --batch: batch mode runs eglot's process filters, but
// it never enters the command loop, so `eglot-ensure` (which connects from `post-command-hook`)
// never connects, and flymake waits for the buffer to be shown in a window before it reports.
// tests/editors/emacs-eglot.el only observes.

/** -Q leaves site-lisp off the load path; this is where Debian's elpa-* packages live. */
const DEBIAN_ELPA = '/usr/share/emacs/site-lisp/elpa';

const shellQuote = (word: string) => `'${word.replace(/'/g, `'\\''`)}'`;

describe("the README's Emacs snippet in eglot", () => {
  const made: string[] = [];
  afterEach(() => made.splice(0).forEach((dir) => rmSync(dir, { recursive: true, force: true })));

  it('connects eglot to our server, and flymake and eldoc show what it answers', () => {
    const dir = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-emacs-')));
    made.push(dir);
    const config = join(dir, 'init.el');
    writeFileSync(config, runnableSnippet('emacs'));
    const netlist = join(dir, 'demo.cir');
    const lines = [
      'Emacs fixture (our own)',
      '* DGEN in a comment is not hovered',
      'R2 out 0 4k7 ; a trailing comment',
      'D1 ac out DGEN',
      '.param twice={2*3}',
      '.model DGEN D(IS=2.5n N=1.75)',
    ];
    writeFileSync(netlist, `${lines.join('\n')}\n`);
    const out = join(dir, 'result.json');
    const emacs = [
      'emacs', '-nw', '-Q',
      '--eval', `(setq package-directory-list '("${DEBIAN_ELPA}"))`, '-f', 'package-initialize',
      '-l', config, netlist, '-l', join(ROOT, 'tests/editors/emacs-eglot.el'),
    ];
    const run = spawnSync('script', ['-qec', emacs.map(shellQuote).join(' '), '/dev/null'], {
      cwd: dir,
      env: { ...process.env, HOME: dir, TERM: 'xterm', RECTILENS_OUT: out, RECTILENS_HOVER_WORD: 'DGEN' },
      stdio: ['ignore', 'pipe', 'pipe'],
      timeout: 30_000,
      encoding: 'utf8',
    });
    expect(run.error).toBeUndefined();
    // The terminal's screen, control sequences stripped, says why when Emacs wrote nothing.
    const screen = `${run.stdout}${run.stderr}`.replace(/\x1b\[[0-9;?>=]*[a-zA-Z]|\x1b[=>]/g, ' ').slice(-2000);
    expect(existsSync(out), screen).toBe(true);
    expect(run.status, screen).toBe(0);
    const result = JSON.parse(readFileSync(out, 'utf8'));
    expect(result.error).toBeUndefined();
    expect(result.mode).toBe('rectilens-netlist-mode');
    // The mode's comments, as the grammar has them (grammar/src/tokens.ts): `*` first on a line,
    // `;` anywhere; a `*` inside an expression is not one.
    expect(result.comments).toEqual([false, true, true, false, false, false]);
    // `4k7` is RKM notation: value-notation on its first character (0-based line 2, column 9),
    // a warning (LSP severity 2, eglot's `eglot-warning`).
    expect(result.diagnostics).toContainEqual(
      expect.objectContaining({ line: 2, col: 9, type: 'eglot-warning', code: 'value-notation', text: expect.stringContaining("'4k7'") }),
    );
    // The hover at DGEN on the D1 card (the comment line's DGEN is skipped) shows its model card.
    expect(result.hover).toContain('model DGEN');
    expect(result.hover).toContain('IS=2.5n');
  });
});
