/**
 * The documentation page of each finding code (docs/rules/<code>.md, shipped in the extension and
 * written from the code catalog), as the file URI a diagnostic's `codeDescription` links to. The
 * folder is found beside the bundle (dist/ → ../docs/rules); a code without a page gets no link.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

let pages: ReadonlyMap<string, string> | undefined;

export function rulePageUri(code: string, folder = join(__dirname, '..', 'docs', 'rules')): string | undefined {
  pages ??= listPages(folder);
  return pages.get(code);
}

function listPages(folder: string): ReadonlyMap<string, string> {
  try {
    return new Map(readdirSync(folder).filter((f) => f.endsWith('.md')).map((f) => [f.slice(0, -3), pathToFileURL(join(folder, f)).href]));
  } catch {
    return new Map();
  }
}
