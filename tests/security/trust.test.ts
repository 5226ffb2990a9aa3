/**
 * `gateUri`: in an untrusted workspace only files whose real path lies inside a workspace folder
 * may be opened, whatever the spelling; the decision is on the path after URL conversion,
 * normalisation and `realpath`, never on the text.
 */
import { mkdirSync, mkdtempSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { resolveIncludePath } from '../../server/src/circuit/index';
import { gateUri, type TrustPolicy } from '../../server/src/lsp/trust';

const untrusted: TrustPolicy = { trusted: false, folders: ['file:///home/u/ws'] };
const refusalOf = (uri: string, policy: TrustPolicy = untrusted) => {
  const gate = gateUri(uri, policy);
  return 'refused' in gate ? gate.refused : 'open';
};

describe('trust gate, by spelling (no file system needed: outside paths are refused before any look-up)', () => {
  it('opens anything local in a trusted workspace', () => {
    expect(gateUri('file:///etc/passwd', { trusted: true, folders: [] })).toEqual({ path: '/etc/passwd' });
  });

  it.each([
    ['a sibling folder sharing the prefix', 'file:///home/u/ws-evil/a.cir'],
    ['the folder itself', 'file:///home/u/ws'],
    ['an absolute path elsewhere', 'file:///etc/passwd'],
    ['a parent segment', 'file:///home/u/ws/../outside.cir'],
    ['a parent segment deep inside', 'file:///home/u/ws/sub/../../outside.cir'],
    ['an encoded parent segment', 'file:///home/u/ws/%2e%2e/outside.cir'],
    ['an encoded parent segment in capitals', 'file:///home/u/ws/%2E%2E/outside.cir'],
    ['a backslash parent segment', 'file:///home/u/ws/..\\outside.cir'],
    ['tabs inside the dots, which URL conversion drops', 'file:///home/u/ws/.\t./.\t./.\t./etc/passwd'],
    ['a line break inside the dots', 'file:///home/u/ws/.\n./outside.cir'],
    ['another scheme', 'http://example.invalid/ws/a.cir'],
  ])('refuses %s as untrusted', (_what, uri) => {
    expect(refusalOf(uri)).toBe('untrusted-outside');
  });

  it.each([
    ['an encoded slash and parent', 'file:///home/u/ws/..%2foutside.cir'],
    ['a malformed escape (decoding throws)', 'file:///home/u/ws/%E0%A4%A.cir'],
    ['a host that is not this machine', 'file://elsewhere/home/u/ws/a.cir'],
  ])('refuses %s as not a file URI at all', (_what, uri) => {
    expect(refusalOf(uri)).toBe('unreadable');
  });

  it('says the workspace is untrusted and names the path that would have been opened', () => {
    expect(gateUri('file:///home/u/ws/.\t./.\t./.\t./etc/passwd', untrusted)).toEqual({
      refused: 'untrusted-outside', reason: 'the workspace is untrusted and /etc/passwd lies outside its folders',
    });
  });

  it('refuses every include spelling that leaves the folder, as the include resolver writes them', () => {
    const from = 'file:///home/u/ws/main.cir';
    for (const written of ['../outside.cir', '/home/u/outside.cir', 'sub/../../outside.cir', '..\\outside.cir', 'file:///home/u/outside.cir', '/home/u/ws/../outside.cir']) {
      expect(refusalOf(resolveIncludePath(from, written)), JSON.stringify(written)).toBe('untrusted-outside');
    }
    // A netlist path is a path, not a URL: `%2e%2e` and `.<tab>.` are folder names inside, which the
    // resolver encodes (`%252e%252e`, `.%09.`), so URL decoding never turns them into `..`.
    for (const written of ['%2e%2e/outside.cir', '.\t./.\t./outside.cir']) {
      expect(resolveIncludePath(from, written).startsWith('file:///home/u/ws/'), JSON.stringify(written)).toBe(true);
      expect(refusalOf(resolveIncludePath(from, written)), JSON.stringify(written)).toBe('missing');
    }
    // Inside, but absent here: the gate goes on to the file system and finds nothing.
    expect(refusalOf(resolveIncludePath(from, 'sub/part.cir'))).toBe('missing');
  });
});

describe('trust gate, on real paths', () => {
  const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-gate-')));
  const ws = join(base, 'ws');
  mkdirSync(join(ws, 'sub'), { recursive: true });
  mkdirSync(join(base, 'elsewhere'));
  writeFileSync(join(base, 'secret.cir'), 'RSECRET s 0 1\n');
  writeFileSync(join(base, 'elsewhere', 'lib.cir'), 'RLIB l 0 1\n');
  writeFileSync(join(ws, 'sub', 'part.cir'), 'RIN a 0 1\n');
  symlinkSync(join(base, 'secret.cir'), join(ws, 'link.cir'));
  symlinkSync(join(base, 'elsewhere'), join(ws, 'linked-folder'));
  symlinkSync(join(ws, 'sub', 'part.cir'), join(ws, 'inner-link.cir'));
  symlinkSync(ws, join(base, 'ws-alias'));
  const policy: TrustPolicy = { trusted: false, folders: [pathToFileURL(ws).href] };
  const uri = (path: string) => pathToFileURL(path).href;
  afterAll(() => rmSync(base, { recursive: true, force: true }));

  it('opens a file inside, by its real path', () => {
    expect(gateUri(uri(join(ws, 'sub', 'part.cir')), policy)).toEqual({ path: join(ws, 'sub', 'part.cir') });
  });

  it('refuses a symbolic link to a file outside, naming where it leads', () => {
    expect(gateUri(uri(join(ws, 'link.cir')), policy)).toEqual({
      refused: 'untrusted-outside',
      reason: `the workspace is untrusted and ${join(ws, 'link.cir')} leads through a symbolic link to ${join(base, 'secret.cir')}, outside its folders`,
    });
  });

  it('refuses a file reached through a symbolic link to a folder outside', () => {
    expect(refusalOf(uri(join(ws, 'linked-folder', 'lib.cir')), policy)).toBe('untrusted-outside');
  });

  it('follows a link that stays inside, and opens its target', () => {
    expect(gateUri(uri(join(ws, 'inner-link.cir')), policy)).toEqual({ path: join(ws, 'sub', 'part.cir') });
  });

  it('accepts a workspace folder that is itself reached through a link', () => {
    const aliased: TrustPolicy = { trusted: false, folders: [uri(join(base, 'ws-alias'))] };
    expect(gateUri(uri(join(base, 'ws-alias', 'sub', 'part.cir')), aliased)).toEqual({ path: join(ws, 'sub', 'part.cir') });
    expect(refusalOf(uri(join(base, 'ws-alias', 'link.cir')), aliased)).toBe('untrusted-outside');
  });

  it('refuses everything when an untrusted workspace has no folder', () => {
    expect(refusalOf(uri(join(ws, 'sub', 'part.cir')), { trusted: false, folders: [] })).toBe('untrusted-outside');
  });
});
