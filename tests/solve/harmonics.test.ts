/**
 * The one-pass Fourier integrals of a piecewise-linear record against closed-form Fourier series
 * (any handbook table of Fourier series, e.g. Kreyszig, Advanced Engineering Mathematics, ch. 11;
 * section from memory): a triangle wave, which is piecewise linear with its vertices as samples
 * so the integrals are exact, and a sawtooth, whose record does not close (the boundary term).
 */
import { describe, expect, it } from 'vitest';
import { fourierAmplitudes, HARMONIC_ORDERS } from '../../server/src/solve/harmonics';

const OMEGA = 2 * Math.PI * 50;
const T = 1 / 50;

describe('fourierAmplitudes', () => {
  it('gives a triangle wave its series 8A/(π²n²) on odd orders and nothing on even ones', () => {
    // x(t) = A·tri(ωt): 0 at t = 0, A at T/4, −A at 3T/4, 0 at T; odd in t, so a sine series:
    // x = (8A/π²) Σ_{n odd} (−1)^((n−1)/2) sin(nωt)/n².
    const A = 3.5;
    const t = [0, T / 4, (3 * T) / 4, T];
    const x = [0, A, -A, 0];
    const c = fourierAmplitudes(t, x, HARMONIC_ORDERS, t.length, OMEGA);
    for (let n = 1; n <= HARMONIC_ORDERS; n++) {
      const sine = n % 2 === 1 ? ((8 * A) / (Math.PI * Math.PI * n * n)) * (((n - 1) / 2) % 2 === 0 ? 1 : -1) : 0;
      expect(Math.abs(c.re[n - 1]!)).toBeLessThan(1e-12 * A);
      expect(Math.abs(c.im[n - 1]! - sine)).toBeLessThan(1e-12 * A);
    }
  });

  it('gives a sawtooth t/T over one period −1/(πn) on the sine terms, through the boundary term', () => {
    // x(t) = t/T on [0, T): mean 1/2, x = 1/2 − Σ sin(nωt)/(πn). Sampled irregularly: the
    // integrals of a straight line are exact at any sampling.
    const t: number[] = [];
    for (let k = 0; k <= 37; k++) t.push(T * (k / 37) ** 1.3);
    const x = t.map((tk) => tk / T);
    const c = fourierAmplitudes(t, x, HARMONIC_ORDERS, t.length, OMEGA);
    for (let n = 1; n <= HARMONIC_ORDERS; n++) {
      expect(Math.abs(c.re[n - 1]!)).toBeLessThan(1e-12);
      expect(Math.abs(c.im[n - 1]! + 1 / (Math.PI * n))).toBeLessThan(1e-12);
    }
  });

  it('agrees with a direct quadrature of a smooth pulse train at every order', () => {
    // A record with flat (zero) stretches between pulses, as a blocked bridge gives: the skipped
    // segments must not change the sums. Reference: composite Simpson on the same piecewise-linear
    // function, 20,000 panels per segment-free stretch.
    const t: number[] = [];
    const x: number[] = [];
    for (let k = 0; k <= 400; k++) {
      const tk = (T * k) / 400;
      const ph = (OMEGA * tk) % Math.PI;
      t.push(tk);
      x.push(Math.abs(ph - Math.PI / 2) < 0.4 ? Math.cos(3 * (ph - Math.PI / 2)) * Math.sign(Math.sin(OMEGA * tk)) : 0);
    }
    const pwl = (tt: number) => {
      let lo = 0, hi = t.length - 1;
      while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (t[mid]! <= tt) lo = mid; else hi = mid; }
      return x[lo]! + ((x[hi]! - x[lo]!) * (tt - t[lo]!)) / (t[hi]! - t[lo]!);
    };
    const c = fourierAmplitudes(t, x, HARMONIC_ORDERS, t.length, OMEGA);
    const panels = 400 * 64;
    for (const n of [1, 2, 3, 5, 7, 13, 27, 40]) {
      let re = 0, im = 0;
      for (let j = 0; j <= panels; j++) {
        const tt = (T * j) / panels;
        const w = j === 0 || j === panels ? 1 : j % 2 === 1 ? 4 : 2;
        const v = pwl(tt);
        re += w * v * Math.cos(n * OMEGA * tt);
        im += w * v * Math.sin(n * OMEGA * tt);
      }
      const h = T / panels;
      expect(c.re[n - 1]!).toBeCloseTo((2 / T) * (re * h) / 3, 4);
      expect(c.im[n - 1]!).toBeCloseTo((2 / T) * (im * h) / 3, 4);
    }
  });
});
