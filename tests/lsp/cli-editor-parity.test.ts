/**
 * One answer in every place: the same netlist with the same project configuration and parts file
 * gives the same findings from the command line (`check --format json`) and from the editor
 * (diagnostics the language server publishes over the protocol). Both read `rectilens.json`; the
 * editor is given no settings of its own here.
 */
import { mkdirSync, mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';
import { startTestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-parity-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
mkdirSync(join(base, 'parts'));
writeFileSync(join(base, 'rectilens.json'), JSON.stringify({ derating: { reverseVoltage: 0.5, junctionTempC: 100 }, corners: { ambientMaxC: 60 }, partsFiles: ['parts/diodes.json'] }));
writeFileSync(join(base, 'parts', 'diodes.json'), JSON.stringify({ version: 1, parts: [{ name: 'DP', kind: 'diode', vrrmV: 60, ifavA: 1, ifsmA: 30, tjmaxC: 150, rthjaKPerW: 80 }] }));
// A 24 V bridge of our own, rated by the parts file only; the configuration's 50 % reverse-voltage
// fraction and 60 °C ambient decide its findings.
const NETLIST = ['Parity bridge (our own)', '*@ mains 24V 50Hz', 'V1 a b SIN(0 34 50)', 'RS a a1 0.5',
  'D1 a1 p DP', 'D2 b p DP', 'D3 n a1 DP', 'D4 n b DP', 'C1 p n 2200u', 'R1 p n 22', '.model DP D(IS=2.5n N=1.75 RS=0.04)', ''].join('\n');
const path = join(base, 'bridge.cir');
writeFileSync(path, NETLIST);

describe('the command line and the editor', () => {
  it('publish the same findings for the same netlist and configuration', async () => {
    let stdout = '';
    runCommandLine(['check', '--format', 'json', path], { stdout: (t) => (stdout += t), stderr: () => {}, stderrIsTty: false });
    const cli = JSON.parse(stdout).files.find((f: { path: string }) => f.path === path).diagnostics
      .map((d: { line: number; column: number; severity: string; code: string; message: string }) => `${d.line}:${d.column} ${d.severity} ${d.code}: ${d.message}`);
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    try {
      const uri = pathToFileURL(path).href;
      const first = await client.open(uri, NETLIST);
      // The configuration and parts file are read once the editor has been initialised; the analysis after them is the one to compare.
      const diagnostics = first.some((d) => d.code === 'piv-margin') ? first : await client.nextDiagnostics(uri);
      const severity = ['', 'error', 'warning', 'info', 'hint'];
      const editor = diagnostics.map((d) => `${d.range.start.line + 1}:${d.range.start.character + 1} ${severity[d.severity!]} ${d.code}: ${d.message}`);
      expect(cli.length).toBeGreaterThan(0);
      expect(cli.some((l: string) => l.includes('piv-margin'))).toBe(true);
      expect([...editor].sort()).toEqual([...cli].sort());
    } finally {
      await client.close();
    }
  });
});
