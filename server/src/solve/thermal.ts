/**
 * The electro-thermal loop: each device's junction sits at Tj = Ta + P·RθJA, while its loss P
 * depends on Tj through the device model. Plain fixed-point iteration is used: for a diode the
 * loss falls as Tj rises (VF drops about 2 mV/K), so it contracts quickly; for a MOSFET the loss
 * rises with rdson(Tj), and when Rθ·dP/dTj reaches 1 there is no fixed point — thermal runaway.
 */

export interface ThermalOptions {
  /** Convergence: largest Tj change between iterations, K (default 0.1, per DESIGN.md §5). */
  toleranceK?: number;
  /** Iterations at most (default 40). */
  maxIterations?: number;
  /** A junction above this is taken as destroyed: runaway (default 400 °C, far above any rating). */
  runawayTjC?: number;
}

export interface ThermalResult {
  tjC: number[];
  lossW: number[];
  iterations: number;
  converged: boolean;
  /** Per device: no settled Tj. */
  runaway: boolean[];
}

/**
 * Iterates Tj = Ta + P(Tj)·Rθ for every device with a thermal resistance; devices without one
 * stay at ambient. `lossAt` must return the per-device loss at the given junction temperatures.
 */
export function settleJunctionTemperatures(
  ambientC: number, rthKPerW: readonly (number | undefined)[], lossAt: (tjC: number[]) => number[], opts: ThermalOptions = {},
): ThermalResult {
  const tol = opts.toleranceK ?? 0.1;
  const maxIt = opts.maxIterations ?? 40;
  const limit = opts.runawayTjC ?? 400;
  let tj = rthKPerW.map(() => ambientC);
  let loss = lossAt(tj);
  let lastStep = rthKPerW.map(() => Infinity);
  let iterations = 0;
  const hasRth = rthKPerW.map((r) => r !== undefined && r > 0);
  if (!hasRth.some(Boolean)) return { tjC: tj, lossW: loss, iterations: 0, converged: true, runaway: tj.map(() => false) };
  for (; iterations < maxIt; iterations++) {
    const next = tj.map((_, k) => (hasRth[k] ? ambientC + Math.max(loss[k]!, 0) * rthKPerW[k]! : ambientC));
    lastStep = next.map((t, k) => Math.abs(t - tj[k]!));
    tj = next.map((t) => Math.min(t, limit + 1));
    if (tj.some((t) => t > limit)) break;
    loss = lossAt(tj);
    if (Math.max(...lastStep) <= tol) { iterations++; break; }
  }
  const runaway = tj.map((t, k) => hasRth[k]! && (t > limit || lastStep[k]! > tol));
  return { tjC: tj, lossW: loss, iterations, converged: !runaway.some(Boolean), runaway };
}
