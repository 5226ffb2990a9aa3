/**
 * The three-phase diode bridge with series line inductance, solved with commutation overlap
 * (solve/overlap-*.ts): against an independent integration of the same equations with the registry
 * library `odex` (Hairer & Wanner's ODEX, three-phase-overlap-reference.ts), run period after
 * period to steady state, and against the textbook overlap angle and DC voltage drop.
 */
import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import { THREE_PHASE_LINE_L_NOTE } from '../../server/src/solve/network';
import type { DiodeParams, EquivalentCircuit, Load } from '../../server/src/solve/equivalent-circuit';
import { AT_25C, IDEAL_DIODE, circuit } from './fixtures';
import { loadOdex } from './odex-loader';
import { inrushPeak, steadyDrive, type DriveSpec } from './three-phase-overlap-reference';

/** Our own example rectifier diode (no datasheet): IS and N written out, RS = 0, TNOM 25 °C. */
const DBR: DiodeParams = { isA: 10e-9, n: 1.8, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };
const VT_25C = (1.380649e-23 * 298.15) / 1.602176634e-19; // kT/q, SI-exact constants
const ROLES = ['upper-a', 'upper-b', 'upper-c', 'lower-a', 'lower-b', 'lower-c'] as const;

function bridge(k: { vllRms: number; fHz: number; lH: number; rOhm: number }, caps: [number, number][], load: Load, params = DBR): EquivalentCircuit {
  const devices = ROLES.map((role, j) => ({ kind: 'diode' as const, name: `D${j + 1}`, role, params }));
  return circuit('three-phase-bridge', { vrms: k.vllRms / Math.sqrt(3), freqHz: k.fHz, rOhm: k.rOhm, lH: k.lH }, devices, caps, load);
}

const rel = (a: number | undefined, b: number) => Math.abs(a! / b - 1);

describe('480 V drive with 1.2 mH line reactors, against odex run to steady state', () => {
  // Our own drive: 480 V line-to-line, 60 Hz, 1.2 mH per phase, two 1000 µF in series (500 µF),
  // a 40 Ω load (about 10 kW).
  const k: DriveSpec = { vllRms: 480, fHz: 60, lH: 1.2e-3, rOhm: 0.01, cF: 500e-6, rLoadOhm: 40, isA: DBR.isA, nVtV: DBR.n * VT_25C };
  const c = bridge(k, [[k.cF, 0]], { kind: 'resistance', ohm: k.rLoadOhm });
  it('DC average, ripple, capacitor RMS current, power factor and inrush within 2 %', async () => {
    const Solver = await loadOdex();
    const ref = steadyDrive(Solver, k);
    const s = solveCorner(c, AT_25C);
    expect(s.converged).toBe(true);
    expect(s.notes).not.toContain(THREE_PHASE_LINE_L_NOTE);
    expect(rel(s.vOutAvgV, ref.vOutAvgV), `${s.vOutAvgV} vs ${ref.vOutAvgV}`).toBeLessThan(0.02);
    expect(rel(s.rippleVpp, ref.rippleVpp), `${s.rippleVpp} vs ${ref.rippleVpp}`).toBeLessThan(0.02);
    expect(rel(s.capRippleIrmsA, ref.capIrmsA), `${s.capRippleIrmsA} vs ${ref.capIrmsA}`).toBeLessThan(0.02);
    expect(rel(s.powerFactor, ref.powerFactor), `${s.powerFactor} vs ${ref.powerFactor}`).toBeLessThan(0.02);
    expect(rel(s.sourceIrmsA, ref.sourceIrmsA), `${s.sourceIrmsA} vs ${ref.sourceIrmsA}`).toBeLessThan(0.02);
    // Switch-on at either crest of e_a − e_b = √3·Vm·sin(ωt + π/6), capacitor empty: ωt = π/3 and 4π/3.
    const w = 2 * Math.PI * k.fHz;
    const refInrush = Math.max(inrushPeak(Solver, k, Math.PI / 3 / w), inrushPeak(Solver, k, (4 * Math.PI) / 3 / w));
    expect(rel(s.inrushPeakA, refInrush), `${s.inrushPeakA} vs ${refInrush}`).toBeLessThan(0.02);
  }, 120_000);
});

describe('three-phase bridge with 2 mH reactors, against odex', () => {
  const k: DriveSpec = { vllRms: 480, fHz: 60, lH: 2e-3, rOhm: 0.05, cF: 470e-6, rLoadOhm: 100, isA: DBR.isA, nVtV: DBR.n * VT_25C };
  it('diode peak current and power factor within 2 %', async () => {
    const ref = steadyDrive(await loadOdex(), k);
    const s = solveCorner(bridge(k, [[k.cF, 0]], { kind: 'resistance', ohm: k.rLoadOhm }), AT_25C, { inrush: false });
    expect(s.converged).toBe(true);
    const ipk = Math.max(...s.devices.map((d) => d.ipkA!));
    expect(rel(ipk, ref.diodePeakA), `${ipk} vs ${ref.diodePeakA}`).toBeLessThan(0.02);
    expect(rel(s.powerFactor, ref.powerFactor), `${s.powerFactor} vs ${ref.powerFactor}`).toBeLessThan(0.02);
  }, 120_000);
});

describe('light and heavy loads (line currents discontinuous, then continuous), against odex', () => {
  for (const rLoadOhm of [2000, 400, 10]) {
    it(`480 V, 1.2 mH, 500 µF, ${rLoadOhm} Ω: DC average, ripple, capacitor RMS, power factor and diode peak within 1 %`, async () => {
      const k: DriveSpec = { vllRms: 480, fHz: 60, lH: 1.2e-3, rOhm: 0.01, cF: 500e-6, rLoadOhm, isA: DBR.isA, nVtV: DBR.n * VT_25C };
      const ref = steadyDrive(await loadOdex(), k);
      const s = solveCorner(bridge(k, [[k.cF, 0]], { kind: 'resistance', ohm: rLoadOhm }), AT_25C, { inrush: false });
      expect(s.converged).toBe(true);
      const ipk = Math.max(...s.devices.map((d) => d.ipkA!));
      expect(rel(s.vOutAvgV, ref.vOutAvgV), `${s.vOutAvgV} vs ${ref.vOutAvgV}`).toBeLessThan(0.01);
      expect(rel(s.rippleVpp, ref.rippleVpp), `${s.rippleVpp} vs ${ref.rippleVpp}`).toBeLessThan(0.01);
      expect(rel(s.capRippleIrmsA, ref.capIrmsA), `${s.capRippleIrmsA} vs ${ref.capIrmsA}`).toBeLessThan(0.01);
      expect(rel(s.powerFactor, ref.powerFactor), `${s.powerFactor} vs ${ref.powerFactor}`).toBeLessThan(0.01);
      expect(rel(ipk, ref.diodePeakA), `${ipk} vs ${ref.diodePeakA}`).toBeLessThan(0.01);
    }, 120_000);
  }
});

describe('commutation overlap against the textbook (stiff DC current, α = 0)', () => {
  // Mohan, Undeland & Robbins, Power Electronics (3rd ed., Wiley 2003), ch. 5, effect of Ls on
  // current commutation in the three-phase full-bridge rectifier (section from memory):
  // cos α − cos(α + µ) = 2ωLs·Id/(√2·V_LL) and Vd = 1.35·V_LL·cos α − 3ωLs·Id/π (1.35 = 3√2/π).
  // A DC current-sink load with a small, damped capacitor keeps the DC current stiff (its RMS
  // ripple current is under 0.5 % of Id); near-ideal diodes and R ≈ 0 as the textbook assumes.
  const k = { vllRms: 480, fHz: 60, lH: 1e-3, rOhm: 1e-4 };
  const id = 50;
  const w = 2 * Math.PI * k.fHz;
  let solved: ReturnType<typeof solveCorner> | undefined;
  const solve = () => (solved ??= solveCorner(bridge(k, [[0.2e-6, 50]], { kind: 'current', a: id }, IDEAL_DIODE), AT_25C, { waveformPoints: 6000, inrush: false }));
  it('the overlap angle µ within 3 %', () => {
    const s = solve();
    expect(s.converged).toBe(true);
    expect(s.capRippleIrmsA!).toBeLessThan(0.005 * id);
    const mu = Math.acos(1 - (2 * w * k.lH * id) / (Math.SQRT2 * k.vllRms));
    // Overlap: three devices conducting; six commutations per period.
    const wf = s.waveform!;
    let three = 0;
    for (let p = 0; p < wf.tS.length - 1; p++) if (wf.deviceA.filter((d) => d[p]! > 1e-9 * id).length === 3) three++;
    const muSolved = ((three / (wf.tS.length - 1)) * 2 * Math.PI) / 6;
    expect(rel(muSolved, mu), `${(muSolved * 180) / Math.PI}° vs ${(mu * 180) / Math.PI}°`).toBeLessThan(0.03);
  });
  it('the DC voltage drop 3ωL·Id/π within 3 %', () => {
    const s = solve();
    const vdo = ((3 * Math.SQRT2) / Math.PI) * k.vllRms;
    const drop = (3 * w * k.lH * id) / Math.PI;
    expect(rel(vdo - s.vOutAvgV!, drop), `${vdo - s.vOutAvgV!} V vs ${drop} V`).toBeLessThan(0.03);
  });
});
