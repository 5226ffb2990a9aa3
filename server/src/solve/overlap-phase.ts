/**
 * One conducting diode behind a line's companion impedance: the current d ≥ 0 with
 * Z·d + vD(d) = w (w the voltage across the pair), zero for w ≤ 0 (a blocked diode is open, as
 * in the one-path network). vD is the SPICE law of diode-model.ts. Bracketed in ψ = ln(1 + d/IS),
 * where vD is linear, so an ideal-ish diode cannot overflow; Newton steps in d or in ψ, whichever
 * the equation is nearer linear in, from the last root (the stages move it little), so a solve
 * mostly costs one or two logarithms.
 */
import { diodeSlopeOhm, type DiodeAtTemp } from './diode-model';

/** A ψ step up longer than this first tightens the bracket to the linear part's bound. */
const NEAR_PSI = 0.5;

/** Current and slope dd/dw of one diode at one drive; the last root is the warm start. */
export class DiodeBehindZ {
  psi = 0;
  d = 0;
  slope = 0;
  /** The current at `psi` for saturation current `isAt` (`d` is zero while blocked; this is not). */
  private dAtPsi = 0;
  private isAt = 0;

  solve(dev: DiodeAtTemp, Z: number, w: number): number {
    if (!(w > 0)) { this.d = 0; this.slope = 0; return 0; }
    const is = dev.isA;
    const nVt = dev.nVtV;
    const zr = Z + dev.rsOhm;
    // The diode law alone bounds ψ from above (G ≥ 0 there), and so does the linear part alone;
    // the first is free, the second (a logarithm) is taken only for a cold start.
    const hiCheap = Math.min(w / nVt, 700);
    let lo = 0;
    let hi = hiCheap * (1 + 1e-12) + 1e-300;
    let psi: number, d: number;
    let tight = false;
    if (this.psi > 0 && this.psi < hiCheap && this.isAt === is) { psi = this.psi; d = this.dAtPsi; }
    else {
      psi = Math.min(Math.log1p(w / (zr * is)), hiCheap); d = is * Math.expm1(psi);
      tight = true;
    }
    for (let it = 0; it < 100; it++) {
      const G = zr * d + nVt * psi - w;
      if (G === 0) break;
      if (G < 0) lo = psi; else hi = psi;
      // Newton in whichever variable G is nearly linear in: in d while the line's impedance
      // carries most of the drive, in ψ while the diode's exponential does; each step costs one
      // logarithm or one exponential, and the pair (d, ψ) stays exact.
      const linear = zr * (d + is) > nVt;
      let dN = linear ? d - G / (zr + nVt / (d + is)) : NaN;
      // The step in ψ, to first order where the step is in d.
      const step = linear ? (dN - d) / (d + is) : -G / (zr * (d + is) + nVt);
      if (Math.abs(step) <= 1e-13 * psi) {
        // Converged (a step below the rounding of ψ may not even leave it, so no bracket test);
        // the other variable follows to second order in the step, sparing a logarithm or an exponential.
        psi += step;
        d = linear ? dN : d + (d + is) * step;
        break;
      }
      let next = linear ? (dN > -is ? Math.log1p(dN / is) : NaN) : psi + step;
      if (G < 0 && next - psi > NEAR_PSI && !tight) {
        // A long jump up needs the tight bound: far above the root Newton in d loses its digits.
        hi = Math.min(hi, Math.log1p(w / (zr * is)) * (1 + 1e-12) + 1e-300);
        tight = true;
      }
      if (!(next > lo && next < hi)) {
        // The other variable's step, else bisection.
        next = linear ? psi - G / (zr * (d + is) + nVt) : this.newtonInD(d, G, zr, nVt, is);
        if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
        dN = NaN;
      }
      psi = next;
      d = dN === dN ? dN : is * Math.expm1(psi);
    }
    this.psi = psi; this.dAtPsi = d; this.isAt = is;
    this.d = d;
    this.slope = 1 / (Z + diodeSlopeOhm(d, dev));
    return d;
  }

  /**
   * Moves a conducting diode along its tangent by dw, when the neglected terms stay below tol:
   * the step must be small beside d + IS (where the diode's own slope resistance changes), and
   * ½·d''·dw² (d'' = slope³·N·Vt/(d + IS)²) below tol. A blocked diode must stay blocked (the
   * caller checks its drive). Returns whether it moved; buffers of the warm start stay as solved.
   */
  shift(dev: DiodeAtTemp, dw: number, tol: number): boolean {
    if (!(this.d > 0)) return false;
    const di = this.slope * dw;
    const dis = this.d + dev.isA;
    if (!(Math.abs(di) <= 0.01 * dis)) return false;
    if (!(0.5 * Math.abs(di * dw) * this.slope * this.slope * dev.nVtV / (dis * dis) <= tol)) return false;
    this.d += di;
    return true;
  }

  /** ψ after a Newton step in d (NaN where that step leaves the domain). */
  private newtonInD(d: number, G: number, zr: number, nVt: number, is: number): number {
    const dN = d - G / (zr + nVt / (d + is));
    return dN > -is ? Math.log1p(dN / is) : NaN;
  }
}
