/**
 * The step-free advance between conduction intervals (solve/off-advance.ts) against the closed
 * forms of a capacitor discharging into its load, derived here: into a resistance R through an
 * ESR r, v(t) = v0·e^(−t/((R + r)·C)); into a constant power P with no ESR, C·v·dv/dt = −P, so
 * v² falls linearly, v(t)² = v0² − 2·P·t/C. The period Jacobian it carries is checked against a
 * central difference of the advance itself, and the turn-on it stops at against the instant the
 * bridge's EMF |e| = Vm·|sin ωt| climbs back to the capacitor voltage (bisection, ideal diodes).
 */
import { describe, expect, it } from 'vitest';
import { buildNetwork, type Network } from '../../server/src/solve/network';
import { StageSolver } from '../../server/src/solve/stage';
import { OffAdvance } from '../../server/src/solve/off-advance';
import type { Load } from '../../server/src/solve/equivalent-circuit';
import { bisect, bridgeDevices, circuit, diode, IDEAL_DIODE } from './fixtures';

const VM = 230 * Math.SQRT2;
const W = 2 * Math.PI * 50;
const T = 1 / 50;

function bridge(load: Load, esrOhm: number): Network {
  return buildNetwork(circuit('diode-bridge', { vrms: 230, rOhm: 1 }, bridgeDevices(IDEAL_DIODE), [[100e-6, esrOhm]], load), 1, [25, 25, 25, 25], [])!;
}

/** Advances from t0 (default the crest, T/4) with the capacitor at v0, above the line so that nothing conducts, to tEnd. */
function advance(net: Network, v0: number, tEnd: number, t0 = T / 4) {
  const off = new OffAdvance(net, new StageSolver(net));
  const y = [v0];
  const Y = [1];
  const end = off.advance(t0, tEnd, y, Y, undefined, T * 1e-9);
  return { v: y[0]!, dvdv0: Y[0]!, ...end };
}

describe('the advance while no path conducts', () => {
  it('decays exactly exponentially into a resistance behind an ESR', () => {
    const net = bridge({ kind: 'resistance', ohm: 1000 }, 0.5);
    const dt = 0.3 * T;
    const r = advance(net, 1.02 * VM, T / 4 + dt);
    expect(r.turnedOn).toBe(false);
    const exact = 1.02 * VM * Math.exp(-dt / ((1000 + 0.5) * 100e-6)); // derived in the header
    expect(Math.abs(r.v / exact - 1)).toBeLessThan(1e-12);
    expect(Math.abs(r.dvdv0 - Math.exp(-dt / ((1000 + 0.5) * 100e-6)))).toBeLessThan(1e-12);
  });

  it('lets v² fall linearly into a constant power', () => {
    const net = bridge({ kind: 'power', w: 100 }, 0);
    const dt = 0.3 * T;
    const v0 = 1.02 * VM;
    const r = advance(net, v0, T / 4 + dt);
    expect(r.turnedOn).toBe(false);
    const exact = Math.sqrt(v0 ** 2 - (2 * 100 * dt) / 100e-6); // derived in the header
    expect(Math.abs(r.v / exact - 1)).toBeLessThan(1e-9);
    // Central difference of the advance itself: the carried Jacobian is its derivative.
    const h = 1e-3;
    const fd = (advance(net, v0 + h, T / 4 + dt).v - advance(net, v0 - h, T / 4 + dt).v) / (2 * h);
    expect(Math.abs(r.dvdv0 / fd - 1)).toBeLessThan(1e-6);
  });

  it('stops just past the instant the rectified line climbs back to the capacitor voltage', () => {
    const rl = 1000;
    const net = bridge({ kind: 'resistance', ohm: rl }, 0);
    // From 0.3·T, past the crest, where |e| = 0.951·Vm is below the capacitor.
    const v0 = 0.99 * VM;
    const r = advance(net, v0, 1.3 * T, 0.3 * T);
    expect(r.turnedOn).toBe(true);
    // Drive of an ideal-diode bridge: |e(t)| − v(t), v the exponential discharge from 0.3·T.
    const v = (t: number) => v0 * Math.exp(-(t - 0.3 * T) / (rl * 100e-6));
    const tOn = bisect((t) => Math.abs(VM * Math.sin(W * t)) - v(t), T / 2 + 1e-9, 3 * T / 4);
    expect(r.t).toBeGreaterThanOrEqual(tOn - 1e-9 * T);
    expect(r.t - tOn).toBeLessThan(2e-9 * T);
  });

  it('follows a stiff current load onto its floor with bounded work, never below zero', () => {
    // A 1 A current load on 100 nF (a fuzzed circuit once spun here for minutes): above the floor
    // vF = 5 % of the peak, C·dv/dt = −I, so v reaches vF after t1 = (v0 − vF)·C/I; below it the
    // load fades linearly, g = I·v/vF, so v = vF·e^(−(t − t1)/τ) with τ = C·vF/I (derived here).
    // The interval lies in the negative half-cycle of a half-wave rectifier: nothing conducts.
    const net = buildNetwork(circuit('half-wave', { vrms: 230 }, [diode('D1', 'series')], [[100e-9, 0]], { kind: 'current', a: 1 }), 1, [25], [])!;
    const solver = new StageSolver(net);
    let loads = 0;
    const loadAt = solver.loadAt.bind(solver);
    solver.loadAt = (v: number, r: number) => { loads++; return loadAt(v, r); };
    const off = new OffAdvance(net, solver);
    const vF = 0.05 * VM;
    const v0 = 0.2 * VM;
    const tau = (100e-9 * vF) / 1;
    const t0 = 0.55 * T;
    const t1 = ((v0 - vF) * 100e-9) / 1;
    for (const dt of [t1 + 20 * tau, 0.4 * T]) {
      loads = 0;
      const y = [v0];
      const end = off.advance(t0, t0 + dt, y, undefined, undefined, T * 1e-9);
      expect(end.turnedOn).toBe(false);
      const exact = vF * Math.exp(-(dt - t1) / tau);
      expect(y[0]!).toBeGreaterThanOrEqual(0);
      // Backward Euler is stable but not exact this far past the floor: within 1e-5 of the peak.
      expect(Math.abs(y[0]! - exact)).toBeLessThan(1e-5 * VM);
      // Counted work, not time: the bounded path takes under a thousand load evaluations here, the
      // unbounded Runge–Kutta path took 50,013 (measured) and millions on the fuzzed circuit.
      expect(loads).toBeLessThan(5_000);
    }
  });
});

