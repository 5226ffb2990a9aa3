/**
 * A full-wave bridge with identical diodes is symmetric in its two half-cycles (half-wave
 * symmetry, i(t + T/2) = −i(t) on the mains side: a textbook property of any full-wave
 * rectifier with matched devices), so both diode pairs carry the same current and the line
 * current has no even harmonics. The thermal loop re-solves from the previous orbit (a warm
 * start); an orbit accepted before it is periodic breaks that symmetry. Property test over random
 * circuits: pairs equal to 0.01 %, every even harmonic below 0.01 % of the fundamental.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveRectifier } from '../../server/src/solve/index';
import { bridgeDevices, circuit } from './fixtures';

const arbitraryBridge = fc.record({
  vrms: fc.double({ min: 12, max: 240, noNaN: true }),
  rOhm: fc.double({ min: 0.2, max: 10, noNaN: true }),
  cF: fc.double({ min: 47e-6, max: 2200e-6, noNaN: true }),
  loadOhm: fc.double({ min: 20, max: 2000, noNaN: true }),
  isA: fc.double({ min: 1e-10, max: 1e-7, noNaN: true }),
  n: fc.double({ min: 1.2, max: 2, noNaN: true }),
  rthja: fc.double({ min: 30, max: 90, noNaN: true }),
});

describe('a warm-started, thermally coupled bridge', () => {
  it('keeps both diode pairs equal and the line current free of even harmonics', () => {
    fc.assert(fc.property(arbitraryBridge, (b) => {
      const devices = bridgeDevices({ isA: b.isA, n: b.n, rsOhm: 0.02, egEv: 1.11, xti: 3, tnomC: 27 }, b.rthja);
      const c = circuit('diode-bridge', { vrms: b.vrms, rOhm: b.rOhm }, devices, [[b.cF, 0.05]], { kind: 'resistance', ohm: b.loadOhm });
      const solution = solveRectifier(c, [{ name: 'hot', lineScale: 1.1, ambientC: 50 }], { waveformPoints: 0 });
      const corner = solution.corners[0]!;
      // A warm start needs the thermal loop to have run (a runaway stops it: a property of its own).
      fc.pre(corner.thermalIterations > 0 && corner.devices.every((d) => !d.thermalRunaway));
      expect(corner.converged).toBe(true);
      const byName = new Map(corner.devices.map((d) => [d.name, d]));
      // D1 (upper-a) with D4 (lower-b) in one half-cycle, D3 (upper-b) with D2 (lower-a) in the other.
      const a = byName.get('D1')!.iavgA!;
      const bb = byName.get('D3')!.iavgA!;
      expect(Math.abs(a - bb) / Math.max(a, bb)).toBeLessThan(1e-4);
      const h = corner.harmonicsA!;
      for (let k = 1; k < h.length; k += 2) expect(h[k]! / h[0]!).toBeLessThan(1e-4);
    }), { numRuns: 40, seed: 1402, examples: [[{ vrms: 12, rOhm: 0.2, cF: 0.0019360967261269, loadOhm: 210.26752573787223, isA: 1.0000000000000017e-10, n: 1.2, rthja: 30 }]] });
  });
});
