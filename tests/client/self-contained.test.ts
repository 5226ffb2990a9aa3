import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

// A user's clone has nothing beside it: no tracked file may reach into a sibling folder of the
// checkout. The pattern is built so that this file does not match itself.
const ROOT = resolve(__dirname, '../..');
const SIBLING = ['..', 'shared'].join('/');

describe('the repository is self-contained', () => {
  it('no tracked file refers to a folder beside the checkout', () => {
    const files = execFileSync('git', ['ls-files'], { cwd: ROOT, encoding: 'utf8' }).split('\n').filter(Boolean);
    expect(files.length).toBeGreaterThan(50);
    const offenders = files.filter((file) => {
      // A tracked file moved or deleted in the working tree (not yet committed) is not in the clone either.
      if (/\.(png|vsix|ico)$/.test(file) || !existsSync(join(ROOT, file))) return false;
      return readFileSync(join(ROOT, file), 'utf8').includes(SIBLING);
    });
    expect(offenders).toEqual([]);
  });
});
