import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import { fitDiodeFromTwoPoints } from '../../server/src/solve/diode-model';
import type { DeviceRole, MosfetDevice, RectifierDevice } from '../../server/src/solve/equivalent-circuit';
import { AT_25C, bridgeDevices, circuit, diode } from './fixtures';

// Trade facts about silicon bridges (common practice, no published source): a 1 A general-purpose
// silicon bridge drops about 1.4 V (two junctions) at a few hundred mA; at ~12 V and ~1 A RMS it
// loses on the order of a tenth of the power; a hybrid bridge (two MOSFETs) loses clearly less and
// a synchronous bridge least. The devices are our own examples, not any manufacturer's part.
const SILICON = fitDiodeFromTwoPoints({ vV: 0.93, iA: 1 }, { vV: 0.78, iA: 0.1 })!;
const BODY = fitDiodeFromTwoPoints({ vV: 0.9, iA: 1 }, { vV: 0.75, iA: 0.1 })!;
const mosfet = (name: string, role: DeviceRole, gate: MosfetDevice['gate']): MosfetDevice => ({
  kind: 'mosfet', name, role, rdsOn25Ohm: 0.02, rdsOnTempExponent: 2.3, body: BODY, gate,
});
const opts = { waveformPoints: 0, inrush: false };

describe('silicon bridge facts (common practice)', () => {
  it('two series drops of about 1.4 V at a few hundred mA', () => {
    // Resistive load: the output peak is the source peak less the conducting pair's drop at Ipk.
    const s = solveCorner(circuit('diode-bridge', { vrms: 12 }, bridgeDevices(SILICON), [], { kind: 'resistance', ohm: 50 }), AT_25C, opts);
    const ipk = s.devices[0]!.ipkA!;
    expect(ipk).toBeGreaterThan(0.2);
    expect(ipk).toBeLessThan(0.5);
    const drop = 12 * Math.SQRT2 - s.vOutMaxV!;
    expect(drop).toBeGreaterThan(1.2);
    expect(drop).toBeLessThan(1.8);
  });

  it('loss ordering at 12 V, about 1 A RMS: diode bridge ≈ a tenth, hybrid clearly less, synchronous least', () => {
    const solve = (devices: RectifierDevice[], kind: 'diode-bridge' | 'hybrid-bridge' | 'active-bridge') =>
      solveCorner(circuit(kind, { vrms: 12, rOhm: 0.3 }, devices, [[2200e-6, 0.05]], { kind: 'resistance', ohm: 33 }), AT_25C, opts);
    const plain = solve(bridgeDevices(SILICON), 'diode-bridge');
    const hybrid = solve([diode('D1', 'upper-a', SILICON), mosfet('Q1', 'lower-a', 'self-driven'), diode('D2', 'upper-b', SILICON), mosfet('Q2', 'lower-b', 'self-driven')], 'hybrid-bridge');
    const sync = solve((['upper-a', 'lower-a', 'upper-b', 'lower-b'] as const).map((r, k) => mosfet(`Q${k + 1}`, r, 'controller')), 'active-bridge');
    expect(plain.sourceIrmsA!).toBeGreaterThan(0.7);
    expect(plain.sourceIrmsA!).toBeLessThan(1.4);
    const lossShare = (s: typeof plain) => s.rectifierLossW! / (s.outputPowerW! + s.rectifierLossW!);
    expect(lossShare(plain)).toBeGreaterThan(0.05);
    expect(lossShare(plain)).toBeLessThan(0.2);
    expect(hybrid.rectifierLossW!).toBeLessThan(0.75 * plain.rectifierLossW!);
    expect(sync.rectifierLossW!).toBeLessThan(hybrid.rectifierLossW!);
    expect(sync.efficiency!).toBeGreaterThan(hybrid.efficiency!);
    expect(hybrid.efficiency!).toBeGreaterThan(plain.efficiency!);
  });

  it('an active bridge below its controller minimum is a body-diode bridge', () => {
    // 6 V RMS peaks at 8.5 V, under the 9 V default vmin (common practice): gates never driven.
    const devices = (['upper-a', 'lower-a', 'upper-b', 'lower-b'] as const).map((r, k) => mosfet(`Q${k + 1}`, r, 'controller'));
    const act = solveCorner(circuit('active-bridge', { vrms: 6, rOhm: 0.3 }, devices, [[2200e-6, 0.05]], { kind: 'resistance', ohm: 15 }), AT_25C, opts);
    const body = solveCorner(circuit('diode-bridge', { vrms: 6, rOhm: 0.3 }, bridgeDevices(BODY), [[2200e-6, 0.05]], { kind: 'resistance', ohm: 15 }), AT_25C, opts);
    expect(act.rectifierLossW! / body.rectifierLossW!).toBeCloseTo(1, 6);
  });
});
