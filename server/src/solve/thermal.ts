/**
 * The electro-thermal loop: each device's junction sits at Tj = Ta + P·RθJA, while its loss P
 * depends on Tj through the device model. For a diode the loss falls as Tj rises (VF drops about
 * 2 mV/K), so the map T ↦ Ta + P(T)·Rθ contracts quickly; for a MOSFET the loss rises with
 * rdson(Tj), and when Rθ·dP/dTj reaches 1 there is no fixed point — thermal runaway.
 *
 * Every loss evaluation is a full steady state, so the iteration is counted in evaluations: the
 * first step is the plain fixed-point step, later ones the secant step on the residual
 * r(T) = Ta + P(T)·Rθ − T (per device; the devices couple only weakly through the circuit), and
 * the loop stops at the first evaluated Tj whose own residual is within the tolerance — so the
 * reported Tj, loss and orbit belong together. A start near the answer (a neighbouring corner's
 * temperature rise) often settles in one or two evaluations.
 */

export interface ThermalOptions {
  /** Convergence: largest |Ta + P(Tj)·Rθ − Tj| at the reported Tj, K (default 0.1, per DESIGN.md §5). */
  toleranceK?: number;
  /** Loss evaluations after the first, at most (default 40). */
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

/** Largest secant slope trusted: nearer 1 the fixed point is ill-conditioned or absent, and plain steps decide. */
const SECANT_SLOPE_LIMIT = 0.9;

/**
 * Iterates Tj = Ta + P(Tj)·Rθ for every device with a thermal resistance; devices without one
 * stay at ambient. `lossAt` must return the per-device loss at the given junction temperatures;
 * `startC`, when given, is the first Tj tried (a guess; the result does not depend on it beyond
 * the tolerance).
 *
 * With `finish`, `lossAt` may answer from a draft (a loss good enough to pick the next Tj, not
 * yet that of a periodic orbit): before the loop stops at a Tj, `finish` makes that last
 * evaluation final and returns its loss (undefined when it was final already), and the stop is
 * judged again on it. So an evaluation the loop goes on from costs only its draft, and the
 * reported Tj, loss and orbit still belong together. Once a final loss overturns a stop, the
 * loop asks for final evaluations only.
 */
export function settleJunctionTemperatures(
  ambientC: number, rthKPerW: readonly (number | undefined)[], lossAt: (tjC: number[], mayDraft: boolean) => number[], opts: ThermalOptions = {},
  startC?: readonly number[], finish?: () => number[] | undefined,
): ThermalResult {
  const tol = opts.toleranceK ?? 0.1;
  const maxIt = opts.maxIterations ?? 40;
  const limit = opts.runawayTjC ?? 400;
  const hasRth = rthKPerW.map((r) => r !== undefined && r > 0);
  const clampStart = (k: number) => {
    const s = startC?.[k];
    return hasRth[k] && s !== undefined && Number.isFinite(s) ? Math.min(Math.max(s, ambientC), limit) : ambientC;
  };
  let tj = rthKPerW.map((_, k) => clampStart(k));
  const anyRth = hasRth.some(Boolean);
  // Drafts until one passes the stop test and its final loss does not: from then on every
  // evaluation is final, so a draft too far off cannot keep the loop from its fixed point.
  let drafting = anyRth && finish !== undefined;
  let loss = lossAt(tj, drafting);
  if (!anyRth) return { tjC: tj, lossW: loss, iterations: 0, converged: true, runaway: tj.map(() => false) };
  const image = (l: number[]) => rthKPerW.map((r, k) => (hasRth[k] ? ambientC + Math.max(l[k]!, 0) * r! : ambientC));
  let f = image(loss);
  let prevT: number[] | undefined;
  let prevF: number[] | undefined;
  let iterations = 0;
  let hot = false;
  /** Makes the last evaluation final (its loss and image then stand for it); false when it was final already. */
  const finishLast = (): boolean => {
    const final = finish?.();
    if (final === undefined) return false;
    loss = final;
    f = image(loss);
    return true;
  };
  for (;;) {
    // Written as "not above" so that a loss that is not a number stops the loop, as it always has.
    if (!(Math.max(...f.map((x, k) => Math.abs(x - tj[k]!))) > tol) || iterations >= maxIt) {
      // About to stop on this evaluation: it must be final, and the stop is judged on its final loss.
      if (!finishLast()) break;
      drafting = false;
      continue;
    }
    const next = tj.map((t, k) => {
      if (!hasRth[k]) return ambientC;
      const plain = f[k]!;
      if (!prevT || !prevF || prevT[k] === t) return plain;
      const s = (f[k]! - prevF[k]!) / (t - prevT[k]!);
      return s < SECANT_SLOPE_LIMIT && Number.isFinite(s) ? t + (f[k]! - t) / (1 - s) : plain;
    });
    prevT = tj; prevF = f;
    tj = next.map((t) => Math.max(Math.min(t, limit + 1), ambientC));
    iterations++;
    if (tj.some((t) => t > limit)) { hot = true; break; }
    loss = lossAt(tj, drafting);
    f = image(loss);
  }
  // After a jump past the limit the figures reported are those of the last evaluation: final too.
  if (hot) finishLast();
  // After a jump past the limit f still belongs to the previous Tj.
  const at = hot && prevT ? prevT : tj;
  const runaway = tj.map((t, k) => hasRth[k]! && (t > limit || Math.abs(f[k]! - at[k]!) > tol));
  return { tjC: tj, lossW: loss, iterations, converged: !runaway.some(Boolean), runaway };
}
