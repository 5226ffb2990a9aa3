/**
 * The TR-BDF2 coefficients both engines step with (γ = 2 − √2, L-stable, second order), and the
 * third-order quadrature on the nodes 0, γ, 1 (exact for quadratics) that gives the embedded error
 * estimate and the record's weights.
 */
export const GAMMA = 2 - Math.SQRT2;
export const D = GAMMA / 2;
export const W = Math.SQRT2 / 4;
export const WD = W / D;
export const Q0 = (1 - W) / 3;
export const QG = (3 * W + 1) / 3;
export const Q1 = D / 3;

/**
 * The embedded error estimate of state j over a step of length h, filtered through
 * dy/dr = (I − dh·J)⁻¹ (Hosea & Shampine) so that stiff components do not inflate it.
 */
export function filteredError(j: number, n: number, h: number, dydr1: readonly number[], f0: readonly number[], fG: readonly number[], f1: readonly number[]): number {
  let e = 0;
  for (let m = 0; m < n; m++) e += dydr1[j * n + m]! * h * ((Q0 - W) * f0[m]! + (QG - W) * fG[m]! + (Q1 - D) * f1[m]!);
  return e;
}

/**
 * Carries the period Jacobian Y (and F = df/dy0) through one step: with R = Y + D·h·F at the
 * γ-stage and R' = (1 − W/D)·Y + W/D·(dyG/dr·R) at the end, Y ← dy1/dr·R', F ← df1/dr·R'.
 * R and tmp are n×n scratch.
 */
export function propagateSensitivity(
  h: number, n: number, Y: number[], F: number[], dydrG: readonly number[], dydr1: readonly number[], dfdr1: readonly number[], R: number[], tmp: number[],
): void {
  const dh = D * h;
  for (let k = 0; k < n * n; k++) R[k] = Y[k]! + dh * F[k]!;
  matMul(dydrG, R, tmp, n);
  for (let k = 0; k < n * n; k++) R[k] = (1 - WD) * Y[k]! + WD * tmp[k]!;
  matMul(dydr1, R, Y, n);
  matMul(dfdr1, R, F, n);
}

/** c = a·b for n×n row-major matrices (c must not alias a or b). */
export function matMul(a: readonly number[], b: readonly number[], c: number[], n: number): void {
  // Three states (the overlap bridge's two line currents and capacitor) is a common case, three
  // products a step: written out, without the loops' index arithmetic (same sums, same order).
  if (n === 3) {
    const a0 = a[0]!, a1 = a[1]!, a2 = a[2]!, a3 = a[3]!, a4 = a[4]!, a5 = a[5]!, a6 = a[6]!, a7 = a[7]!, a8 = a[8]!;
    const b0 = b[0]!, b1 = b[1]!, b2 = b[2]!, b3 = b[3]!, b4 = b[4]!, b5 = b[5]!, b6 = b[6]!, b7 = b[7]!, b8 = b[8]!;
    c[0] = a0 * b0 + a1 * b3 + a2 * b6; c[1] = a0 * b1 + a1 * b4 + a2 * b7; c[2] = a0 * b2 + a1 * b5 + a2 * b8;
    c[3] = a3 * b0 + a4 * b3 + a5 * b6; c[4] = a3 * b1 + a4 * b4 + a5 * b7; c[5] = a3 * b2 + a4 * b5 + a5 * b8;
    c[6] = a6 * b0 + a7 * b3 + a8 * b6; c[7] = a6 * b1 + a7 * b4 + a8 * b7; c[8] = a6 * b2 + a7 * b5 + a8 * b8;
    return;
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += a[i * n + k]! * b[k * n + j]!;
      c[i * n + j] = s;
    }
  }
}
