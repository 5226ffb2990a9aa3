import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import { settleJunctionTemperatures } from '../../server/src/solve/thermal';
import { fitDiodeFromTwoPoints } from '../../server/src/solve/diode-model';
import type { DiodeParams, MosfetDevice } from '../../server/src/solve/equivalent-circuit';
import { AT_25C, bridgeDevices, circuit, diode } from './fixtures';

describe('inrush', () => {
  it('I²t of a half-sine is Ipk²·t/2 (REFERENCES §5, derived there): half-wave, resistive load', () => {
    const s = solveCorner(circuit('half-wave', { vrms: 100 }, [diode('D1', 'series')], [], { kind: 'resistance', ohm: 50 }), AT_25C, { waveformPoints: 0 });
    const d = s.devices[0]!;
    const T = 1 / 50;
    // Steady state: one half-sine per period, so ∫i²dt over a period = Irms²·T.
    expect((d.irmsA! ** 2 * T) / ((d.ipkA! ** 2 * T) / 2 / 2)).toBeCloseTo(1, 3);
    // Switch-on at the crest: the first half-cycle holds a quarter-sine, i.e. half of a half-sine of
    // duration T/2, so I²t = Ipk²·(T/2)/2/2.
    expect(s.inrushI2tA2s! / ((s.inrushPeakA! ** 2 * (T / 2)) / 4)).toBeCloseTo(1, 3);
    expect(s.inrushPeakA! / ((100 * Math.SQRT2) / 50)).toBeCloseTo(1, 3); // Ohm's law at the crest
  });

  it('a stiff source into an empty capacitor peaks near Vpk/(Rsource + ESR + device resistance)', () => {
    // Our own diode with RS = 0.05 Ω; 230 V, 1 Ω source, 0.1 Ω ESR, 4.7 mF (the capacitor barely
    // charges during the first microseconds, where the peak is).
    const dio: DiodeParams = { isA: 1e-12, n: 1, rsOhm: 0.05, egEv: 1.11, xti: 3, tnomC: 25 };
    const s = solveCorner(circuit('diode-bridge', { vrms: 230, rOhm: 1 }, bridgeDevices(dio), [[4.7e-3, 0.1]], { kind: 'resistance', ohm: 1e3 }), AT_25C, { waveformPoints: 0 });
    const estimate = (230 * Math.SQRT2) / (1 + 0.1 + 2 * 0.05); // two diodes conduct
    // The junction knees (about 2 × 0.9 V of 325 V) account for the remaining difference (common practice).
    expect(s.inrushPeakA! / estimate).toBeGreaterThan(0.985);
    expect(s.inrushPeakA! / estimate).toBeLessThanOrEqual(1);
  });
});

describe('electro-thermal loop', () => {
  it('settles: Tj = Ta + P·RθJA at the fixed point within 0.1 K (DESIGN.md §5)', () => {
    const silicon = fitDiodeFromTwoPoints({ vV: 0.93, iA: 1 }, { vV: 0.78, iA: 0.1 })!;
    const hot = { name: 'hot', lineScale: 1, ambientC: 50 };
    const s = solveCorner(circuit('diode-bridge', { vrms: 12, rOhm: 0.3 }, bridgeDevices(silicon, 60), [[2200e-6, 0.05]], { kind: 'resistance', ohm: 15 }), hot, { waveformPoints: 0, inrush: false });
    for (const d of s.devices) {
      expect(d.thermalRunaway).toBe(false);
      expect(d.tjC! - 50).toBeGreaterThan(5); // it did heat up
      expect(Math.abs(d.tjC! - (50 + d.lossW! * 60))).toBeLessThan(0.1);
    }
  });

  it('runs away when Rθ·dP/dTj exceeds one: synthetic MOSFET conduction loss P0·(T/298.15 K)^2.3', () => {
    const law = (p0: number) => (tj: number[]) => tj.map((t) => p0 * Math.pow((t + 273.15) / 298.15, 2.3));
    // Derived: T = 25 + 100·P0·(T/298.15)^2.3 has a stable root for P0 = 0.5 W and none for 2 W.
    const ok = settleJunctionTemperatures(25, [100], law(0.5));
    expect(ok.runaway[0]).toBe(false);
    expect(Math.abs(ok.tjC[0]! - (25 + 100 * law(0.5)(ok.tjC)[0]!))).toBeLessThan(0.1);
    const bad = settleJunctionTemperatures(25, [100], law(2));
    expect(bad.runaway[0]).toBe(true);
  });

  it('reports runaway per device from the full solver (a poor MOSFET on a large heat resistance)', () => {
    const body = fitDiodeFromTwoPoints({ vV: 0.9, iA: 1 }, { vV: 0.75, iA: 0.1 })!;
    const q = (name: string, role: 'upper-a' | 'lower-a' | 'upper-b' | 'lower-b'): MosfetDevice => ({
      kind: 'mosfet', name, role, rdsOn25Ohm: 0.3, rdsOnTempExponent: 2.3, body, gate: 'controller', rthjaKPerW: 400,
    });
    const devices = [q('Q1', 'upper-a'), q('Q2', 'lower-a'), q('Q3', 'upper-b'), q('Q4', 'lower-b')];
    const s = solveCorner(circuit('active-bridge', { vrms: 24, rOhm: 0.2 }, devices, [[4700e-6, 0.02]], { kind: 'resistance', ohm: 8 }), AT_25C, { waveformPoints: 0, inrush: false });
    expect(s.devices.some((d) => d.thermalRunaway)).toBe(true);
    expect(s.notes.some((n) => n.includes('thermal runaway'))).toBe(true);
  });
});
