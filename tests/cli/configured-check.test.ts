/**
 * The command line with a project configuration and parts files, includes with findings of their
 * own, and the small things a CI user reaches for: help per command, the version, standard input,
 * patterns, an output file and CI annotations. SARIF results keep their related places and fixes
 * and stay valid against the published schema (OASIS SARIF 2.1.0, via @microsoft/jest-sarif).
 */
import { mkdirSync, mkdtempSync, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import Ajv from 'ajv-draft-04';
import { describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';

function folderWith(files: Record<string, string>): string {
  const dir = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-cfg-')));
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), text);
  }
  return dir;
}

function run(argv: string[]) {
  let stdout = '';
  let stderr = '';
  const written = new Map<string, string>();
  const code = runCommandLine(argv, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t), stderrIsTty: false, writeFile: (p, t) => void written.set(p, t) });
  return { code, stdout, stderr, written };
}

// A 24 V bridge of our own whose diode DP is rated only by a parts file, at 30 V: piv-margin
// fires (crest 24·√2·1.1 ≈ 37 V > 0.8 × 30 V); with the configuration's reverse-voltage fraction
// it stays an error beyond the rating itself either way.
const BRIDGE = ['Configured bridge (our own)', '*@ mains 24V 50Hz', 'V1 a b SIN(0 34 50)',
  'D1 a p DP', 'D2 b p DP', 'D3 n a DP', 'D4 n b DP', 'C1 p n 1000u', 'R1 p n 100', '.model DP D(IS=2.5n N=1.75 RS=0.04)', ''].join('\n');
const PARTS = JSON.stringify({ version: 1, parts: [{ name: 'DP', kind: 'diode', vrrmV: 60, ifavA: 1 }] });

const codesOf = (report: { files: { diagnostics: { code: string }[] }[] }) => report.files.flatMap((f) => f.diagnostics.map((d) => d.code));
/** Whether the diodes lack a VRRM (the parts file not read). */
const vrrmMissing = (report: { files: { diagnostics: { code: string; message: string }[] }[] }) =>
  report.files.some((f) => f.diagnostics.some((d) => d.code === 'missing-rating' && /\bvrrm\b/.test(d.message.split(':')[0]!)));

describe('check with a project configuration', () => {
  it('reads the nearest rectilens.json above the netlist, its parts files and its settings', () => {
    // 60 V part: PIV ≈ 36 V passes at the default 80 % (48 V) but not under the configuration's 50 % (30 V).
    const dir = folderWith({
      'rectilens.json': JSON.stringify({ derating: { reverseVoltage: 0.5 }, partsFiles: ['parts/diodes.json'] }),
      'parts/diodes.json': PARTS,
      'designs/bridge.cir': BRIDGE,
    });
    const configured = JSON.parse(run(['check', '--format', 'json', join(dir, 'designs')]).stdout);
    expect(codesOf(configured)).toContain('piv-margin');
    expect(vrrmMissing(configured)).toBe(false);
    // Without the configuration (--config of an empty one): the part is unrated.
    writeFileSync(join(dir, 'empty.json'), '{}');
    const bare = JSON.parse(run(['check', '--format', 'json', '--config', join(dir, 'empty.json'), join(dir, 'designs')]).stdout);
    expect(vrrmMissing(bare)).toBe(true);
    // --parts adds a parts file: rated again, at the default 80 %: no piv-margin.
    const withParts = JSON.parse(run(['check', '--format', 'json', '--config', join(dir, 'empty.json'), '--parts', join(dir, 'parts/diodes.json'), join(dir, 'designs')]).stdout);
    expect(vrrmMissing(withParts)).toBe(false);
    expect(codesOf(withParts)).not.toContain('piv-margin');
  });

  it('reports a configuration entry that is not a setting on the configuration file, and exits by it', () => {
    const dir = folderWith({ 'rectilens.json': '{ "derating": { "reverseVoltag": 0.5 } }', 'b.cir': BRIDGE });
    const result = run(['check', '--fail-on', 'warning', '--format', 'json', join(dir, 'b.cir')]);
    const config = JSON.parse(result.stdout).files.find((f: { path: string }) => f.path.endsWith('rectilens.json'));
    expect(config.diagnostics.map((d: { code: string; message: string }) => [d.code, d.message])).toEqual([['project-config', "'derating.reverseVoltag' is not a setting; it is ignored"]]);
    expect(result.code).toBe(1);
  });
});

describe('a root that includes a file with a syntax error', () => {
  const dir = folderWith({
    'root.cir': 'Root (our own)\n.include "lib.inc"\nR1 a 0 1k\n',
    'lib.inc': '* library of our own\n.model DX D(IS=1n\n',
  });
  it('lists the error under the included file and exits 1, in text, JSON and SARIF', () => {
    const text = run(['check', join(dir, 'root.cir')]);
    expect(text.code).toBe(1);
    expect(text.stdout).toContain(`${join(dir, 'lib.inc')}:2:`);
    const json = JSON.parse(run(['check', '--format', 'json', join(dir, 'root.cir')]).stdout);
    const lib = json.files.find((f: { path: string }) => f.path.endsWith('lib.inc'));
    expect(lib.diagnostics[0]).toMatchObject({ line: 2, severity: 'error', related: [{ path: join(dir, 'root.cir'), line: 2 }] });
    const sarif = JSON.parse(run(['check', '--format', 'sarif', join(dir, 'root.cir')]).stdout);
    const result = sarif.runs[0].results.find((r: { locations: { physicalLocation: { artifactLocation: { uri: string } } }[] }) => r.locations[0]!.physicalLocation.artifactLocation.uri.endsWith('lib.inc'));
    expect(result.relatedLocations[0].physicalLocation.artifactLocation.uri).toMatch(/root\.cir$/);
    expect(sarif.runs[0].originalUriBaseIds.SRCROOT.uri).toMatch(/^file:\/\/\/.*\/$/);
  });

  it('writes SARIF with quick fixes that the published schema accepts', () => {
    const schema = JSON.parse(readFileSync(require.resolve('@microsoft/jest-sarif/lib/schemas/sarif-2.1.0-rtm.5.json'), 'utf8'));
    const validate = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false, logger: false }).compile(schema);
    // A reversed diode (D3) in a bridge of our own: its fix swaps the nodes.
    const fixable = folderWith({ 'r.cir': 'Reversed (our own)\n*@ mains 12V 50Hz\nV1 a b SIN(0 17 50)\nD1 a p DG\nD2 b p DG\nD3 a n DG\nD4 n b DG\nC1 p n 2200u\nR1 p n 24\n.model DG D(IS=2.5n N=1.75 RS=0.04)\n' });
    const log = JSON.parse(run(['check', '--format', 'sarif', join(fixable, 'r.cir')]).stdout);
    expect(validate(log), JSON.stringify(validate.errors)).toBe(true);
    const withFix = log.runs[0].results.find((r: { fixes?: unknown[] }) => r.fixes?.length);
    expect(withFix.fixes[0].artifactChanges[0].replacements[0].insertedContent.text.length).toBeGreaterThan(0);
  });
});

describe('the small things', () => {
  it('--help per command, -h, --version', () => {
    expect(run(['check', '--help'])).toMatchObject({ code: 0, stdout: expect.stringContaining('--config FILE') });
    expect(run(['check', '-h']).stdout).toContain('Exit codes:');
    expect(run(['report', '--help']).stdout).toContain('--html FILE');
    expect(run(['-h']).code).toBe(0);
    expect(run(['--version']).stdout).toMatch(/^rectilens \S+\n$/);
  });

  it('- reads one netlist from standard input', () => {
    const result = spawnSync(process.execPath, [join(__dirname, '../../dist/cli.js'), 'check', '-'], { input: 'stdin netlist\nR1 a 0 4k7\n', encoding: 'utf8' });
    expect(result.status).toBe(0);
    expect(result.stdout).toMatch(/^-:2:8: warning value-notation/m);
  });

  it('expands a quoted pattern, recursing with **', () => {
    const dir = folderWith({ 'a/one.cir': 'one\nR1 a 0 1k\n', 'a/b/two.cir': 'two\nR1 a 0 4k7\n', 'a/b/notes.txt': 'x' });
    const result = run(['check', '--format', 'json', join(dir, 'a', '**', '*.cir')]);
    expect(JSON.parse(result.stdout).files.map((f: { path: string }) => f.path.slice(dir.length))).toEqual(['/a/b/two.cir', '/a/one.cir']);
  });

  it('--output writes the report to a file; --format ci writes workflow annotations', () => {
    const dir = folderWith({ 'w.cir': 'warns\nR1 a 0 4k7\n' });
    const out = join(dir, 'report.txt');
    const result = run(['check', '--output', out, join(dir, 'w.cir')]);
    expect(result.stdout).toBe('');
    expect(result.written.get(out)).toContain('warning value-notation');
    const ci = run(['check', '--format', 'ci', join(dir, 'w.cir')]).stdout;
    expect(ci).toBe(`::warning file=${join(dir, 'w.cir')},line=2,col=8,endLine=2,endColumn=11,title=rectilens value-notation::${ci.split('::')[2]}`);
    expect(ci).toMatch(/::warning file=.*title=rectilens value-notation::.*read as 4700/);
  });
});

describe('the problem matcher the extension contributes', () => {
  it('reads every line of the text report into file, line, column, severity, code and message', () => {
    const manifest = JSON.parse(readFileSync(join(__dirname, '../../package.json'), 'utf8'));
    const matcher = manifest.contributes.problemMatchers.find((m: { name: string }) => m.name === 'rectilens');
    const re = new RegExp(matcher.pattern.regexp);
    const dir = folderWith({ 'a b.cir': 'spaced name\nR1 x 0 4k7\nD1 x\n' });
    const lines = run(['check', dir]).stdout.split('\n').filter((l) => l.includes(': '));
    const findings = lines.slice(0, -1);
    expect(findings).toHaveLength(2);
    for (const line of findings) {
      const m = re.exec(line)!;
      expect(m[matcher.pattern.file]).toBe(join(dir, 'a b.cir'));
      expect(['error', 'warning']).toContain(m[matcher.pattern.severity]);
      expect(m[matcher.pattern.message]!.length).toBeGreaterThan(5);
    }
    // The summary line is not a finding.
    expect(re.test(lines.at(-1)!)).toBe(false);
  });
});
