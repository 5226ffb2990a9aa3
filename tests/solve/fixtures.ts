/**
 * Circuit builders and independent reference solutions for the solver tests. Nothing here
 * imports the solver's numerics: references are derived from first principles below.
 */
import type { DeviceRole, DiodeParams, EquivalentCircuit, Load, RectifierDevice } from '../../server/src/solve/equivalent-circuit';

/**
 * A near-ideal diode: N = 0.001 makes N·Vt ≈ 26 µV, so the drop is a few mV at amperes.
 * TNOM equals the test temperature so the SPICE temperature law leaves IS alone.
 */
export const IDEAL_DIODE: DiodeParams = { isA: 1e-12, n: 0.001, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };

export const AT_25C = { name: 'test', lineScale: 1, ambientC: 25 };

export function diode(name: string, role: DeviceRole, params: DiodeParams = IDEAL_DIODE, rthjaKPerW?: number): RectifierDevice {
  return { kind: 'diode', name, role, params, rthjaKPerW };
}

export function bridgeDevices(params: DiodeParams = IDEAL_DIODE, rth?: number): RectifierDevice[] {
  return (['upper-a', 'lower-a', 'upper-b', 'lower-b'] as const).map((r, k) => diode(`D${k + 1}`, r, params, rth));
}

export interface SourceSpec {
  vrms: number;
  freqHz?: number;
  rOhm?: number;
  lH?: number;
}

export function circuit(kind: EquivalentCircuit['kind'], src: SourceSpec, devices: RectifierDevice[], caps: [number, number][], load: Load, doubler?: 'full-wave' | 'half-wave'): EquivalentCircuit {
  return {
    kind, doubler, devices, load,
    source: { vrms: src.vrms, freqHz: src.freqHz ?? 50, seriesROhm: src.rOhm ?? 0, seriesLH: src.lH ?? 0, mainsVrms: 230, turnsRatio: 1 },
    capacitors: caps.map(([cF, esrOhm], k) => ({ name: `C${k + 1}`, cF, esrOhm })),
  };
}

/** Brent-free bisection on a bracketing interval (enough for the references). */
export function bisect(f: (x: number) => number, lo: number, hi: number, iterations = 200): number {
  let flo = f(lo);
  for (let k = 0; k < iterations; k++) {
    const mid = 0.5 * (lo + hi);
    const fm = f(mid);
    if ((fm > 0) === (flo > 0)) { lo = mid; flo = fm; } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Composite Simpson rule on [a, b] with an even number of panels. */
export function simpson(f: (x: number) => number, a: number, b: number, panels = 4000): number {
  const h = (b - a) / panels;
  let s = f(a) + f(b);
  for (let k = 1; k < panels; k++) s += (k % 2 ? 4 : 2) * f(a + k * h);
  return (s * h) / 3;
}

/**
 * Exact steady state of an ideal full-wave bridge (Rs = 0, ideal diodes) feeding C ∥ R,
 * derived here. With θ = ωt: while a diode pair conducts the capacitor follows the source,
 * v = Vm·sin θ, and the rectifier current is i = ωC·Vm·cos θ + Vm·sin θ/R. The diodes stop
 * when i reaches zero: tan θoff = −ωRC, θoff = π − arctan(ωRC). Then the capacitor discharges,
 * v = Vm·sin θoff·e^(−(θ − θoff)/ωRC), until it meets the next half-wave |Vm·sin θ| at
 * θon + π, found by bisection. Averages follow by quadrature over one half-period.
 */
export function exactIdealBridge(vm: number, fHz: number, rOhm: number, cF: number) {
  const w = 2 * Math.PI * fHz;
  const wrc = w * rOhm * cF;
  const thOff = Math.PI - Math.atan(wrc);
  const vOff = vm * Math.sin(thOff);
  const discharge = (th: number) => vOff * Math.exp(-(th - thOff) / wrc);
  // Next conduction starts in (π, π + π/2) where |sin| rises to meet the discharge curve.
  const thOnPlusPi = bisect((th) => vm * Math.abs(Math.sin(th)) - discharge(th), Math.PI, Math.PI + Math.PI / 2);
  const thOn = thOnPlusPi - Math.PI;
  const v = (th: number) => (th >= thOn && th <= thOff ? vm * Math.sin(th) : discharge(th < thOn ? th + Math.PI : th));
  const iRect = (th: number) => (th >= thOn && th <= thOff ? w * cF * vm * Math.cos(th) + (vm * Math.sin(th)) / rOhm : 0);
  const avgHalf = (f: (th: number) => number) =>
    (simpson(f, thOn, thOff) + simpson(f, thOff, thOnPlusPi)) / Math.PI;
  const vDc = avgHalf(v);
  const iRectRms = Math.sqrt(avgHalf((th) => iRect(th) ** 2));
  const iCapRms = Math.sqrt(avgHalf((th) => (iRect(th) - v(th) / rOhm) ** 2));
  const pOut = avgHalf((th) => v(th) ** 2 / rOhm);
  const vmin = vm * Math.sin(thOn);
  return {
    thOn, thOff, vmin, rippleVpp: vm - vmin, vDc, ipk: iRect(thOn),
    diodeIavg: vDc / rOhm / 2,
    // Each diode carries the rectifier current in one half-period of two.
    diodeIrms: iRectRms / Math.SQRT2,
    capIrms: iCapRms,
    sourceIrms: iRectRms,
    powerFactor: pOut / ((vm / Math.SQRT2) * iRectRms),
    /** RMS of harmonic n of the source current (odd n; the source current is ±iRect). */
    harmonic: (n: number) => {
      // Source current over a full period is iRect(θ) on the first half and −iRect(θ − π) on the
      // second; for odd n both halves add, so |c_n| = (2/π)·|∫ iRect(θ)·e^(−jnθ) dθ| over one half.
      const re = simpson((th) => iRect(th) * Math.cos(n * th), thOn, thOff);
      const im = simpson((th) => iRect(th) * Math.sin(n * th), thOn, thOff);
      return ((2 / Math.PI) * Math.hypot(re, im)) / Math.SQRT2;
    },
  };
}
