/**
 * The DC port of the overlap solver: the capacitor's implicit companion (a source `a` behind
 * K = dh/C + ESR) in parallel with the load. Given a, the port voltage v solves v = a − K·g(v),
 * g the load current; the larger root where a power load gives two (the operating point), the
 * current and power parts fading linearly below the floor, as in the one-path stage.
 */
import type { LoadModel } from './network';

/** Port voltage, load current and dg/dv; reused buffer. */
export interface PortPoint {
  v: number;
  g: number;
  gp: number;
}

/** Solves v + K·g(v) = a for the load model; writes into `out`. */
export function solvePort(ld: LoadModel, a: number, K: number, out: PortPoint): void {
  const vf = ld.vFloorV;
  const gR = Number.isFinite(ld.rOhm) ? 1 / ld.rOhm : 0;
  const iA = ld.kind === 'current' || ld.mixed ? ld.iA : 0;
  const pW = ld.kind === 'power' || ld.mixed ? ld.pW : 0;
  if (ld.kind === 'none' && !ld.mixed) { set(out, a, 0, 0); return; }
  // Above the floor: c·v² − (a − K·I)·v + K·P = 0 with c = 1 + K/R.
  const c = 1 + K * gR;
  const b = a - K * iA;
  const disc = b * b - 4 * c * K * pW;
  const v = disc >= 0 ? (pW > 0 ? (b + Math.sqrt(disc)) / (2 * c) : b / c) : -Infinity;
  if ((iA === 0 && pW === 0) || (v >= vf && v > 0)) {
    set(out, v, gR * v + iA + (pW > 0 ? pW / v : 0), gR - (pW > 0 ? pW / (v * v) : 0));
    return;
  }
  const g0 = gR + iA / vf + pW / (vf * vf);
  const w = a / (1 + K * g0);
  if (w >= 0) set(out, w, g0 * w, g0); else set(out, a, 0, 0);
}

function set(out: PortPoint, v: number, g: number, gp: number): void {
  out.v = v; out.g = g; out.gp = gp;
}
