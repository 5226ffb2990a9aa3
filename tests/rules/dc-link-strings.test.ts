/**
 * DC-link capacitor strings and banks: capacitors in series (with or without a balancing resistor
 * across each) and in parallel across the output are one filter for the solver, and each
 * capacitor's voltage is checked with its own share (equivalent/string-share.ts). The fixtures are
 * scenarios of our own invention; the 480 V drive is mains-connected, a circuit that can kill.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';
import { relaxString } from '../../server/src/equivalent/index';
import { analyseText, findingsOf } from './check';
import { loadOdex } from '../solve/odex-loader';

/** 480 V 60 Hz three-phase, six diodes, two 400 V 1000 µF electrolytics in series with 47 kΩ across each, 5 kW. */
function drive(options: { caps?: string; balance?: boolean; resistorTol?: string } = {}): string {
  const caps = options.caps ?? 'tol=-20%,+20%';
  return [
    'DC link of a 480 V three-phase drive, two capacitors in series (a scenario of our own invention)',
    '*@ mains 480V 60Hz phases=3 tol=-10%,+10%',
    '*@ ambient 25C..45C',
    '*@ load 5000W vmin=500V',
    `*@ rate C1 vrated=400V ${caps}`,
    `*@ rate C2 vrated=400V ${caps}`,
    ...(options.resistorTol ? [`*@ rate RB1 tol=${options.resistorTol}`, `*@ rate RB2 tol=${options.resistorTol}`] : []),
    'VA pa 0 SIN(0 391.9 60 0 0 0)',
    'VB pb 0 SIN(0 391.9 60 0 0 -120)',
    'VC pc 0 SIN(0 391.9 60 0 0 120)',
    'RLA pa la 0.2', 'RLB pb lb 0.2', 'RLC pc lc 0.2',
    'D1 la dcp DR', 'D2 lb dcp DR', 'D3 lc dcp DR', 'D4 dcn la DR', 'D5 dcn lb DR', 'D6 dcn lc DR',
    'C1 dcp mid 1000u',
    'C2 mid dcn 1000u',
    ...(options.balance === false ? [] : ['RB1 dcp mid 47k', 'RB2 mid dcn 47k']),
    '.model DR D',
    '.end', '',
  ].join('\n');
}

/** The highest output voltage over the corners, with its corner, and the average there. */
function highest(file: ReturnType<typeof analyseText>) {
  const corners = file.rectifiers[0]!.solution.corners;
  return corners.reduce((a, b) => (b.vOutMaxV! > a.vOutMaxV! ? b : a));
}

describe('the 480 V drive with two 400 V capacitors in series', () => {
  const file = analyseText(drive());
  const analysis = file.rectifiers[0]!;

  it('is one filter for the solver: the series equivalent, and the balancing resistors as a bleeder', () => {
    // Series capacitors: 1/C = 1/C1 + 1/C2; each at −20 % and +20 % for the spread (analytic).
    expect(analysis.circuit.capacitors).toHaveLength(1);
    const cap = analysis.circuit.capacitors[0]!;
    expect(cap.cF).toBeCloseTo(500e-6, 12);
    expect(cap.cMinF).toBeCloseTo(400e-6, 12);
    expect(cap.cMaxF).toBeCloseTo(600e-6, 12);
    // The two 47 kΩ in series across the output draw beside the directive's 5 kW.
    expect(analysis.circuit.fixedLoad).toEqual({ ohm: 94_000 });
    expect(analysis.rectifier.surroundings.capacitors[0]!.names).toEqual(['C1', 'C2']);
    expect(findingsOf(file, 'unsolved-rectifier')).toEqual([]);
    // Textbook six-pulse bridge: the output peaks at the line-to-line crest √2·480 V·1.1 = 746.7 V
    // at high line, less two diode drops and the line resistance (≤ 1.5 % here).
    const top = highest(file);
    expect(top.vOutMaxV!).toBeLessThan(Math.SQRT2 * 480 * 1.1);
    expect(top.vOutMaxV!).toBeGreaterThan(0.985 * Math.SQRT2 * 480 * 1.1);
  });

  it('flags both capacitors cap-voltage with their own share: 60 % at switch-on from the ±20 % tolerance', () => {
    const found = findingsOf(file, 'cap-voltage');
    expect(found.map((f) => f.message.split(':')[0])).toEqual(['C1', 'C2']);
    // Equal charge in series: share = (1/0.8)/(1/0.8 + 1/1.2) = 0.6 (analytic) of the highest output.
    const top = highest(file);
    const peak = 0.6 * top.vOutMaxV!;
    for (const f of found) {
      expect(f.severity).toBe('error'); // 0.6 × ~740 V ≈ 444 V is above the 400 V rating itself
      expect(f.message).toContain(`peak ${Math.round(peak)} V at ${top.name}`);
      expect(f.message).toContain('60 % at switch-on (equal charge), settling to 50 % by the balancing resistors');
    }
    // Balancing time constant of two stages: (C1 + C2)/(G1 + G2) = 2 mF · 23.5 kΩ = 47 s (analytic).
    expect(found[0]!.message).toContain('time constant 47 s');
    const c1 = analysis.capacitors.find((c) => c.name === 'C1')!.share!;
    expect(c1.capacitive).toBeCloseTo(0.6, 12);
    expect(c1.resistive).toBeCloseTo(0.5, 12);
  });

  it('exits 1 from check, the errors being the two capacitors', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-dclink-'));
    const path = join(dir, 'drive.cir');
    writeFileSync(path, drive());
    let stdout = '';
    const code = runCommandLine(['check', path, '--format', 'json'], { stdout: (t) => (stdout += t), stderr: () => {}, stderrIsTty: false });
    expect(code).toBe(1);
    const report = JSON.parse(stdout) as { files: { diagnostics: { severity: string; code: string }[] }[] };
    const errors = report.files.flatMap((f) => f.diagnostics.filter((d) => d.severity === 'error').map((d) => d.code));
    expect(errors).toEqual(['cap-voltage', 'cap-voltage']);
  });

  it('with nominal parts shares the link equally: about 370 V each, a warning against 80 % of 400 V', () => {
    const nominal = analyseText(drive({ caps: '' }));
    const top = highest(nominal);
    const found = findingsOf(nominal, 'cap-voltage');
    expect(found).toHaveLength(2);
    for (const f of found) {
      expect(f.severity).toBe('warning');
      expect(f.message).toContain(`peak ${Math.round(top.vOutMaxV! / 2)} V`); // half of the link (equal parts)
      expect(f.message).not.toContain('tolerance vertex');
    }
  });

  it('moves the steady share by the balancing resistors\' tolerance: 5 % each way gives 1.05/2 = 52.5 %', () => {
    const c1 = analyseText(drive({ caps: '', resistorTol: '5%' })).rectifiers[0]!.capacitors.find((c) => c.name === 'C1')!.share!;
    expect(c1.resistive).toBeCloseTo(1.05 / (1.05 + 0.95), 12); // R₁·1.05 / (R₁·1.05 + R₂·0.95), analytic
    expect(c1.capacitive).toBeCloseTo(0.5, 12);
    expect(c1.peak).toBeCloseTo(0.525, 12); // two stages move monotonically between the two ends
  });

  it('passes the whole ripple current through each capacitor of the string', () => {
    const nominal = analyseText(drive({ caps: 'esr=0.1ohm' })).rectifiers[0]!;
    const stress = nominal.capacitors.find((c) => c.name === 'C1')!.stress!;
    for (const corner of nominal.solution.corners) {
      const at = stress.corners.find((c) => c.corner === corner.name)!;
      expect(at.irmsA).toBeCloseTo(corner.capacitorIrmsA![0]!, 12); // series elements carry one current (KCL)
    }
  });
});

describe('a string whose capacitors are drawn with their ESR', () => {
  const text = drive({ caps: '' }).replace('C1 dcp mid 1000u\nC2 mid dcn 1000u\n', 'C1 dcp q1 1000u\nRE1 q1 mid 0.1\nC2 mid q2 1000u\nRE2 q2 dcn 0.1\n');
  const analysis = analyseText(text).rectifiers[0]!;

  it('takes each series resistor as its capacitor\'s ESR: the string\'s ESRs add, 0.2 Ω', () => {
    expect(analysis.rectifier.surroundings.capacitors[0]!.esrResistors).toEqual(['RE1', 'RE2']);
    expect(analysis.circuit.capacitors[0]!.esrOhm).toBeCloseTo(0.2, 12); // series resistances add
    expect(analysis.circuit.fixedLoad).toEqual({ ohm: 94_000 });
  });

  it('loses I²·ESR in each, with the whole string current', () => {
    const stress = analysis.capacitors.find((c) => c.name === 'C2')!.stress!;
    expect(stress.esr).toEqual({ ohm: 0.1, from: 'series resistor' });
    for (const corner of analysis.solution.corners) {
      const at = stress.corners.find((c) => c.corner === corner.name)!;
      expect(at.lossW!).toBeCloseTo(corner.capacitorIrmsA![0]! ** 2 * 0.1, 12); // P = I²·R
    }
  });
});

describe('a string without balancing resistors', () => {
  const file = analyseText(drive({ balance: false }));

  it('is checked by its capacitive share and says that leakage, not modelled, decides the DC share', () => {
    const unbalanced = findingsOf(file, 'unbalanced-string');
    expect(unbalanced.map((f) => [f.severity, f.message.split(':')[0]])).toEqual([['warning', 'C1'], ['warning', 'C2']]);
    expect(unbalanced[0]!.message).toContain('leakage currents, which are not modelled');
    const voltage = findingsOf(file, 'cap-voltage');
    expect(voltage).toHaveLength(2);
    expect(voltage[0]!.message).toContain('60 % by capacitance');
    // No DC path across the output but leakage: no bleeder beside the load.
    expect(file.rectifiers[0]!.circuit.fixedLoad).toBeUndefined();
  });
});

describe('banks and longer strings', () => {
  const bridge = (caps: string, rate = '') => [
    'a 230 V bridge with a capacitor bank of our own invention',
    '*@ mains 230V 50Hz tol=-10%,+10%',
    '*@ load 100W',
    rate,
    'V1 l 0 SIN(0 325 50)', 'RS l a 1',
    'D1 a p DX', 'D2 0 p DX', 'D3 n a DX', 'D4 n 0 DX',
    caps, '.model DX D', '.end', '',
  ].join('\n');

  it('keeps parallel capacitors one bank, each at the whole output voltage, ripple by capacitance', () => {
    const file = analyseText(bridge('CA p n 220u\nCB p n 470u', '*@ rate CA vrated=250V\n*@ rate CB vrated=250V'));
    const [group] = file.rectifiers[0]!.rectifier.surroundings.capacitors;
    expect(group!.strings).toBeUndefined();
    expect(group!.cF).toBeCloseTo(690e-6, 12);
    const top = highest(file);
    const found = findingsOf(file, 'cap-voltage');
    expect(found).toHaveLength(2);
    for (const f of found) expect(f.message).toContain(`peak ${Math.round(top.vOutMaxV!)} V`);
    expect(found[0]!.message).not.toContain('series string');
  });

  it('takes banks in series as stages: capacitances add in a stage, stages add as 1/C', () => {
    const file = analyseText(bridge('C1 p m 100u\nC3 p m 100u\nC2 m n 220u\nR1 p m 100k\nR2 m n 100k'));
    const r = file.rectifiers[0]!;
    expect(r.circuit.capacitors[0]!.cF).toBeCloseTo(1 / (1 / 200e-6 + 1 / 220e-6), 12);
    const c1 = r.capacitors.find((c) => c.name === 'C1')!.share!;
    expect(c1.capacitive).toBeCloseTo((1 / 200) / (1 / 200 + 1 / 220), 12); // equal charge on both stages (analytic)
    expect(c1.resistive).toBeCloseTo(0.5, 12);
  });

  it('finds a string of three, each capacitor at a third of the link with equal parts', () => {
    const file = analyseText(bridge('C1 p m1 330u\nC2 m1 m2 330u\nC3 m2 n 330u\nR1 p m1 33k\nR2 m1 m2 33k\nR3 m2 n 33k', '*@ rate C1 vrated=160V\n*@ rate C2 vrated=160V\n*@ rate C3 vrated=160V'));
    const r = file.rectifiers[0]!;
    expect(r.circuit.capacitors[0]!.cF).toBeCloseTo(110e-6, 12);
    expect(r.circuit.fixedLoad).toEqual({ ohm: 99_000 });
    const top = highest(file);
    const found = findingsOf(file, 'cap-voltage');
    // ≈ 360 V / 3 = 120 V on 160 V: 75 %, inside the 80 % policy; the capacitors are there, not passed in silence.
    expect(found).toEqual([]);
    for (const name of ['C1', 'C2', 'C3']) {
      const share = r.capacitors.find((c) => c.name === name)!.share!;
      expect(share.stages).toBe(3);
      expect(share.peak).toBeCloseTo(1 / 3, 12);
    }
    expect(top.vOutMaxV! / 3 / 160).toBeLessThan(0.8);
  });

  it('does not take a midpoint tied elsewhere for a string', () => {
    const file = analyseText(bridge('C1 p m 100u\nC2 m n 100u\nRT m 0 10k'));
    expect(file.rectifiers[0]!.rectifier.surroundings.capacitors).toEqual([]);
  });
});

describe('the relaxation of a string after switch-on', () => {
  it('two stages: from the capacitive to the resistive share, τ = (C1 + C2)/(G1 + G2)', () => {
    const r = relaxString([0.8e-3, 1.2e-3], [1 / 47e3, 1 / 47e3]);
    // Node equation (C1 + C2)·u̇ + (G1 + G2)·u = C1·u̇₀ + G1·V (derived here): one mode.
    expect(r.initial[0]).toBeCloseTo(0.6, 12);
    expect(r.final[0]).toBeCloseTo(0.5, 12);
    expect(r.slowestTauS).toBeCloseTo(2e-3 / (2 / 47e3), 9);
    expect(r.peak).toEqual([r.initial[0], r.final[1]]);
  });

  it('three mismatched stages: the largest share over time against an odex integration of the node equations', async () => {
    const Solver = await loadOdex();
    // A fast stage beside two slow ones, so the middle one overshoots both its ends.
    const cF = [1e-3, 1e-3, 1e-3];
    const gS = [1 / 1e3, 1 / 10e3, 1 / 100e3];
    const relaxed = relaxString(cF, gS);
    // Reference: internal nodes u1, u2 (u0 = 1, u3 = 0), KCL solved for u̇ at each step (written here).
    const f = (_t: number, [u1, u2]: number[]) => {
      const [c0, c1, c2] = cF as [number, number, number];
      const [g0, g1, g2] = gS as [number, number, number];
      // Stage currents i_k = C_k·v̇_k + G_k·v_k are equal: two equations in v̇1 = u̇1, v̇2 = u̇2.
      const v = [1 - u1!, u1! - u2!, u2!];
      // C0·(−u̇1) + G0·v0 = C1·(u̇1 − u̇2) + G1·v1 ; C1·(u̇1 − u̇2) + G1·v1 = C2·u̇2 + G2·v2
      const a = [[c0 + c1, -c1], [-c1, c1 + c2]];
      const b = [g0 * v[0]! - g1 * v[1]!, g1 * v[1]! - g2 * v[2]!];
      const det = a[0]![0]! * a[1]![1]! - a[0]![1]! * a[1]![0]!;
      return [(b[0]! * a[1]![1]! - a[0]![1]! * b[1]!) / det, (a[0]![0]! * b[1]! - b[0]! * a[1]![0]!) / det];
    };
    const solver = new Solver(2);
    solver.absoluteTolerance = 1e-12;
    solver.relativeTolerance = 1e-12;
    solver.maxSteps = 1e6;
    solver.denseOutput = true;
    let top = 0;
    // Start from the capacitive divider (equal charge): 1/3 each.
    solver.solve(f, 0, [2 / 3, 1 / 3], 2000, solver.grid(0.01, (_t, [u1, u2]) => { top = Math.max(top, u1! - u2!); }));
    expect(relaxed.initial[1]).toBeCloseTo(1 / 3, 12);
    expect(relaxed.final[1]).toBeCloseTo(10 / 111, 12); // R2/ΣR, analytic
    expect(relaxed.peak[1]!).toBeGreaterThan(relaxed.initial[1]! + 0.05); // the overshoot is real
    expect(Math.abs(relaxed.peak[1]! - top)).toBeLessThan(1e-6); // grid of 10 ms against τ ≥ 1 s
  });
});
