/**
 * The overlap solver over a spread of three-phase bridges with line inductance (tiny to large
 * reactors, light to heavy loads, no capacitor, power loads, ESR, thermal coupling, an NTC
 * limiter): every corner periodic, and the energy balance of the periodic orbit holds — the EMFs'
 * power equals load power plus diode loss plus I²R in the lines and the ESR (the inductors' and
 * capacitor's stored energy returns to its start over a period; conservation, derived here).
 */
import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import type { DiodeParams, EquivalentCircuit, Load } from '../../server/src/solve/equivalent-circuit';
import { AT_25C, IDEAL_DIODE, circuit } from './fixtures';

const DBR: DiodeParams = { isA: 10e-9, n: 1.8, rsOhm: 0.01, egEv: 1.11, xti: 3, tnomC: 25 };
const ROLES = ['upper-a', 'upper-b', 'upper-c', 'lower-a', 'lower-b', 'lower-c'] as const;

interface Case { label: string; vll: number; f: number; lH: number; r: number; caps: [number, number][]; load: Load; params?: DiodeParams; rth?: number }

function bridge(k: Case): EquivalentCircuit {
  const devices = ROLES.map((role, j) => ({ kind: 'diode' as const, name: `D${j + 1}`, role, params: k.params ?? DBR, ...(k.rth ? { rthjaKPerW: k.rth } : {}) }));
  return circuit('three-phase-bridge', { vrms: k.vll / Math.sqrt(3), freqHz: k.f, rOhm: k.r, lH: k.lH }, devices, k.caps, k.load);
}

const CASES: Case[] = [
  { label: '1 µH, heavy load', vll: 400, f: 50, lH: 1e-6, r: 0.02, caps: [[1000e-6, 0.05]], load: { kind: 'resistance', ohm: 20 } },
  { label: '20 mH, heavy load', vll: 400, f: 50, lH: 20e-3, r: 0.2, caps: [[1000e-6, 0.05]], load: { kind: 'resistance', ohm: 10 } },
  { label: '1.2 mH, light load', vll: 480, f: 60, lH: 1.2e-3, r: 0.01, caps: [[500e-6, 0.1]], load: { kind: 'resistance', ohm: 5000 } },
  { label: 'no capacitor', vll: 480, f: 60, lH: 1.2e-3, r: 0.01, caps: [], load: { kind: 'resistance', ohm: 30 } },
  { label: 'power load', vll: 480, f: 60, lH: 1.2e-3, r: 0.01, caps: [[500e-6, 0.1]], load: { kind: 'power', w: 8000, vminV: 400 } },
  { label: 'near-ideal diodes', vll: 230, f: 50, lH: 0.5e-3, r: 0.001, caps: [[2200e-6, 0]], load: { kind: 'resistance', ohm: 15 }, params: IDEAL_DIODE },
  { label: 'thermally coupled', vll: 480, f: 60, lH: 1.2e-3, r: 0.01, caps: [[500e-6, 0.1]], load: { kind: 'resistance', ohm: 25 }, rth: 8 },
];

describe('overlap solver over a spread of bridges', () => {
  for (const k of CASES) {
    it(`${k.label}: periodic, energy balance within 0.5 %`, () => {
      const c = bridge(k);
      const s = solveCorner(c, { ...AT_25C, lineScale: 1.1 }, { inrush: true });
      expect(s.converged, s.notes.join('; ')).toBe(true);
      const esr = k.caps[0]?.[1] ?? 0;
      const out = s.outputPowerW! + s.rectifierLossW! + 3 * k.r * s.sourceIrmsA! ** 2 + esr * (s.capRippleIrmsA ?? 0) ** 2;
      expect(Math.abs(out / s.inputPowerW! - 1), `${out} vs ${s.inputPowerW}`).toBeLessThan(0.005);
      expect(s.inrushPeakA!).toBeGreaterThan(0);
      for (const d of s.devices) expect(d.pivV!).toBeGreaterThan(0);
    });
  }
  it('with an NTC limiter the cold start is milder than the hot restart', () => {
    const k = CASES[6]!;
    const c: EquivalentCircuit = { ...bridge(k), inrushLimiter: { names: ['NTC1'], coldROhm: 5, hotROhm: 0.2 } };
    c.source = { ...c.source, seriesROhm: k.r + 0.2 };
    const s = solveCorner(c, AT_25C);
    expect(s.converged).toBe(true);
    expect(s.inrushCase).toContain('hot restart');
    expect(s.devices.some((d) => d.inrushCase?.includes('hot restart'))).toBe(true);
  });
});
