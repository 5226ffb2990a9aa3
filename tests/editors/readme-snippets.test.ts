import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PATH_PLACEHOLDER, ROOT, readmeSnippets } from './readme-snippet';

// Every editor snippet in the README is either run by a test against the real editor or says
// plainly that it is not, and why; and all of them start the same server command.
describe("the README's editor snippets", () => {
  const { snippets, fences } = readmeSnippets();

  it('are each marked, and a marked "run by" names a test that runs that very snippet', () => {
    expect(snippets.map((s) => s.editor).sort()).toEqual(['emacs', 'helix', 'neovim']);
    expect(snippets).toHaveLength(fences);
    for (const snippet of snippets) {
      const run = /^run by (tests\/editors\/[a-z-]+\.test\.ts)$/.exec(snippet.note);
      if (run) {
        const test = join(ROOT, run[1]!);
        expect(existsSync(test), run[1]).toBe(true);
        expect(readFileSync(test, 'utf8')).toContain(`runnableSnippet('${snippet.editor}')`);
      } else {
        expect(snippet.note).toMatch(/^not run by the test suite \(.+\)$/);
      }
    }
  });

  it('say in the visible text what the marker says about not being run', () => {
    const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
    expect(readme).toContain('**Helix**, in `languages.toml` (not run by the test suite: Helix is not packaged by Debian):');
  });

  it('all start `node <checkout>/dist/cli.js lsp --stdio`', () => {
    const command = ['node', `${PATH_PLACEHOLDER}/dist/cli.js`, 'lsp', '--stdio'];
    // Each language writes the command as quoted words in order (Helix: `command`, then `args`).
    for (const snippet of snippets) {
      const words = [...snippet.text.matchAll(/["']([^"'\n]*)["']/g)].map((m) => m[1]);
      const at = words.indexOf('node');
      expect(at, snippet.editor).toBeGreaterThanOrEqual(0);
      expect(words.slice(at, at + 4), snippet.editor).toEqual(command);
    }
  });
});
