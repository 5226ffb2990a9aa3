/**
 * Every file the reader refuses becomes a finding on the `.include` / `.lib` card that asked for
 * it, saying what was refused and why — never a throw, a hang or a silent "missing". The reader is
 * the language server's (trust gate + safe reader) over real files in a temporary folder.
 */
import { execFileSync } from 'node:child_process';
import { closeSync, ftruncateSync, mkdirSync, mkdtempSync, openSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { analyze } from '../../server/src/analysis/analyze';
import { createWorkspaceReader } from '../../server/src/lsp/workspace-reader';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-refusals-')));
const ws = join(base, 'ws');
mkdirSync(join(base, 'outside-folder'), { recursive: true });
mkdirSync(ws);
writeFileSync(join(base, 'secret.cir'), 'RSECRET s 0 1\n');
writeFileSync(join(base, 'outside-folder', 'lib.cir'), '.lib low\nRLOW l 0 1\n.endl\n');
writeFileSync(join(ws, 'inside.cir'), 'RIN a 0 1\n');
symlinkSync(join(base, 'secret.cir'), join(ws, 'link.cir'));
symlinkSync(join(base, 'outside-folder'), join(ws, 'linked'));
execFileSync('mkfifo', [join(ws, 'pipe.cir')]);
const fd = openSync(join(ws, 'sparse.cir'), 'w');
ftruncateSync(fd, 2 ** 30);
closeSync(fd);
mkdirSync(join(ws, 'folder.cir'));
afterAll(() => rmSync(base, { recursive: true, force: true }));

const rootUri = pathToFileURL(join(ws, 'main.cir')).href;
const folders = [pathToFileURL(ws).href];

/** The finding on each include card of `cards`, as [written path, code, message]. */
function findingsOn(cards: string[], trusted: boolean): [string, string, string][] {
  const text = ['hostile includes', ...cards, ''].join('\n');
  const readText = createWorkspaceReader({ openText: (uri) => (uri === rootUri ? text : undefined), trust: () => ({ trusted, folders }) });
  const file = analyze({ roots: [rootUri], readText }).files.get(rootUri)!;
  return file.findings
    .filter((f) => f.uri === rootUri && f.severity === 'error')
    .map((f) => [text.slice(f.span.start, f.span.end), f.code, f.message]);
}

describe('refused includes are findings on their card', () => {
  it('untrusted: every way out of the workspace is refused as untrusted, naming the real target', () => {
    const tabbed = '.\t./.\t./.\t./.\t./.\t./.\t./.\t./.\t./etc/passwd';
    const found = findingsOn([
      `.include "${tabbed}"`,
      '.include "link.cir"',
      '.lib "linked/lib.cir" low',
      `.include "${pathToFileURL(join(base, 'secret.cir')).href}"`,
      `.lib "${join(base, 'outside-folder', 'lib.cir')}" low`,
      '.include "inside.cir"',
    ], false);
    // A netlist path is a path, not a URL: `.<tab>.` is a folder of that name inside the workspace (the
    // resolver encodes the tab), so the tabbed probe is a missing file, not a way out.
    expect(found.map(([, code]) => code)).toEqual(['missing-include', 'untrusted-file', 'untrusted-file', 'untrusted-file', 'untrusted-file']);
    expect(found[0]![0]).toBe(`"${tabbed}"`);
    expect(found[0]![2]).not.toContain('outside its folders');
    expect(found[1]![2]).toContain(`${join(ws, 'link.cir')} leads through a symbolic link to ${join(base, 'secret.cir')}, outside its folders`);
    expect(found[2]![2]).toContain(`leads through a symbolic link to ${join(base, 'outside-folder', 'lib.cir')}`);
  });

  it('trusted: the same includes are read (control: the refusals above come from trust)', () => {
    const found = findingsOn(['.include "link.cir"', '.lib "linked/lib.cir" low', `.include "${pathToFileURL(join(base, 'secret.cir')).href}"`], true);
    expect(found).toEqual([]);
  });

  it.each([true, false])('trusted=%s: files that are not regular, or too large, are refused on the card', (trusted) => {
    const found = findingsOn([
      '.include "pipe.cir"', '.include "/dev/zero"', '.include "/dev/stdin"', '.include "sparse.cir"', '.include "folder.cir"', '.include "absent.cir"',
    ], trusted);
    // Untrusted, /dev lies outside the workspace and the gate stops it first; trusted, the reader does.
    const device = (path: string) => [
      `"${path}"`, trusted ? 'unreadable-file' : 'untrusted-file',
      `'${path}' is not read: ${trusted ? 'it lies in /dev, where device and process files live, and such files are never read' : `the workspace is untrusted and ${path} lies outside its folders`}; what it defines is missing from the analysis`,
    ];
    expect(found).toEqual([
      ['"pipe.cir"', 'unreadable-file', "'pipe.cir' is not read: it is a named pipe, not a regular file; what it defines is missing from the analysis"],
      device('/dev/zero'),
      device('/dev/stdin'),
      ['"sparse.cir"', 'limit-exceeded', "'sparse.cir' is not read: it is 1.0 GiB, above the file-size limit of 8.0 MiB (limit: file size); what it defines is missing from the analysis"],
      ['"folder.cir"', 'unreadable-file', "'folder.cir' is not read: it is a folder, not a regular file; what it defines is missing from the analysis"],
      ['"absent.cir"', 'missing-include', `'absent.cir' is not read: no such file (looked for ${pathToFileURL(join(ws, 'absent.cir')).href}); what it defines is missing from the analysis`],
    ]);
  });
});
