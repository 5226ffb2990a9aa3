/**
 * The switch-on half-cycle (solve/inrush.ts) against the registry library `odex` (Hairer & Wanner's
 * ODEX) on the same equations: a bridge of SPICE-law diodes (RS = 0) closing at the crest onto an
 * empty capacitor through a source resistance. While a pair conducts the state is the capacitor
 * voltage alone and the current an algebraic function of it, a smooth ODE fit for ODEX. What a surge
 * rating is compared with, the peak and ∫i²dt of the half-cycle, must agree within 0.1 %.
 */
import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../server/src/solve/network';
import { simulateInrush } from '../../server/src/solve/inrush';
import { bridgeDevices, circuit } from './fixtures';
import { SPICE_DIODE, bridgeCurrentA } from './spice-diode-reference';
import { loadOdex } from './odex-loader';

interface Case { label: string; vrms: number; f: number; rs: number; c: number; rl: number }

const CASES: Case[] = [
  { label: '230 V 50 Hz, 1 Ω into 470 µF, 200 Ω load', vrms: 230, f: 50, rs: 1, c: 470e-6, rl: 200 },
  { label: '120 V 60 Hz, 4.7 Ω into 100 µF, 2 kΩ load', vrms: 120, f: 60, rs: 4.7, c: 100e-6, rl: 2000 },
  { label: '24 V 50 Hz, 0.2 Ω into 4.7 mF, 20 Ω load', vrms: 24, f: 50, rs: 0.2, c: 4.7e-3, rl: 20 },
];

describe('switch-on inrush against odex', () => {
  for (const k of CASES) {
    it(k.label, async () => {
      const Solver = await loadOdex();
      const w = 2 * Math.PI * k.f;
      const vm = k.vrms * Math.SQRT2;
      const T = 1 / k.f;
      const current = (t: number, v: number) => bridgeCurrentA(Math.abs(vm * Math.sin(w * t)), v, k.rs);
      const solver = new Solver(1);
      solver.absoluteTolerance = 1e-10 * vm;
      solver.relativeTolerance = 1e-10;
      solver.maxSteps = 1e6;
      solver.denseOutput = true;
      // The crest of e = Vm·sin ωt is at T/4; the half-cycle after it, sampled every T/200000.
      let peak = 0, i2t = 0, last: number | undefined;
      const dt = T / 200000;
      solver.solve((t, y) => [(current(t, y[0]!) - y[0]! / k.rl) / k.c], T / 4, [0], (3 * T) / 4, solver.grid(dt, (t, y) => {
        // D1 (with D4) conducts while e > 0; past T/2 the other pair takes the current.
        const i = Math.sin(w * t) > 0 ? current(t, y[0]!) : 0;
        peak = Math.max(peak, i);
        if (last !== undefined) i2t += 0.5 * (last * last + i * i) * dt; // trapezoid on a fine grid
        last = i;
      }));
      const net = buildNetwork(circuit('diode-bridge', { vrms: k.vrms, freqHz: k.f, rOhm: k.rs }, bridgeDevices(SPICE_DIODE), [[k.c, 0]], { kind: 'resistance', ohm: k.rl }), 1, [25, 25, 25, 25], [])!;
      const ours = simulateInrush(net, 1e-5, 'positive');
      expect(ours.ok).toBe(true);
      expect(Math.abs(ours.peakA / peak - 1)).toBeLessThan(1e-3);
      expect(Math.abs(ours.i2tA2s[0]! / i2t - 1)).toBeLessThan(1e-3);
      // D4 conducts with D1 and carries the same current.
      expect(Math.abs(ours.i2tA2s[3]! / i2t - 1)).toBeLessThan(1e-3);
    });
  }
});
