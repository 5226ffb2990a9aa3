import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import { AT_25C, bridgeDevices, circuit, diode } from './fixtures';
import type { DeviceRole } from '../../server/src/solve/equivalent-circuit';

// Textbook formulas for ideal rectifiers with a resistive load: M. H. Rashid, Power Electronics:
// Circuits, Devices and Applications, 3rd ed., ch. 3 (tabulated in REFERENCES.md §1). Devices are
// near-ideal (a few mV of drop), so every check is to 0.5 %.
const VRMS = 100;
const VM = VRMS * Math.SQRT2;
const R_LOAD = 100;
const opts = { waveformPoints: 0, inrush: false };
const within = (actual: number | undefined, expected: number, rel = 0.005) => {
  expect(actual).toBeDefined();
  expect(Math.abs(actual! / expected - 1)).toBeLessThan(rel);
};

describe('resistive load, near-ideal devices', () => {
  it('full-wave bridge: Vdc = 2Vm/π, Vrms = Vm/√2, diode Iavg = Im/π, Irms = Im/2, PIV = Vm', () => {
    const s = solveCorner(circuit('diode-bridge', { vrms: VRMS }, bridgeDevices(), [], { kind: 'resistance', ohm: R_LOAD }), AT_25C, opts);
    const im = VM / R_LOAD;
    within(s.vOutAvgV, (2 * VM) / Math.PI); // Rashid 3rd ed. ch. 3: Vdc = 2Vm/π
    within(s.vOutRmsV, VM / Math.SQRT2); // Rashid ch. 3: Vrms = Vm/√2
    for (const d of s.devices) {
      within(d.iavgA, im / Math.PI); // REFERENCES §1 (D): diode Iavg = Im/π
      within(d.irmsA, im / 2); // REFERENCES §1 (D): diode Irms = Im/2
      within(d.pivV, VM); // Rashid ch. 3: bridge PIV = Vm
    }
  });

  it('half-wave: Vdc = Vm/π, Vrms = Vm/2, PIV = Vm', () => {
    const s = solveCorner(circuit('half-wave', { vrms: VRMS }, [diode('D1', 'series')], [], { kind: 'resistance', ohm: R_LOAD }), AT_25C, opts);
    within(s.vOutAvgV, VM / Math.PI); // Rashid ch. 3: Vdc = Vm/π
    within(s.vOutRmsV, VM / 2); // Rashid ch. 3: Vrms = Vm/2
    within(s.devices[0]!.pivV, VM); // REFERENCES §1: half-wave resistive PIV = Vm
  });

  it('centre tap: Vdc = 2Vm/π, PIV = 2Vm', () => {
    const s = solveCorner(circuit('centre-tap', { vrms: VRMS }, [diode('D1', 'winding-a'), diode('D2', 'winding-b')], [], { kind: 'resistance', ohm: R_LOAD }), AT_25C, opts);
    within(s.vOutAvgV, (2 * VM) / Math.PI); // Rashid ch. 3
    for (const d of s.devices) within(d.pivV, 2 * VM); // REFERENCES §1 (C): centre-tap PIV = 2Vm
  });

  it('three-phase bridge: Vdc = 1.35·VLL, Vrms = 1.6554·Vm, diode Iavg = Im/π, Irms = 0.5518·Im, PIV = √2·VLL', () => {
    const devs = (['a', 'b', 'c'] as const).flatMap((x) => [diode(`U${x}`, `upper-${x}` as DeviceRole), diode(`L${x}`, `lower-${x}` as DeviceRole)]);
    const s = solveCorner(circuit('three-phase-bridge', { vrms: VRMS }, devs, [], { kind: 'resistance', ohm: R_LOAD }), AT_25C, opts);
    const vll = VRMS * Math.sqrt(3);
    within(s.vOutAvgV, ((3 * Math.SQRT2) / Math.PI) * vll); // CRC Electric Power Eng. Handbook §22.2.5: 3√2/π·VLL = 1.35·VLL
    // Derived: Vrms² = (3/π)∫_{π/3}^{2π/3} (√3Vm sin θ)² dθ = 3Vm²(1/2 + 3√3/(4π)).
    within(s.vOutRmsV, VM * Math.sqrt(3 * (0.5 + (3 * Math.sqrt(3)) / (4 * Math.PI))));
    const im = (Math.sqrt(3) * VM) / R_LOAD;
    // Derived: each diode conducts 120° per period as two 60° caps of the line-line sine:
    // Iavg = Im/π; Irms² = (2/2π)∫_{π/3}^{2π/3} Im² sin²θ dθ = Im²(π/6 + √3/4)/π (0.5518·Im).
    const irms = im * Math.sqrt((Math.PI / 6 + Math.sqrt(3) / 4) / Math.PI);
    for (const d of s.devices) {
      within(d.iavgA, im / Math.PI);
      within(d.irmsA, irms);
      within(d.pivV, Math.SQRT2 * vll); // REFERENCES §1 (D): √3·Vm = √2·VLL
    }
  });
});

describe('PIV of peak-detecting topologies, near-ideal devices', () => {
  // With a large capacitor and a light load the output sits near its peak: REFERENCES §1 (M):
  // half-wave with reservoir 2Vm; doublers 2Vm per diode. Checked to 0.5 % of 2Vm plus the ripple.
  const light = { kind: 'resistance' as const, ohm: 1e6 };
  it('half-wave with reservoir capacitor: PIV = 2Vm', () => {
    const s = solveCorner(circuit('half-wave', { vrms: VRMS }, [diode('D1', 'series')], [[1e-3, 0]], light), AT_25C, opts);
    within(s.devices[0]!.pivV, 2 * VM);
  });
  for (const variant of ['full-wave', 'half-wave'] as const) {
    it(`${variant} doubler: output ≈ 2Vm, PIV = 2Vm per diode`, () => {
      const s = solveCorner(circuit('doubler', { vrms: VRMS }, [diode('D1', 'd1'), diode('D2', 'd2')], [[1e-3, 0], [1e-3, 0]], light, variant), AT_25C, opts);
      within(s.vOutAvgV, 2 * VM);
      for (const d of s.devices) within(d.pivV, 2 * VM);
    });
  }
});
