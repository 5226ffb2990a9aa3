/**
 * The sorted file list is the basis of `--shard`: every job of a CI matrix must build the same
 * list whatever its locale, so folders are walked in code-unit order (uppercase before lowercase,
 * accented letters after ASCII), never in the locale's collation.
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { collectNetlistFiles } from '../../server/src/cli/netlist-files';

describe('the folder walk', () => {
  it('lists netlists in code-unit order, the same on every machine', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-order-'));
    const names = ['b.cir', 'B.cir', 'a.cir', 'Z.cir', 'é.cir', '_x.cir', '10.cir', '9.cir'];
    for (const name of names) writeFileSync(join(dir, name), 'title\n');
    mkdirSync(join(dir, 'sub'));
    writeFileSync(join(dir, 'sub', 'c.cir'), 'title\n');
    const listed = collectNetlistFiles([dir]).files.map((f) => f.slice(dir.length + 1));
    // Expected order by UTF-16 code units ('1' 0x31 < '9' < 'B' 0x42 < 'Z' < '_' 0x5F < 'a' < 'b' < 's' < 'é' 0xE9).
    expect(listed).toEqual(['10.cir', '9.cir', 'B.cir', 'Z.cir', '_x.cir', 'a.cir', 'b.cir', join('sub', 'c.cir'), 'é.cir']);
    expect(listed.map((f) => basename(f))).not.toEqual([...listed.map((f) => basename(f))].sort((x, y) => x.localeCompare(y, 'en')));
  });
});
