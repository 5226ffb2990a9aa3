/** `isReadable`: in an untrusted workspace only files inside a workspace folder may be read, whatever the spelling. */
import { describe, expect, it } from 'vitest';
import { resolveIncludePath } from '../../server/src/circuit/index';
import { isReadable } from '../../server/src/lsp/trust';

const untrusted = { trusted: false, folders: ['file:///home/u/ws'] };

describe('trust policy', () => {
  it('reads anything in a trusted workspace', () => {
    expect(isReadable('file:///etc/passwd', { trusted: true, folders: [] })).toBe(true);
  });

  it('reads files inside the folder, also through harmless ./ segments', () => {
    expect(isReadable('file:///home/u/ws/a.cir', untrusted)).toBe(true);
    expect(isReadable('file:///home/u/ws/./sub/././b.cir', untrusted)).toBe(true);
  });

  it.each([
    ['a sibling folder sharing the prefix', 'file:///home/u/ws-evil/a.cir'],
    ['the folder itself', 'file:///home/u/ws'],
    ['an absolute path elsewhere', 'file:///etc/passwd'],
    ['a parent segment', 'file:///home/u/ws/../outside.cir'],
    ['a parent segment deep inside', 'file:///home/u/ws/sub/../../outside.cir'],
    ['an encoded parent segment', 'file:///home/u/ws/%2e%2e/outside.cir'],
    ['an encoded parent segment in capitals', 'file:///home/u/ws/%2E%2E/outside.cir'],
    ['an encoded slash and parent', 'file:///home/u/ws/..%2foutside.cir'],
    ['a backslash parent segment', 'file:///home/u/ws/..\\outside.cir'],
    ['an encoded backslash parent segment', 'file:///home/u/ws/..%5coutside.cir'],
    ['a malformed escape (decoding throws)', 'file:///home/u/ws/%E0%A4%A.cir'],
    ['another scheme', 'http://example.invalid/ws/a.cir'],
  ])('refuses %s', (_what, uri) => {
    expect(isReadable(uri, untrusted)).toBe(false);
  });

  it('refuses every include spelling that leaves the folder, as the include resolver writes them', () => {
    const from = 'file:///home/u/ws/main.cir';
    for (const written of ['../outside.cir', '/home/u/outside.cir', 'sub/../../outside.cir', '..\\outside.cir', '%2e%2e/outside.cir', 'file:///home/u/outside.cir', '/home/u/ws/../outside.cir']) {
      expect(isReadable(resolveIncludePath(from, written), untrusted), written).toBe(false);
    }
    expect(isReadable(resolveIncludePath(from, 'sub/part.cir'), untrusted)).toBe(true);
  });
});
