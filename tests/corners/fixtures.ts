/**
 * Fixtures of the corner tests: the offline bridge of our own they share (a 325 V crest through
 * 4.7 Ω into a four-diode bridge), and the odex steady state their brute-force references reach.
 */
import type { OdexSolver } from '../solve/odex-loader';

/** The 230 V-class bridge: `head` lines after the title, the capacitor card, then `tail` lines. */
export function offlineBridge(title: string, head: string, capacitor: string, tail: string): string {
  return `${title}
${head}
VAC L N SIN(0 325 50)
RS L A 4.7
D1 A P DR
D2 N P DR
D3 0 A DR
D4 0 N DR
${capacitor}
${tail}
.model DR D(IS=5n N=1.8)
.end
`;
}

/**
 * Integrates a one-state rectifier ODE (the capacitor voltage) period after period until it
 * repeats to 1e-9 of the crest, from 0.9 of the crest (a constant-power load needs a charged
 * capacitor to start from), tolerances 1e-10; returns the solver set for dense output and the
 * start of the periodic orbit.
 */
export function periodicOrbit(
  Solver: new (n: number) => OdexSolver, rhs: (t: number, y: number[]) => number[], vm: number, periodS: number,
): { solver: OdexSolver; t0: number; v0: number } {
  const solver = new Solver(1);
  solver.absoluteTolerance = 1e-10;
  solver.relativeTolerance = 1e-10;
  solver.maxSteps = 1e6;
  let v0 = 0.9 * vm;
  let t0 = 0;
  for (let p = 0; p < 400; p++) {
    const v1 = solver.solve(rhs, t0, [v0], t0 + periodS).y[0]!;
    t0 += periodS;
    const done = Math.abs(v1 - v0) <= 1e-9 * vm;
    v0 = v1;
    if (done) break;
  }
  solver.denseOutput = true;
  return { solver, t0, v0 };
}
