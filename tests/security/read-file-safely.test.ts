/**
 * The safe reader: only regular files are read, their size is checked before any byte is read,
 * and nothing can block or grow without bound. Each hostile input ends in a typed refusal, never
 * a throw or a hang; the whole file runs in well under a second.
 */
import { execFileSync } from 'node:child_process';
import { closeSync, ftruncateSync, mkdtempSync, openSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { describeBytes, readFileSafely } from '../../server/src/io/read-file-safely';

const dir = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-read-')));
const servers: Server[] = [];
afterAll(() => {
  for (const server of servers) server.close();
  rmSync(dir, { recursive: true, force: true });
});

/** A FIFO no one writes to: a plain read of it blocks forever. */
function fifo(name: string): string {
  const path = join(dir, name);
  execFileSync('mkfifo', [path]);
  return path;
}

/** A sparse file of `bytes` (no disk blocks written). */
function sparse(name: string, bytes: number): string {
  const path = join(dir, name);
  const fd = openSync(path, 'w');
  ftruncateSync(fd, bytes);
  closeSync(fd);
  return path;
}

describe('readFileSafely', () => {
  it('reads a regular file as UTF-8', () => {
    writeFileSync(join(dir, 'ok.cir'), 'title µ\nR1 a 0 1k\n');
    expect(readFileSafely(join(dir, 'ok.cir'))).toBe('title µ\nR1 a 0 1k\n');
  });

  it.each([
    ['a named pipe', () => fifo('pipe.cir'), /^it is a named pipe, not a regular file$/],
    ['a link to a named pipe', () => (symlinkSync(fifo('pipe2.cir'), join(dir, 'to-pipe.cir')), join(dir, 'to-pipe.cir')), /named pipe/],
    ['a folder', () => dir, /^it is a folder, not a regular file$/],
    ['/dev/zero, which never ends', () => '/dev/zero', /lies in \/dev/],
    ['/dev/stdin, whatever it leads to', () => '/dev/stdin', /lies in \/dev/],
    ['a link into /dev', () => (symlinkSync('/dev/zero', join(dir, 'zero.cir')), join(dir, 'zero.cir')), /character device/],
    ['a process file', () => '/proc/self/environ', /lies in \/proc/],
  ])('refuses %s without blocking', (_what, make, reason) => {
    const result = readFileSafely(make());
    expect(result).toMatchObject({ refused: 'not-a-regular-file', reason: expect.stringMatching(reason) });
  });

  it('refuses a socket', async () => {
    const path = join(dir, 'sock.cir');
    const server = createServer();
    servers.push(server);
    await new Promise<void>((done) => server.listen(path, done));
    expect(readFileSafely(path)).toEqual({ refused: 'not-a-regular-file', reason: 'it is a socket, not a regular file' });
  });

  it('refuses a 1 GiB sparse file by its size, before reading it', () => {
    const path = sparse('huge.cir', 2 ** 30);
    const before = process.memoryUsage().rss;
    expect(readFileSafely(path)).toEqual({ refused: 'too-large', reason: 'it is 1.0 GiB, above the file-size limit of 8.0 MiB (limit: file size)' });
    // Nothing was read: the resident set did not grow by anything like the file (common practice: 64 MiB slack).
    expect(process.memoryUsage().rss - before).toBeLessThan(64 * 2 ** 20);
  });

  it('reads a file of exactly the cap and refuses one byte more', () => {
    writeFileSync(join(dir, 'cap.cir'), 'x'.repeat(100));
    writeFileSync(join(dir, 'over.cir'), 'x'.repeat(101));
    expect(readFileSafely(join(dir, 'cap.cir'), { maxBytes: 100 })).toBe('x'.repeat(100));
    expect(readFileSafely(join(dir, 'over.cir'), { maxBytes: 100 })).toMatchObject({ refused: 'too-large' });
  });

  it('reports a missing file and a path through a file as missing', () => {
    expect(readFileSafely(join(dir, 'nowhere.cir'))).toEqual({ refused: 'missing', reason: 'no such file' });
    writeFileSync(join(dir, 'plain.cir'), 'x\n');
    expect(readFileSafely(join(dir, 'plain.cir', 'below.cir'))).toEqual({ refused: 'missing', reason: 'no such file' });
  });

  it('with noFollow, refuses a final symbolic link (the gate hands over real paths only)', () => {
    writeFileSync(join(dir, 'target.cir'), 'x\n');
    symlinkSync(join(dir, 'target.cir'), join(dir, 'late-link.cir'));
    expect(readFileSafely(join(dir, 'late-link.cir'))).toBe('x\n');
    expect(readFileSafely(join(dir, 'late-link.cir'), { noFollow: true })).toMatchObject({ refused: 'unreadable' });
  });

  it('describes sizes in binary units', () => {
    expect([describeBytes(512), describeBytes(1536), describeBytes(32 * 2 ** 20), describeBytes(2 ** 30)]).toEqual(['512 bytes', '1.5 KiB', '32.0 MiB', '1.0 GiB']);
  });
});
