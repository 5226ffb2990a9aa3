/**
 * Fits the SPICE diode equation (Berkeley SPICE3 diode model: I = IS·(e^(V/(N·Vt)) − 1), plus
 * the drop I·RS) to forward points, so a catalog entry or a `vf=` rating can suggest a model.
 */
import type { DiodeTechnology, ForwardModel, ForwardPoint } from './rating-records';

/** Boltzmann constant, J/K, exact since the 2019 SI redefinition. */
const BOLTZMANN_J_PER_K = 1.380649e-23;
/** Elementary charge, C, exact since the 2019 SI redefinition. */
const ELEMENTARY_CHARGE_C = 1.602176634e-19;
const ZERO_CELSIUS_K = 273.15;

/**
 * EG and XTI by technology: 1.11 eV and 3 for pn silicon, 0.69 eV and 2 for Schottky (Berkeley
 * SPICE3 user's manual, diode model table; REFERENCES.md §8, C). For silicon carbide the manual
 * gives nothing; the Schottky pair is used as a stand-in (from memory, marked in the note).
 */
export function temperatureParamsFor(technology: DiodeTechnology): { egEv: number; xti: number; note?: string } {
  switch (technology) {
    case 'schottky':
      return { egEv: 0.69, xti: 2 };
    case 'sic-schottky':
      return { egEv: 0.69, xti: 2, note: 'EG and XTI of a silicon Schottky used as a stand-in for silicon carbide' };
    default:
      return { egEv: 1.11, xti: 3 };
  }
}

/** Thermal voltage kT/q at a temperature in °C. */
export function thermalVoltageV(tC: number): number {
  return (BOLTZMANN_J_PER_K * (tC + ZERO_CELSIUS_K)) / ELEMENTARY_CHARGE_C;
}

/**
 * Fits IS, N and RS to three forward points given at `atC`. With the "−1" of the diode equation
 * neglected (it changes the current by e^(−V/N·Vt), negligible for a forward point above 0.2 V)
 * the law V = N·Vt·ln I − N·Vt·ln IS + RS·I is linear in (N·Vt, −N·Vt·ln IS, RS), so three
 * points fix it exactly without iteration, and more points are fitted by linear least squares.
 * With two points RS is set to 0 and IS, N are fitted.
 * Returns undefined when the points do not describe a forward diode (N ≤ 0, RS < 0, or an
 * unsolvable set such as two points at one current).
 */
export function fitForwardModel(
  points: readonly ForwardPoint[],
  technology: DiodeTechnology,
  note: string,
  atC = 25,
): ForwardModel | undefined {
  const fit = points.length === 2 ? fitTwo(points[0], points[1]) : points.length >= 3 ? fitLeastSquares(points) : undefined;
  if (!fit) return undefined;
  const vt = thermalVoltageV(atC);
  const n = fit.nVtV / vt;
  const isA = Math.exp(-fit.offsetV / fit.nVtV);
  if (!(n > 0) || !(fit.rsOhm >= 0) || !(isA > 0) || !Number.isFinite(isA)) return undefined;
  const temp = temperatureParamsFor(technology);
  return {
    isA,
    n,
    rsOhm: fit.rsOhm,
    egEv: temp.egEv,
    xti: temp.xti,
    tnomC: atC,
    note: temp.note ? `${note}; ${temp.note}` : note,
  };
}

/** Forward voltage of a fitted model at a current (the same equation, RS included). */
export function forwardVoltageV(model: ForwardModel, iA: number): number {
  return model.n * thermalVoltageV(model.tnomC) * Math.log1p(iA / model.isA) + model.rsOhm * iA;
}

interface LinearFit {
  nVtV: number;
  /** −N·Vt·ln IS. */
  offsetV: number;
  rsOhm: number;
}

function fitTwo(a: ForwardPoint, b: ForwardPoint): LinearFit | undefined {
  if (!(a.iA > 0 && b.iA > 0) || a.iA === b.iA) return undefined;
  const nVtV = (a.vV - b.vV) / (Math.log(a.iA) - Math.log(b.iA));
  return { nVtV, offsetV: a.vV - nVtV * Math.log(a.iA), rsOhm: 0 };
}

/** Least squares through the normal equations; with three points it is the exact solution. */
function fitLeastSquares(points: readonly ForwardPoint[]): LinearFit | undefined {
  if (points.some((p) => !(p.iA > 0))) return undefined;
  const rows = points.map((p) => [Math.log(p.iA), 1, p.iA]);
  const normal = [0, 1, 2].map((r) => [0, 1, 2].map((c) => rows.reduce((sum, row) => sum + row[r] * row[c], 0)));
  const rhs = [0, 1, 2].map((r) => rows.reduce((sum, row, k) => sum + row[r] * points[k].vV, 0));
  const x = solve3(normal, rhs);
  return x ? { nVtV: x[0], offsetV: x[1], rsOhm: x[2] } : undefined;
}

/** Cramer's rule on a 3×3 system; undefined when it is singular. */
function solve3(m: number[][], rhs: number[]): [number, number, number] | undefined {
  const det = (a: number[][]): number =>
    a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) -
    a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0]) +
    a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
  const d = det(m);
  const size = Math.max(...m.flat().map(Math.abs));
  if (!Number.isFinite(d) || Math.abs(d) <= 1e-12 * size ** 3) return undefined;
  const column = (k: number): number[][] => m.map((row, r) => row.map((v, c) => (c === k ? rhs[r] : v)));
  return [det(column(0)) / d, det(column(1)) / d, det(column(2)) / d];
}
