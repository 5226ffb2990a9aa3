import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

// The README's editor snippets are the configurations the editor tests run, word for word: each
// fenced block in "### Other editors" follows a marker comment that names the test running it or
// says why none does. The only change a test makes is the checkout's path for the placeholder.
export const ROOT = resolve(__dirname, '../..');
export const PATH_PLACEHOLDER = '/path/to/rectilens';
const SECTION = '### Other editors';

export interface ReadmeSnippet {
  /** The editor named in the marker: `<!-- snippet NAME: ... -->`. */
  readonly editor: string;
  /** What the marker says after the colon: `run by tests/editors/….test.ts` or why not. */
  readonly note: string;
  /** The fence's language tag. */
  readonly language: string;
  /** The block's text, as printed in the README. */
  readonly text: string;
}

/** Every marked fenced block of the README's "Other editors" section, and the count of fences. */
export function readmeSnippets(readme = readFileSync(join(ROOT, 'README.md'), 'utf8')): {
  snippets: ReadmeSnippet[];
  fences: number;
} {
  const start = readme.indexOf(`\n${SECTION}\n`);
  if (start < 0) throw new Error(`README.md has no "${SECTION}" section`);
  const rest = readme.slice(start + SECTION.length + 2);
  const next = rest.search(/^#{1,3} /m);
  const section = next < 0 ? rest : rest.slice(0, next);
  const snippets: ReadmeSnippet[] = [];
  const marked = /<!-- snippet ([a-z]+): ([^\n]*?) -->\n+```([a-z]*)\n([\s\S]*?)\n```/g;
  for (const m of section.matchAll(marked)) {
    snippets.push({ editor: m[1]!, note: m[2]!, language: m[3]!, text: `${m[4]!}\n` });
  }
  const fences = (section.match(/^```[a-z]+$/gm) ?? []).length;
  return { snippets, fences };
}

/** The snippet for `editor` with the checkout's path put in for the placeholder. */
export function runnableSnippet(editor: string): string {
  const snippet = readmeSnippets().snippets.find((s) => s.editor === editor);
  if (!snippet) throw new Error(`README.md has no snippet marked "<!-- snippet ${editor}: … -->"`);
  if (!snippet.text.includes(PATH_PLACEHOLDER)) throw new Error(`the ${editor} snippet does not use ${PATH_PLACEHOLDER}`);
  // The path goes into a Lua or Lisp string literal unescaped.
  if (/["'\\\n]/.test(ROOT)) throw new Error(`the checkout path ${ROOT} needs quoting in an editor config`);
  return snippet.text.split(PATH_PLACEHOLDER).join(ROOT);
}
