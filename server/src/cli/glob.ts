/**
 * File patterns on the command line (`designs/**\/*.cir`), for shells that do not expand them and
 * for quoted patterns in CI files: `*` and `?` within a name, `[abc]` classes, `**` for any depth of
 * folders. Matches are listed sorted, hidden entries only when the pattern names them.
 */
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

export function isPattern(path: string): boolean {
  return /[*?[]/.test(path);
}

/** The regular expression of one name pattern (no `/` inside). */
export function namePattern(segment: string): RegExp {
  let source = '';
  for (let i = 0; i < segment.length; i++) {
    const c = segment[i]!;
    if (c === '*') source += '[^/]*';
    else if (c === '?') source += '[^/]';
    else if (c === '[') {
      const close = segment.indexOf(']', i + 1);
      if (close < 0) source += '\\[';
      else {
        const body = segment.slice(i + 1, close).replace(/\\/g, '\\\\');
        source += `[${body.startsWith('!') ? `^${body.slice(1)}` : body}]`;
        i = close;
      }
    } else source += c.replace(/[.+^${}()|\\]/g, '\\$&');
  }
  return new RegExp(`^${source}$`);
}

/** The files a pattern matches, sorted; folders it names are not listed (they are walked only through `**`). */
export function expandPattern(pattern: string): string[] {
  const segments = pattern.replace(/\\/g, '/').split('/');
  const absolute = pattern.startsWith('/');
  const start = absolute ? '/' : '.';
  const out: string[] = [];
  walk(absolute ? segments.slice(1) : segments, start, absolute ? '/' : '', out);
  return [...new Set(out)].sort();
}

function walk(segments: string[], dir: string, prefix: string, out: string[]): void {
  if (segments.length === 0) return;
  const [head, ...rest] = segments as [string, ...string[]];
  const join2 = (name: string) => (prefix === '' ? name : prefix.endsWith('/') ? `${prefix}${name}` : `${prefix}/${name}`);
  if (head === '**') {
    walk(rest, dir, prefix, out);
    for (const entry of list(dir)) if (entry.isDirectory() && !entry.name.startsWith('.')) walk(segments, join(dir, entry.name), join2(entry.name), out);
    return;
  }
  if (!isPattern(head)) {
    const path = join(dir, head);
    if (rest.length === 0) {
      if (isFile(path)) out.push(join2(head));
    } else walk(rest, path, join2(head), out);
    return;
  }
  const re = namePattern(head);
  for (const entry of list(dir)) {
    if (entry.name.startsWith('.') && !head.startsWith('.')) continue;
    if (!re.test(entry.name)) continue;
    if (rest.length === 0) {
      if (entry.isFile()) out.push(join2(entry.name));
    } else if (entry.isDirectory()) walk(rest, join(dir, entry.name), join2(entry.name), out);
  }
}

function list(dir: string) {
  try {
    return readdirSync(dir, { withFileTypes: true });
  } catch {
    return [];
  }
}

function isFile(path: string): boolean {
  try {
    return statSync(path).isFile();
  } catch {
    return false;
  }
}
