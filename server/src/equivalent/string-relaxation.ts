/**
 * How the voltage of a series capacitor string divides over time after it is charged: stage k
 * (capacitance Cₖ with conductance Gₖ across it, balancing resistors plus any modelled leakage)
 * carries the same current as its neighbours, so at switch-on, before any resistor has passed
 * charge, the stages hold equal charge and divide as 1/Cₖ (the capacitive share); at steady state
 * the resistors divide it as 1/Gₖ (the resistive share). In between, the internal node voltages u
 * obey Kc·u̇ + Kg·u = b (KCL at each internal node; Kc, Kg the stage capacitances and conductances
 * assembled as a tridiagonal Laplacian), whose modes are those of the symmetric pencil (Kc, Kg):
 * vₖ(t) = vₖ(∞) + Σⱼ Bₖⱼ·e^(−λⱼt), all λⱼ > 0. With two stages this runs monotonically from one
 * share to the other; with three or more a stage can overshoot both (a fast neighbour drains
 * onto it), so the largest share over time is taken from the modes, not the two ends.
 *
 * For a string charged from empty by any rising voltage, each stage's voltage is the convolution
 * of this step response with the rise, so its largest step-response share times the highest string
 * voltage bounds it (exact for a charge fast against the slowest time constant).
 */

export interface StringRelaxation {
  /** Share of each stage at switch-on: (1/Cₖ)/Σ(1/Cⱼ). */
  initial: number[];
  /** Share of each stage at steady state: (1/Gₖ)/Σ(1/Gⱼ). */
  final: number[];
  /** Each stage's largest share over time, switch-on to steady state. */
  peak: number[];
  /** The slowest time constant of the string's relaxation, s (1/λ_min; 0 for one stage). */
  slowestTauS: number;
}

/** Samples per decade of time when the largest share is searched (then refined by golden section). */
const SAMPLES_PER_DECADE = 24;
/** At most this many samples, however far apart the time constants are. */
const MAX_SAMPLES = 1200;

/** The relaxation of a string of stages with capacitances `cF` and conductances `gS` (all > 0). */
export function relaxString(cF: readonly number[], gS: readonly number[]): StringRelaxation {
  const n = cF.length;
  const initial = shares(cF.map((c) => 1 / c));
  const final = shares(gS.map((g) => 1 / g));
  if (n < 2) return { initial, final, peak: [...initial], slowestTauS: 0 };
  const m = n - 1;
  // Internal node j (1 … n−1) sits between stage j−1 (towards node 0, held at 1) and stage j (towards node n, held at 0).
  const laplacian = (x: readonly number[]) => matrix(m, (i, k) => (i === k ? x[i]! + x[i + 1]! : Math.abs(i - k) === 1 ? -x[Math.max(i, k)]! : 0));
  const kc = laplacian(cF);
  const kg = laplacian(gS);
  const u0 = solveLinear(kc, unitAtTop(m, cF[0]!));
  const uInf = solveLinear(kg, unitAtTop(m, gS[0]!));
  const l = cholesky(kc);
  // A = L⁻¹·Kg·L⁻ᵀ, symmetric; its eigenpairs are the pencil's modes in w = Lᵀu.
  const linvKg = kg.map((_, col) => forward(l, kg.map((row) => row[col]!)));
  const a = matrix(m, (i, k) => forward(l, linvKg.map((col) => col[i]!))[k]!);
  const { values, vectors } = jacobiEigen(a);
  const d = u0.map((v, i) => v - uInf[i]!);
  const lt = (x: readonly number[]) => x.map((_, i) => x.reduce((s, xk, k) => s + l[k]![i]! * xk, 0));
  const wd = lt(d);
  // Mode j in node voltages: L⁻ᵀ·qⱼ, weighted by αⱼ = qⱼ·(Lᵀd).
  const modes = values.map((lambda, j) => {
    const q = vectors.map((row) => row[j]!);
    const alpha = q.reduce((s, qi, i) => s + qi * wd[i]!, 0);
    return { lambda, shape: backward(l, q).map((x) => x * alpha) };
  });
  const stageAt = (k: number, t: number) => {
    const node = (j: number) => (j === 0 ? 1 : j === n ? 0 : uInf[j - 1]! + modes.reduce((s, mo) => s + mo.shape[j - 1]! * Math.exp(-mo.lambda * t), 0));
    return node(k) - node(k + 1);
  };
  const lambdas = values.filter((v) => v > 0);
  const [lmin, lmax] = [Math.min(...lambdas), Math.max(...lambdas)];
  const peak = cF.map((_, k) => Math.max(initial[k]!, final[k]!, largestOverTime((t) => stageAt(k, t), 1e-3 / lmax, 40 / lmin)));
  return { initial, final, peak, slowestTauS: 1 / lmin };
}

function shares(x: readonly number[]): number[] {
  const total = x.reduce((s, v) => s + v, 0);
  return x.map((v) => v / total);
}

function unitAtTop(m: number, value: number): number[] {
  return Array.from({ length: m }, (_, i) => (i === 0 ? value : 0));
}

function matrix(m: number, at: (i: number, k: number) => number): number[][] {
  return Array.from({ length: m }, (_, i) => Array.from({ length: m }, (_, k) => at(i, k)));
}

/** The largest value of a smooth f on [t0, t1], sampled on a log grid and refined by golden section. */
function largestOverTime(f: (t: number) => number, t0: number, t1: number): number {
  const count = Math.min(MAX_SAMPLES, Math.max(8, Math.ceil(Math.log10(t1 / t0) * SAMPLES_PER_DECADE)));
  const ts = Array.from({ length: count + 1 }, (_, i) => t0 * (t1 / t0) ** (i / count));
  const fs = ts.map(f);
  let best = 0;
  for (let i = 1; i < fs.length; i++) if (fs[i]! > fs[best]!) best = i;
  let [lo, hi] = [Math.log(ts[Math.max(0, best - 1)]!), Math.log(ts[Math.min(count, best + 1)]!)];
  const g = (x: number) => f(Math.exp(x));
  const phi = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 60; it++) {
    const [x1, x2] = [hi - phi * (hi - lo), lo + phi * (hi - lo)];
    if (g(x1) > g(x2)) hi = x2;
    else lo = x1;
  }
  return Math.max(fs[best]!, g((lo + hi) / 2));
}

/** Solves a small dense system by Gaussian elimination with partial pivoting. */
function solveLinear(a0: readonly (readonly number[])[], b0: readonly number[]): number[] {
  const m = b0.length;
  const a = a0.map((row, i) => [...row, b0[i]!]);
  for (let c = 0; c < m; c++) {
    let p = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    [a[c], a[p]] = [a[p]!, a[c]!];
    for (let r = c + 1; r < m; r++) {
      const f = a[r]![c]! / a[c]![c]!;
      for (let k = c; k <= m; k++) a[r]![k]! -= f * a[c]![k]!;
    }
  }
  const x = new Array<number>(m).fill(0);
  for (let r = m - 1; r >= 0; r--) x[r] = (a[r]![m]! - a[r]!.slice(r + 1, m).reduce((s, v, k) => s + v * x[r + 1 + k]!, 0)) / a[r]![r]!;
  return x;
}

/** Lower-triangular L with L·Lᵀ = a (a symmetric positive definite). */
function cholesky(a: readonly (readonly number[])[]): number[][] {
  const m = a.length;
  const l = matrix(m, () => 0);
  for (let i = 0; i < m; i++) {
    for (let k = 0; k <= i; k++) {
      const s = a[i]![k]! - l[i]!.slice(0, k).reduce((acc, v, j) => acc + v * l[k]![j]!, 0);
      l[i]![k] = i === k ? Math.sqrt(s) : s / l[k]![k]!;
    }
  }
  return l;
}

/** L⁻¹·b by forward substitution. */
function forward(l: readonly (readonly number[])[], b: readonly number[]): number[] {
  const x: number[] = [];
  for (let i = 0; i < b.length; i++) x.push((b[i]! - x.reduce((s, v, k) => s + l[i]![k]! * v, 0)) / l[i]![i]!);
  return x;
}

/** L⁻ᵀ·b by backward substitution. */
function backward(l: readonly (readonly number[])[], b: readonly number[]): number[] {
  const m = b.length;
  const x = new Array<number>(m).fill(0);
  for (let i = m - 1; i >= 0; i--) {
    let s = b[i]!;
    for (let k = i + 1; k < m; k++) s -= l[k]![i]! * x[k]!;
    x[i] = s / l[i]![i]!;
  }
  return x;
}

/** Eigenvalues and eigenvectors (columns) of a small symmetric matrix by cyclic Jacobi rotations. */
function jacobiEigen(a0: readonly (readonly number[])[]): { values: number[]; vectors: number[][] } {
  const m = a0.length;
  const a = a0.map((row) => [...row]);
  const v = matrix(m, (i, k) => (i === k ? 1 : 0));
  const scale = Math.max(...a.map((row, i) => Math.abs(row[i]!)));
  for (let sweep = 0; sweep < 60; sweep++) {
    let off = 0;
    for (let p = 0; p < m; p++) for (let q = p + 1; q < m; q++) off += a[p]![q]! ** 2;
    if (Math.sqrt(off) <= 1e-15 * scale) break;
    for (let p = 0; p < m; p++) {
      for (let q = p + 1; q < m; q++) {
        if (a[p]![q] === 0) continue;
        const theta = (a[q]![q]! - a[p]![p]!) / (2 * a[p]![q]!);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < m; k++) {
          const [akp, akq] = [a[k]![p]!, a[k]![q]!];
          a[k]![p] = c * akp - s * akq;
          a[k]![q] = s * akp + c * akq;
        }
        for (let k = 0; k < m; k++) {
          const [apk, aqk] = [a[p]![k]!, a[q]![k]!];
          a[p]![k] = c * apk - s * aqk;
          a[q]![k] = s * apk + c * aqk;
        }
        for (let k = 0; k < m; k++) {
          const [vkp, vkq] = [v[k]![p]!, v[k]![q]!];
          v[k]![p] = c * vkp - s * vkq;
          v[k]![q] = s * vkp + c * vkq;
        }
      }
    }
  }
  return { values: a.map((row, i) => row[i]!), vectors: v };
}
