/** `rectilens report` and `rectilens compare`: every flag and exit code (DESIGN.md §8), and the text shape. */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PROGRESS_MIN_FILES } from '../../server/src/cli/configured-analysis';
import { EXAMPLES_DIR, run } from './fixtures';

const LED = join(EXAMPLES_DIR, 'led-driver-230v.cir');
const CENTRE_TAP = join(EXAMPLES_DIR, 'bench-supply-centre-tap.cir');

describe('rectilens report (terminal)', () => {
  const result = run(['report', LED]);

  it('exits 0 and prints the netlist with the figures beside each rectifier device', () => {
    expect(result.code).toBe(0);
    expect(result.stderr).toBe('');
    for (const device of ['D1 l1 bus DGEN', 'D2 neutral bus DGEN', 'D3 0 l1 DGEN', 'D4 0 neutral DGEN']) {
      const line = result.stdout.split('\n').find((l) => l.startsWith(device));
      expect(line, device).toMatch(/ {2}; PIV \d+ V\/600 V · [\d.]+ mW · Tj \d+ °C$/);
    }
    // Lines that are not rectifier devices are printed as written.
    expect(result.stdout).toContain('\nCBULK bus 0 {cbulk}\n');
  });

  it('prints the tables under the netlist with the worst corner marked, the findings and the caution', () => {
    const out = result.stdout;
    expect(out.indexOf('Rectifier figures per corner')).toBeGreaterThan(out.indexOf('.end'));
    expect(out).toMatch(/Inrush peak .* [\d.]+ A\*/);
    expect(out).toMatch(/^D1(, D\d)* \(DGEN\) +low nom/m);
    expect(out).toMatch(/^Findings: \d+$/m);
    expect(out).toContain('CAUTION: Mains-connected circuits can kill.');
  });
});

describe('rectilens report --html', () => {
  it('writes one page and says so in one line, exit 0', () => {
    const result = run(['report', LED, '--html', 'out/report.html']);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^wrote out\/report\.html: 1 rectifier, \d+ findings?\n$/);
    const page = result.written.get('out/report.html')!;
    expect(page.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(page).toContain('data-series="output-voltage"');
    expect(page).toContain('data-variant="synchronous"');
    // Self-contained: no script, no external reference.
    expect(page).not.toMatch(/<script|<link|\ssrc=|url\(|@import/i);
  });

  it('accepts --html=path as well', () => {
    const result = run(['report', `--html=x.html`, CENTRE_TAP]);
    expect(result.code).toBe(0);
    expect(result.written.has('x.html')).toBe(true);
  });

  it('exits 2 with one line when the page cannot be written', () => {
    const result = run(['report', LED, '--html', '/nowhere/r.html'], { writeFails: true });
    expect(result.code).toBe(2);
    expect(result.stderr).toBe('rectilens: cannot write /nowhere/r.html: permission denied\n');
  });
});

describe('rectilens report and compare: usage and unreadable input exit 2', () => {
  for (const command of ['report', 'compare']) {
    it(`${command}: a missing file, a folder, no file, two files, an unknown flag`, () => {
      const missing = run([command, '/no/such/file.cir']);
      expect(missing.code).toBe(2);
      expect(missing.stderr).toBe('rectilens: cannot read /no/such/file.cir: no such file or folder\n');
      expect(run([command, EXAMPLES_DIR]).stderr).toMatch(/takes one netlist file, and .* is a folder/);
      expect(run([command, EXAMPLES_DIR]).code).toBe(2);
      expect(run([command]).code).toBe(2);
      expect(run([command, LED, CENTRE_TAP]).stderr).toMatch(new RegExp(`^rectilens: ${command} takes exactly one netlist file`));
      const unknown = run([command, LED, '--pdf']);
      expect(unknown.code).toBe(2);
      expect(unknown.stderr).toMatch(/^rectilens: unknown option --pdf/);
    });
  }

  it('report --html without a value, and compare --format with a bad value', () => {
    expect(run(['report', LED, '--html']).stderr).toBe('rectilens: --html needs a value\n');
    expect(run(['report', LED, '--html']).code).toBe(2);
    const bad = run(['compare', LED, '--format', 'xml']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toBe("rectilens: --format takes text|json, not 'xml'\n");
  });

  it('the usage text lists every command', () => {
    const help = run(['help']);
    expect(help.code).toBe(0);
    for (const line of ['rectilens check', 'rectilens report <file> [--html out.html]', 'rectilens compare <file>', 'rectilens lsp --stdio']) {
      expect(help.stdout).toContain(line);
    }
    expect(run([]).code).toBe(2);
  });
});

describe('rectilens compare', () => {
  it('prints one row per construction with the worst corner after each value, exit 0', () => {
    const result = run(['compare', LED]);
    expect(result.code).toBe(0);
    const lines = result.stdout.split('\n');
    expect(lines[0]).toBe(`== ${LED}`);
    expect(lines).toContain('-- diode bridge D1, D2, D3, D4 [diode-bridge:d1]');
    expect(lines.find((l) => l.startsWith('construction'))).toMatch(/^construction +verdict +efficiency +loss +hottest Tj +inrush peak +cost +parts$/);
    for (const label of ['As drawn', 'Silicon bridge', 'Hybrid bridge', 'Synchronous bridge']) {
      expect(lines.find((l) => l.startsWith(label)), label).toMatch(/ (passes|fails [a-z-, ]+|parts not rated) +[\d.]+ % @\w+ \w+ +[\d.]+ m?W @/);
    }
    expect(lines.find((l) => l.startsWith('Schottky bridge'))).toMatch(/not applicable: reverse voltage \d+ V is beyond the silicon Schottky class/);
    expect(result.stdout).toMatch(/^Assumptions:$/m);
  });

  it('--format json gives the comparison records', () => {
    const result = run(['compare', LED, '--format', 'json']);
    const json = JSON.parse(result.stdout);
    expect(json.version).toBe(1);
    expect(json.rectifiers[0].rows.map((r: { id: string }) => r.id)).toEqual(['as-drawn', 'silicon', 'schottky', 'hybrid', 'synchronous']);
    expect(json.rectifiers[0].rows[1].rectifierLossW.value).toBeGreaterThan(0);
  });

  it('says why there is no comparison for a rectifier that is not a single-phase bridge (exit 0)', () => {
    const result = run(['compare', CENTRE_TAP]);
    expect(result.code).toBe(0);
    expect(result.stdout).toContain('No comparison: the comparison covers single-phase four-device bridges only.');
  });
});

describe('rectilens check keeps working, with progress on a terminal', () => {
  const dir = mkdtempSync(join(tmpdir(), 'rectilens-progress-'));
  const names = Array.from({ length: PROGRESS_MIN_FILES }, (_, k) => `n${k}.cir`);
  for (const name of names) writeFileSync(join(dir, name), 'plain\nR1 a 0 1k\n');

  it('shows an in-place progress line on stderr when it is a TTY, and clears it', () => {
    const result = run(['check', dir], { tty: true });
    expect(result.code).toBe(0);
    expect(result.stderr).toContain(`\r\x1b[Krectilens: checking 1/${names.length} ${join(dir, 'n0.cir')}`);
    expect(result.stderr).toContain(`checking ${names.length}/${names.length}`);
    expect(result.stderr.endsWith('\r\x1b[K')).toBe(true);
    expect(result.stdout).toBe(`${names.length} files checked: 0 error(s), 0 warning(s), 0 info, 0 hint(s)\n`);
  });

  it('prints no progress when stderr is not a terminal, or for fewer files', () => {
    expect(run(['check', dir]).stderr).toBe('');
    expect(run(['check', join(dir, 'n0.cir')], { tty: true }).stderr).toBe('');
  });

  it('gives the same report with and without progress', () => {
    expect(run(['check', dir, '--format', 'json'], { tty: true }).stdout).toBe(run(['check', dir, '--format', 'json']).stdout);
  });
});
