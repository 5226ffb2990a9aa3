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
