/**
 * One test per pathological value: each gives a finding that names it, and no hint, lens,
 * message or reported figure says NaN or Infinity. Fixtures are our own bridge on 230 V mains.
 */
import { describe, expect, it } from 'vitest';
import { solverFindings } from '../../server/src/analysis/limits';
import type { RectifierAnalysis } from '../../server/src/equivalent/index';
import { dropNonFiniteFigures, NON_FINITE_NOTE } from '../../server/src/solve/finite-figures';
import type { CornerSolution } from '../../server/src/solve/index';
import { analyseText, bridge, DIODE_MODEL, expectNoNonFinite, findingsOf } from './check';

const withBridge = (body: string, extra = '') => `patho\n*@ mains 230V 50Hz\n${extra}${body}\n${DIODE_MODEL}\n`;

describe('pathological values: a finding each, never NaN', () => {
  it('1e400 (beyond the double range) is a bad value', () => {
    const file = analyseText(withBridge(bridge(1, '1e400')));
    expect(findingsOf(file, 'bad-value')).toMatchObject([{ text: '1e400' }]);
    expectNoNonFinite(file);
  });

  it('a 0 F capacitor', () => {
    const file = analyseText(withBridge(bridge(1, '0')));
    expect(findingsOf(file, 'implausible-value')).toMatchObject([{ text: 'C1', message: expect.stringContaining('capacitance of 0 F') }]);
    expectNoNonFinite(file);
  });

  it('a negative resistance', () => {
    const file = analyseText(withBridge(bridge(1, '100u', '-1k')));
    expect(findingsOf(file, 'implausible-value')).toMatchObject([{ text: 'RL1', message: expect.stringContaining('negative resistance') }]);
    expectNoNonFinite(file);
  });

  it('a source shorted by 0 Ω across the bridge input', () => {
    const file = analyseText(withBridge(`${bridge(1)}\nRS a1 b1 0`));
    expect(findingsOf(file, 'shorted-source')).toMatchObject([{ text: 'RS', message: 'RS is 0 Ω across V1: it shorts the source' }]);
    expectNoNonFinite(file);
  });

  it('a 0 V source across the bridge input', () => {
    for (const source of ['V1 a1 b1 SIN(0 0 50)', 'V1 a1 b1 0']) {
      const file = analyseText(withBridge(bridge(1).replace('V1 a1 b1 SIN(0 325 50)', source)));
      expect(findingsOf(file, 'shorted-source'), source).toMatchObject([{ text: 'V1', message: expect.stringContaining('0 V source across') }]);
      expectNoNonFinite(file);
    }
  });

  it('a capacitor with no discharge path (no load)', () => {
    const file = analyseText(withBridge(bridge(1, '100u', '')));
    expect(findingsOf(file, 'assumed-condition').map((f) => f.message)).toEqual(expect.arrayContaining([expect.stringContaining('no load found')]));
    expect(file.rectifiers[0]!.solution.worst.efficiency).toBeUndefined(); // omitted: no output power
    expectNoNonFinite(file);
  });

  it('a SIN of 0 Hz (frequency taken as missing; the assumption is a finding)', () => {
    const file = analyseText(`zero hz\n${bridge(1).replace('SIN(0 325 50)', 'SIN(0 325 0)')}\n${DIODE_MODEL}\n`);
    expect(findingsOf(file, 'assumed-condition').map((f) => f.message)).toEqual(expect.arrayContaining([expect.stringContaining('no frequency; assuming 50 Hz')]));
    expectNoNonFinite(file);
  });

  it('a SIN with a negative amplitude', () => {
    const file = analyseText(withBridge(bridge(1).replace('SIN(0 325 50)', 'SIN(0 -325 50)')));
    expect(findingsOf(file, 'implausible-value')).toMatchObject([{ message: expect.stringContaining('negative SIN amplitude (-325 V)') }]);
    expectNoNonFinite(file);
  });

  it('a rating of zero is refused (found by fuzzing: it gave "Infinity %")', () => {
    const file = analyseText(withBridge(bridge(1), '*@ rate C1 vrated=0V iripple=0A\n'));
    expect(findingsOf(file, 'directive-error').map((f) => f.text)).toEqual(['vrated=0V', 'iripple=0A']);
    expectNoNonFinite(file);
  });

  it('an ambient below absolute zero is refused (found by fuzzing: it gave NaN figures)', () => {
    const file = analyseText(withBridge(bridge(1), '*@ ambient -300C..9999C\n'));
    expect(findingsOf(file, 'directive-error')).toMatchObject([{ text: '-300C..9999C', message: expect.stringContaining('absolute zero') }]);
    expectNoNonFinite(file);
  });

  it('a figure that is not finite is dropped from the solution, noted, and reported as figure-omitted', () => {
    const corner = { name: 'nominal', lineScale: 1, lineVrms: 230, ambientC: 25, rippleVpp: Number.NaN, harmonicsA: [1, Infinity], vOutAvgV: 300,
      devices: [{ name: 'D1', pivV: -Infinity, lossW: 1, thermalRunaway: false }], converged: true, shootingIterations: 3, thermalIterations: 0, notes: [] } as CornerSolution;
    dropNonFiniteFigures(corner);
    expect(corner).not.toHaveProperty('rippleVpp');
    expect(corner).not.toHaveProperty('harmonicsA');
    expect(corner.devices[0]).toEqual({ name: 'D1', lossW: 1, thermalRunaway: false });
    expect(corner.notes).toEqual([`${NON_FINITE_NOTE}: rippleVpp, harmonicsA, D1.pivV`]);
    const analysis = { rectifier: { anchor: { uri: 'u', span: { start: 1, end: 2 } } }, solution: { corners: [corner], notes: corner.notes } } as unknown as RectifierAnalysis;
    expect(solverFindings([analysis])).toMatchObject([{ code: 'figure-omitted', span: { start: 1, end: 2 }, message: expect.stringContaining('rippleVpp') }]);
  });
});

/** Surge findings say no NaN, Infinity or raw double, whatever the rating. */
function surgeMessages(file: ReturnType<typeof analyseText>): string[] {
  return file.findings.filter((f) => f.code === 'surge-rating').map((f) => f.message);
}

describe('pathological messages (issue 13, item 6): the numbers shown are numbers', () => {
  it('ifsm=30A@-1ms and @0ms are directive errors on the pulse width, not "NaN %" and "Infinity %"', () => {
    for (const [width, seconds] of [['-1ms', '-0.001'], ['0ms', '0']] as const) {
      const file = analyseText(withBridge(bridge(1), `*@ rate DM ifsm=30A@${width}\n`));
      expect(findingsOf(file, 'directive-error'), width).toMatchObject([{
        text: width, message: `ifsm duration '${width}' reads as ${seconds} s: a surge lasts longer than zero; this ifsm is ignored`,
      }]);
      expect(file.findings.find((f) => f.code === 'directive-error')!.severity).toBe('error');
      // The rating is dropped whole, so the surge check says it did not run instead of comparing with a broken figure.
      expect(surgeMessages(file)).toEqual([]);
      expect(findingsOf(file, 'missing-rating')[0]!.message).toContain('ifsm');
      expectNoNonFinite(file);
    }
  });

  it('a pulse width outside 1 µs…100 ms is refused (a bare number reads as seconds: @10 is 10 s)', () => {
    const file = analyseText(withBridge(bridge(1), '*@ rate DM ifsm=30A@10 ifsm=30A@0.1us\n'));
    expect(findingsOf(file, 'directive-error').map((f) => f.message)).toEqual([
      "ifsm duration '10' reads as 10 s: a surge rating is stated for one pulse from 1 µs to 100 ms (usually 8.3 ms or 10 ms); this ifsm is ignored",
      "ifsm duration '0.1us' reads as 1e-7 s: a surge rating is stated for one pulse from 1 µs to 100 ms (usually 8.3 ms or 10 ms); this ifsm is ignored",
    ]);
    expect(findingsOf(analyseText(withBridge(bridge(1), '*@ rate DM ifsm=30A@10ms\n')), 'directive-error')).toEqual([]);
  });

  it('a rating of 1e-300 A gives a ratio of 3.5e301 times, not 3.5661252202237543e+301', () => {
    const messages = surgeMessages(analyseText(withBridge(bridge(1), '*@ rate DM ifsm=1e-300A\n')));
    expect(messages.length).toBeGreaterThan(0);
    for (const m of messages) {
      expect(m).not.toMatch(/\d\.\d{6,}|NaN|Infinity/);
      // The peak binds: 35 A against 1e-300 A; the I²t's share (its square, past the number range) is said in words.
      expect(m).toMatch(/the peak binds: \d(\.\d{1,2})?e3\d\d times IFSM \(the I²t is far beyond its rating\)/);
    }
  });

  it('a 10 MB token is quoted clipped, with an ellipsis, in a message of bounded length', () => {
    const token = 'x'.repeat(10 * 1024 * 1024);
    // The file-size limit is raised so that the token is read, as a file just under the limit would be.
    const file = analyseText(`big\nR1 a 0 {${token}}\n`, { limits: { maxFileChars: 16 * 1024 * 1024 } });
    const [finding] = findingsOf(file, 'undefined-param');
    expect(finding!.message.length).toBeLessThan(200);
    expect(finding!.message).toMatch(/^unknown parameter 'x{20,}…x{10,}'/);
  });
});

describe('encodings (issue 13, item 6): one finding naming it, nothing parsed', () => {
  const text = `utf16\n*@ mains 230V 50Hz\n${bridge(1)}\n${DIODE_MODEL}\n`;
  // What the command line and the server's disk reader hand over: the bytes decoded as UTF-8.
  const asUtf8 = (bytes: Buffer) => bytes.toString('utf8');
  const le = Buffer.from(text, 'utf16le');
  const be = Buffer.from(text, 'utf16le').swap16();
  const cases: [string, Buffer, string][] = [
    ['UTF-16 LE with a mark', Buffer.concat([Buffer.from([0xff, 0xfe]), le]), 'the file is UTF-16 LE with a byte-order mark, not UTF-8 text'],
    ['UTF-16 LE without', le, 'the file is UTF-16 LE, not UTF-8 text'],
    ['UTF-16 BE with a mark', Buffer.concat([Buffer.from([0xfe, 0xff]), be]), 'the file is UTF-16 BE with a byte-order mark, not UTF-8 text'],
    ['UTF-16 BE without', be, 'the file is UTF-16 BE, not UTF-8 text'],
  ];

  for (const [name, bytes, message] of cases) {
    it(`${name}: one file-encoding error instead of 129 × "unexpected \\x00"`, () => {
      const file = analyseText(asUtf8(bytes));
      expect(file.findings.map((f) => [f.code, f.severity, f.message])).toEqual([
        ['file-encoding', 'error', `${message}: it was not analysed; save it as UTF-8`],
      ]);
      expect(file.rectifiers).toEqual([]);
    });
  }

  it('an included UTF-16 file is named on the root\'s include card', () => {
    const file = analyseText('root\n.include "sub.cir"\n', {}, { 'file:///work/limits/sub.cir': asUtf8(le) });
    expect(findingsOf(file, 'include-error')[0]!.message).toContain('file-encoding: the file is UTF-16 LE, not UTF-8 text');
  });

  it('a NUL-rich file that is not UTF-16 is named as binary', () => {
    const noise = Array.from({ length: 400 }, (_, i) => (i % 3 === 0 ? '\u0000' : 'a')).join('');
    expect(analyseText(noise).findings.map((f) => f.message)).toEqual(['the file is binary data (NUL characters), not UTF-8 text: it was not analysed; save it as UTF-8']);
  });

  it('a UTF-8 byte-order mark is skipped: an included file keeps its first card', () => {
    const body = `${bridge(1)}\n${DIODE_MODEL}\n`;
    const plain = analyseText('root\n*@ mains 230V 50Hz\n.include "sub.cir"\n', {}, { 'file:///work/limits/sub.cir': body });
    const marked = analyseText('root\n*@ mains 230V 50Hz\n.include "sub.cir"\n', {}, { 'file:///work/limits/sub.cir': `\uFEFF${body}` });
    expect(marked.findings.map((f) => f.message)).toEqual(plain.findings.map((f) => f.message));
    expect(marked.rectifiers[0]!.rectifier.surroundings.source.elements).toContain('V1');
  });
});
