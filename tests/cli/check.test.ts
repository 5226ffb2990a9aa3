import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';

function run(...argv: string[]) {
  let stdout = '';
  let stderr = '';
  const code = runCommandLine(argv, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t), stderrIsTty: false });
  return { code, stdout, stderr };
}

function folderWith(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'rectilens-cli-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

const CLEAN = 'clean\nR1 a 0 1k\n';
const WARNS = 'warns\nR1 a 0 4k7\n';
const BROKEN = 'broken\nD1 a\n';

describe('rectilens check', () => {
  it('prints compiler-style lines and exits 1 on an error', () => {
    const dir = folderWith({ 'b.cir': BROKEN });
    const result = run('check', join(dir, 'b.cir'));
    expect(result.code).toBe(1);
    expect(result.stdout).toContain(`${join(dir, 'b.cir')}:2:4: error syntax-error: D1 needs anode, cathode and a model`);
  });

  it('exits 0 on warnings with the default --fail-on error, 1 with --fail-on warning, 0 with never', () => {
    const dir = folderWith({ 'w.cir': WARNS });
    expect(run('check', dir).code).toBe(0);
    expect(run('check', dir, '--fail-on', 'warning').code).toBe(1);
    expect(run('check', dir, '--fail-on=never').code).toBe(0);
    expect(run('check', folderWith({ 'b.cir': BROKEN }), '--fail-on', 'never').code).toBe(0);
  });

  it('walks folders for .cir .net .sp .spi .ckt files only', () => {
    const dir = folderWith({ 'a.cir': CLEAN, 'b.net': CLEAN, 'c.sp': CLEAN, 'd.spi': CLEAN, 'e.ckt': CLEAN, 'notes.txt': BROKEN });
    const report = JSON.parse(run('check', dir, '--format', 'json').stdout);
    expect(report.files.map((f: { path: string }) => f.path.slice(dir.length + 1))).toEqual(['a.cir', 'b.net', 'c.sp', 'd.spi', 'e.ckt']);
  });

  it('reads a file that is both a root and an include of another root with its own title line', () => {
    const dir = folderWith({
      'main.cir': 'Main (our own)\n.include "parts.cir"\nD1 a b DX\n',
      'parts.cir': 'Parts library (our own)\n.model DX D(IS=1n)\n',
    });
    const report = JSON.parse(run('check', dir, '--format', 'json').stdout);
    const parts = report.files.find((f: { path: string }) => f.path.endsWith('parts.cir'));
    // Included, its first line is a card (an included file has no title line): the hint says the P
    // card is not modelled. Its reading as a root, title and all, is not listed: the editor shows the
    // file as its includer reads it too.
    expect(parts.diagnostics.map((d: { line: number; code: string }) => [d.line, d.code])).toEqual([[1, 'unknown-element']]);
  });

  it('writes the JSON shape of DESIGN.md §8 with 1-based lines', () => {
    const dir = folderWith({ 'w.cir': WARNS });
    const report = JSON.parse(run('check', dir, '--format', 'json').stdout);
    expect(report.version).toBe(1);
    expect(report.files[0]).toMatchObject({
      rectifiers: [],
      diagnostics: [{ line: 2, column: 8, severity: 'warning', code: 'value-notation' }],
    });
    expect(report.files[0].diagnostics[0].message).toMatch(/read as 4700/);
  });

  it('exits 2 with one clear line for an unreadable path, an unknown flag or a bad value', () => {
    const missing = run('check', '/no/such/netlist.cir');
    expect(missing.code).toBe(2);
    expect(missing.stderr).toBe('rectilens: cannot read /no/such/netlist.cir: no such file or folder\n');
    expect(run('check', '.', '--colour').stderr).toMatch(/^rectilens: unknown option --colour/);
    expect(run('check', '.', '--format', 'xml')).toMatchObject({ code: 2, stderr: "rectilens: --format takes text|json|sarif|ci, not 'xml'\n" });
    expect(run('check').code).toBe(2);
    expect(run('frobnicate').code).toBe(2);
  });

  it('runs as the bundled command through npm, as the README says', () => {
    const dir = folderWith({ 'b.cir': BROKEN });
    const result = spawnSync('npm', ['run', '--silent', 'rectilens', '--', 'check', dir], { encoding: 'utf8' });
    expect(result.status).toBe(1);
    expect(result.stdout).toMatch(/error syntax-error/);
    expect(execFileSync('node', ['dist/cli.js', 'help'], { encoding: 'utf8' })).toMatch(/usage:/);
  });
});

// No silent pass (issue 16, item 4): a typo that removes a rectifier, or an AC source with diodes in no
// recognised rectifier, exits 1; a folder or pattern with no netlist exits 2 with a message. Our own fixtures.
/** A 24 V rms bridge packaged in a subcircuit, with the instance naming `subckt`. */
function packaged(subckt: string): string {
  return [
    'packaged 24 V bridge', '*@ mains 24V 50Hz', '*@ load 10W',
    '*@ rate DR vrrm=100V ifav=1A ifsm=30A tjmax=150C rthja=80', '*@ rate CB vrated=50V iripple=2A',
    'V1 L N SIN(0 33.9 50)', 'RS L A 1', `XB A N P 0 ${subckt}`, 'CB P 0 2200u',
    '.subckt BRIDGE4 ac1 ac2 pos neg', 'D1 ac1 pos DR', 'D2 ac2 pos DR', 'D3 neg ac1 DR', 'D4 neg ac2 DR', '.ends BRIDGE4',
    '.model DR D(IS=5n N=1.8 RS=0.05)', '.end', '',
  ].join('\n');
}

describe('rectilens check: no silent pass', () => {
  it('exits 0 on the bridge as meant, 1 when its subcircuit name is mistyped', () => {
    const dir = folderWith({ 'good.cir': packaged('BRIDGE4'), 'typo.cir': packaged('BRDIGE4') });
    expect(run('check', join(dir, 'good.cir')).code).toBe(0);
    const typo = run('check', join(dir, 'typo.cir'));
    expect(typo.code).toBe(1);
    expect(typo.stdout).toContain("error unknown-subckt: no .subckt 'BRDIGE4' is defined");
    expect(typo.stdout).toContain("did you mean 'BRIDGE4'?");
  });

  it('exits 1 on an AC source with diodes in no recognised rectifier, 0 once the designer allows it', () => {
    const clamp = 'clamp\nV1 a 0 SIN(0 10 50)\nR1 a b 1k\nD1 b 0 DC\nD2 0 b DC\n.model DC D\n.end\n';
    const dir = folderWith({ 'clamp.cir': clamp, 'allowed.cir': clamp.replace('clamp\n', 'clamp\n*@ allow no-rectifier\n') });
    const result = run('check', join(dir, 'clamp.cir'));
    expect(result.code).toBe(1);
    expect(result.stdout).toContain('error no-rectifier:');
    expect(run('check', join(dir, 'allowed.cir')).code).toBe(0);
  });

  it('exits 2 with a message for a folder holding no netlist, even beside one that does', () => {
    const dir = folderWith({ 'notes.txt': 'not a netlist\n' });
    mkdirSync(join(dir, 'node_modules'));
    writeFileSync(join(dir, 'node_modules', 'x.cir'), 'skipped\n');
    const empty = run('check', dir);
    expect(empty.code).toBe(2);
    expect(empty.stderr).toBe(`rectilens: no netlist in ${dir} (looked for .cir, .net, .sp, .spi, .ckt files, skipping node_modules, .git, dist, out and hidden folders)\n`);
    const withOther = run('check', dir, folderWith({ 'ok.cir': packaged('BRIDGE4') }));
    expect(withOther.code).toBe(2);
  });

  it('exits 2 for a pattern the shell left unexpanded, saying no file matches it', () => {
    const dir = folderWith({});
    const result = run('check', join(dir, '*.cir'));
    expect(result.code).toBe(2);
    expect(result.stderr).toContain('no file matches this pattern');
  });
});
