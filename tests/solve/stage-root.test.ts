/**
 * One implicit stage of a conducting bridge (solve/stage.ts) against the root of its loop equation
 * found here by bisection. A stage solves y − dh·f(y) = r; for one capacitor C behind no ESR, a
 * load R and a diode pair behind Rs, the port voltage is u = (r + (dh/C)·i)/(1 + dh/(C·R)), and
 * Kirchhoff's voltage law round the loop gives the pair's current i from
 * |e(t)| = Rs·i + 2·(N·Vt·ln(1 + i/IS) + RS·i) + u(i) (the SPICE diode law, TNOM = the test's
 * 25 °C so IS stands); into a constant power P instead, u + (dh/C)·P/u = r + (dh/C)·i. Property
 * test over random bridges and stage inputs: the stage's current within the precision its Newton
 * iteration stops at (1e-11 in ψ = ln(1 + i/IS)) of the bisected root.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../server/src/solve/network';
import { StageOut, StageSolver } from '../../server/src/solve/stage';
import { thermalVoltageV } from '../../server/src/solve/diode-model';
import { bisect, bridgeDevices, circuit } from './fixtures';

const arbitraryStage = fc.record({
  vrms: fc.double({ min: 12, max: 240, noNaN: true }),
  rOhm: fc.double({ min: 0.05, max: 20, noNaN: true }),
  cF: fc.double({ min: 10e-6, max: 4700e-6, noNaN: true }),
  loadOhm: fc.double({ min: 10, max: 5000, noNaN: true }),
  /** A constant-power load instead of the resistance, in watts (0: the resistance). */
  loadW: fc.oneof(fc.constant(0), fc.double({ min: 0.1, max: 500, noNaN: true })),
  isA: fc.double({ min: 1e-14, max: 1e-6, noNaN: true }),
  n: fc.double({ min: 1, max: 2.2, noNaN: true }),
  rsOhm: fc.double({ min: 0, max: 0.2, noNaN: true }),
  /** The stage's instant as a phase of the line, near its positive crest where the pair conducts. */
  phase: fc.double({ min: 0.3, max: 0.7, noNaN: true }),
  /** The capacitor voltage the stage starts from, as a fraction of the EMF there. */
  below: fc.double({ min: 0.5, max: 0.999, noNaN: true }),
  /** The stage coefficient as a fraction of the period. */
  dhFraction: fc.double({ min: 1e-7, max: 1e-2, noNaN: true }),
});

describe('one implicit stage of a conducting bridge', () => {
  it('finds the current of its loop equation to its own precision', () => {
    fc.assert(fc.property(arbitraryStage, (s) => {
      const params = { isA: s.isA, n: s.n, rsOhm: s.rsOhm, egEv: 1.11, xti: 3, tnomC: 25 };
      const load = s.loadW > 0 ? { kind: 'power' as const, w: s.loadW } : { kind: 'resistance' as const, ohm: s.loadOhm };
      const c = circuit('diode-bridge', { vrms: s.vrms, rOhm: s.rOhm }, bridgeDevices(params), [[s.cF, 0]], load);
      const net = buildNetwork(c, 1, [25, 25, 25, 25], [])!;
      const T = 1 / 50;
      const t = s.phase * (T / 2);
      const dh = s.dhFraction * T;
      const emf = s.vrms * Math.SQRT2 * Math.abs(Math.sin(2 * Math.PI * 50 * t));
      const r = s.below * emf;
      const out = new StageOut(net.n, net.ports.length);
      new StageSolver(net).solve(t, dh, [r], -1, out);
      const nVt = s.n * thermalVoltageV(25);
      const k = dh / s.cF;
      // Into a power P: u + k·P/u = r + k·i, whose larger root is the operating point.
      const port = (i: number) => (s.loadW > 0 ? 0.5 * (r + k * i + Math.sqrt((r + k * i) ** 2 - 4 * k * s.loadW)) : (r + k * i) / (1 + k / s.loadOhm));
      const loop = (i: number) => emf - s.rOhm * i - 2 * (nVt * Math.log1p(i / s.isA) + s.rsOhm * i) - port(i);
      // The loop's drive is positive at i = 0 and the current cannot exceed emf/Rs.
      fc.pre(loop(0) > 0);
      const exact = bisect(loop, 0, emf / Math.max(s.rOhm, 1e-9), 400);
      fc.pre(exact > 1e-9);
      // Above the floor where the model fades a power load out (network.ts), and a real root.
      fc.pre(s.loadW === 0 || (r ** 2 > 4 * k * s.loadW && port(0) > net.load.vFloorV));
      expect(out.mode).toBeGreaterThanOrEqual(0);
      // Newton stops at 1e-11 relative in ψ = ln(1 + i/IS), which is ψ·1e-11 relative in i.
      expect(Math.abs(out.iA / exact - 1)).toBeLessThan(2e-11 * Math.log1p(exact / s.isA));
    }), { numRuns: 300 });
  });
});
