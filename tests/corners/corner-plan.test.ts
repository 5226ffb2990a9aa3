/**
 * The corner plan of solve/corners.ts: the vertices where each figure is worst, not the whole
 * product of the ranges, and exactly today's six corners when nothing is ranged.
 */
import { describe, expect, it } from 'vitest';
import { defaultCorners, PART_VERTICES } from '../../server/src/solve/corners';
import { circuitAtCorner } from '../../server/src/solve/corner-circuit';
import { thermalVoltageV } from '../../server/src/solve/diode-model';
import { bridgeDevices, circuit } from '../solve/fixtures';

describe('corner plan', () => {
  it('without ranges: the six line × ambient corners, nothing overridden', () => {
    const corners = defaultCorners();
    expect(corners).toEqual([
      { name: 'low-line nominal', lineScale: 0.9, ambientC: 25 }, { name: 'low-line hot', lineScale: 0.9, ambientC: 50 },
      { name: 'nominal-line nominal', lineScale: 1, ambientC: 25 }, { name: 'nominal-line hot', lineScale: 1, ambientC: 50 },
      { name: 'high-line nominal', lineScale: 1.1, ambientC: 25 }, { name: 'high-line hot', lineScale: 1.1, ambientC: 50 },
    ]);
  });

  it('universal input, two frequencies, a load range and spreads: seven corners, each with its reason', () => {
    const light = { kind: 'power' as const, w: 0.2 };
    const corners = defaultCorners({ lineTolLow: -0.1, lineTolHigh: 0.1, lineRange: [100 / 240, 1], freqsHz: [50, 60], lightLoad: light, partSpread: true });
    const row = (name: string) => corners.find((c) => c.name === name)!;
    expect(corners).toHaveLength(7);
    // Ripple and hold-up: 90 V, 50 Hz, the weak parts.
    expect(row('low-line nominal full-load')).toMatchObject({ lineScale: expect.closeTo(90 / 240, 12), freqHz: 50, parts: PART_VERTICES.weak, loadLevel: 'full' });
    // Heat: 90 V hot, the peakiest parts with the highest drop.
    expect(row('low-line hot full-load')).toMatchObject({ freqHz: 50, parts: PART_VERTICES.heat });
    // Peak current at the highest frequency, inrush I²t at the lowest (the longer half-cycle).
    expect(row('high-line nominal full-load')).toMatchObject({ lineScale: expect.closeTo(1.1, 12), freqHz: 60, parts: PART_VERTICES.stiff });
    expect(row('high-line hot full-load')).toMatchObject({ freqHz: 50, parts: PART_VERTICES.stiff });
    // PIV and capacitor voltage: 264 V, light load, stiff parts, hot (lowest forward drop).
    expect(row('high-line hot light-load')).toMatchObject({ lineScale: expect.closeTo(1.1, 12), ambientC: 50, load: light, loadLevel: 'light', parts: PART_VERTICES.stiff });
    // Typical figures: the source as drawn with nominal parts.
    expect(row('nominal-line nominal full-load')).not.toHaveProperty('parts');
    expect(row('nominal-line nominal full-load')).not.toHaveProperty('freqHz');
  });

  it('applies a vertex: capacitance and ESR ends, and a forward shift of exactly ΔV at TNOM', () => {
    // Our own example diode (no datasheet): IS 5 nA, N 1.8.
    const base = circuit('diode-bridge', { vrms: 230 }, bridgeDevices({ isA: 5e-9, n: 1.8, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 27 }), [[100e-6, 0.5]], { kind: 'power', w: 10 });
    base.capacitors[0] = { ...base.capacitors[0]!, cMinF: 64e-6, cMaxF: 120e-6, esrAgedOhm: 1 };
    base.devices = base.devices.map((d) => (d.kind === 'diode' ? { ...d, vfSpreadV: [-0.05, 0.1] as [number, number] } : d));
    expect(circuitAtCorner(base, { name: 'n', lineScale: 1, ambientC: 25 })).toBe(base);
    const weak = circuitAtCorner(base, { name: 'w', lineScale: 1, ambientC: 25, parts: PART_VERTICES.weak, freqHz: 60 });
    expect(weak.capacitors[0]).toEqual({ name: 'C1', cF: 64e-6, esrOhm: 1 });
    expect(weak.source.freqHz).toBe(60);
    // Shockley law V = N·Vt·ln(1 + I/IS): IS' = IS·e^(−ΔV/(N·Vt)) raises V by ΔV at any I ≫ IS.
    const d0 = base.devices[0]!, d1 = weak.devices[0]!;
    if (d0.kind !== 'diode' || d1.kind !== 'diode') throw new Error('diodes expected');
    const v = (isA: number) => d0.params.n * thermalVoltageV(d0.params.tnomC) * Math.log1p(1 / isA);
    expect(v(d1.params.isA) - v(d0.params.isA)).toBeCloseTo(0.1, 9);
    const stiff = circuitAtCorner(base, { name: 's', lineScale: 1, ambientC: 25, parts: PART_VERTICES.stiff });
    expect(stiff.capacitors[0]).toEqual({ name: 'C1', cF: 120e-6, esrOhm: 0.5 });
  });
});
