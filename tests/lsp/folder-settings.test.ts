/**
 * Settings per workspace folder: the server pulls `workspace/configuration` with each folder as
 * the scope (LSP 3.6+), and a netlist is analysed with its own folder's settings.
 */
import { mkdirSync, mkdtempSync, realpathSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { startTestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-folders-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
const strict = join(base, 'strict');
const relaxed = join(base, 'relaxed');
mkdirSync(strict);
mkdirSync(relaxed);
// A 24 V bridge of our own with 60 V diodes: PIV ≈ 36 V is 61 % of VRRM — beyond a 50 % fraction, within the default 80 %.
const NETLIST = ['Folder settings (our own)', '*@ mains 24V 50Hz', '*@ rate DP vrrm=60V ifav=1A', 'V1 a b SIN(0 34 50)',
  'D1 a p DP', 'D2 b p DP', 'D3 n a DP', 'D4 n b DP', 'C1 p n 1000u', 'R1 p n 100', '.model DP D(IS=2.5n N=1.75 RS=0.04)', ''].join('\n');

describe('per-folder settings', () => {
  it('analyses each netlist with the settings of its own folder', async () => {
    const strictUri = pathToFileURL(strict).href;
    const client = await startTestClient({
      workspaceFolders: [strictUri, pathToFileURL(relaxed).href],
      configuration: (item) => (item.scopeUri === strictUri ? { derating: { reverseVoltage: 0.5 } } : {}),
    });
    try {
      const inStrict = await client.open(pathToFileURL(join(strict, 'b.cir')).href, NETLIST);
      const inRelaxed = await client.open(pathToFileURL(join(relaxed, 'b.cir')).href, NETLIST);
      expect(inStrict.filter((d) => d.code === 'piv-margin')).toHaveLength(4);
      expect(inRelaxed.filter((d) => d.code === 'piv-margin')).toHaveLength(0);
    } finally {
      await client.close();
    }
  });
});
