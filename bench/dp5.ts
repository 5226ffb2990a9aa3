/**
 * A plain Dormand–Prince 5(4) integrator with step-size control and the fourth-order continuous
 * extension (J. R. Dormand & P. J. Prince, "A family of embedded Runge–Kutta formulae", J. Comput.
 * Appl. Math. 6 (1980); dense output and controller as in E. Hairer, S. P. Nørsett & G. Wanner,
 * Solving Ordinary Differential Equations I, 2nd ed., §II.4–II.6). A bench-side reference only —
 * the general-purpose integrator our solver is measured against; nothing in the product uses it.
 */
export type Rhs = (t: number, y: number[]) => number[];

export interface Dp5Options {
  rtol: number;
  /** Absolute tolerance per state. */
  atol: readonly number[];
  /** Largest step: short enough that a conduction pulse cannot be stepped over. */
  hMax: number;
  maxSteps?: number;
}

/** Called once per accepted step with the dense output on [tOld, t]. */
export type StepSink = (tOld: number, t: number, dense: (c: number, at: number) => number) => void;

const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const A71 = 35 / 384, A73 = 500 / 1113, A74 = 125 / 192, A75 = -2187 / 6784, A76 = 11 / 84;
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;
const D1 = -12715105075 / 11282082432, D3 = 87487479700 / 32700410799, D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632, D6 = -1453857185 / 822651844, D7 = 69997945 / 29380423;

/** Integrates y' = f(t, y) from t0 to t1; returns the state at t1 and the work done. */
export function dp5(f: Rhs, t0: number, y0: readonly number[], t1: number, o: Dp5Options, sink?: StepSink): { y: number[]; steps: number; rejected: number; ok: boolean } {
  const n = y0.length;
  let t = t0;
  let y = y0.slice();
  let k1 = f(t, y);
  let h = Math.min(o.hMax, (t1 - t0) / 100);
  let steps = 0;
  let rejected = 0;
  const maxSteps = o.maxSteps ?? 1e6;
  const tmp = new Array<number>(n);
  const stage = (a: (j: number) => number, tt: number) => { for (let j = 0; j < n; j++) tmp[j] = a(j); return f(tt, tmp); };
  while (t < t1 && steps + rejected < maxSteps) {
    if (t + h > t1) h = t1 - t;
    const k2 = stage((j) => y[j]! + h * A21 * k1[j]!, t + C2 * h);
    const k3 = stage((j) => y[j]! + h * (A31 * k1[j]! + A32 * k2[j]!), t + C3 * h);
    const k4 = stage((j) => y[j]! + h * (A41 * k1[j]! + A42 * k2[j]! + A43 * k3[j]!), t + C4 * h);
    const k5 = stage((j) => y[j]! + h * (A51 * k1[j]! + A52 * k2[j]! + A53 * k3[j]! + A54 * k4[j]!), t + C5 * h);
    const k6 = stage((j) => y[j]! + h * (A61 * k1[j]! + A62 * k2[j]! + A63 * k3[j]! + A64 * k4[j]! + A65 * k5[j]!), t + h);
    const yNew = new Array<number>(n);
    for (let j = 0; j < n; j++) yNew[j] = y[j]! + h * (A71 * k1[j]! + A73 * k3[j]! + A74 * k4[j]! + A75 * k5[j]! + A76 * k6[j]!);
    const k7 = f(t + h, yNew);
    let err = 0;
    for (let j = 0; j < n; j++) {
      const e = h * (E1 * k1[j]! + E3 * k3[j]! + E4 * k4[j]! + E5 * k5[j]! + E6 * k6[j]! + E7 * k7[j]!);
      const sc = o.atol[j]! + o.rtol * Math.max(Math.abs(y[j]!), Math.abs(yNew[j]!));
      err += (e / sc) ** 2;
    }
    err = Math.sqrt(err / n);
    if (err <= 1 || h <= 1e-14 * Math.max(1, Math.abs(t))) {
      if (sink) {
        const yOld = y, hh = h, tOld = t;
        const r2 = yNew.map((v, j) => v - yOld[j]!);
        const r3 = r2.map((v, j) => hh * k1[j]! - v);
        const r4 = r2.map((v, j) => v - hh * k7[j]! - r3[j]!);
        const r5 = r2.map((_, j) => hh * (D1 * k1[j]! + D3 * k3[j]! + D4 * k4[j]! + D5 * k5[j]! + D6 * k6[j]! + D7 * k7[j]!));
        sink(tOld, t + h, (c, at) => {
          const th = (at - tOld) / hh;
          const th1 = 1 - th;
          return yOld[c]! + th * (r2[c]! + th1 * (r3[c]! + th * (r4[c]! + th1 * r5[c]!)));
        });
      }
      t += h;
      y = yNew;
      k1 = k7;
      steps++;
    } else rejected++;
    const fac = err === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * Math.pow(err, -0.2)));
    h = Math.min(o.hMax, h * (err <= 1 ? fac : Math.min(1, fac)));
  }
  return { y, steps, rejected, ok: t >= t1 };
}
