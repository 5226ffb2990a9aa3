/**
 * The largest thermal resistance a rate template may propose for devices that have none: the
 * RθJA at which the junction stays within the policy's limit at the hottest corner. A first guess
 * from the loss solved with the junction at the ambient, RθJA = (Tlimit − Ta)/P, rounded down to
 * two digits; since loss changes with temperature (a MOSFET's on-resistance rises, a Schottky's
 * leakage grows), the guess is verified by re-solving the rectifier with it through the memoised
 * solver, and halved until the verdict passes (a few tries, then no value is proposed).
 */
import type { RectifierAnalysis } from '../../equivalent/index';
import { junctionLimitC, type DeratingPolicy } from '../../ratings/index';
import { deviceFiguresOf, solveRectifier, type SolveFn } from '../../solve/index';

/** Largest value ever proposed, K/W: our own bound, above small leaded parts in still air. */
const MAX_PROPOSED_K_PER_W = 500;

/** Re-solves tried before giving up. */
const MAX_TRIES = 3;

/** Rounds down to two significant digits: 87.4 → 87, 0.127 → 0.12. */
export function floorTwoDigits(value: number): number {
  if (!(value > 0)) return 0;
  const step = 10 ** (Math.floor(Math.log10(value)) - 1);
  return Number((Math.floor(value / step + 1e-9) * step).toPrecision(2));
}

/**
 * The RθJA (K/W) to propose for the devices `group` of `analysis` so that each stays within the
 * policy's junction limit under `tjmaxC`, verified by a re-solve; undefined when none passes.
 */
export function provenRthjaBound(
  analysis: RectifierAnalysis, group: readonly number[], tjmaxC: number, policy: DeratingPolicy, solve: SolveFn = solveRectifier,
): number | undefined {
  const limitC = junctionLimitC(policy.tj.value, tjmaxC);
  const ambientC = Math.max(...analysis.corners.map((c) => c.ambientC));
  const lossW = Math.max(0, ...group.map((k) => analysis.devices[k]?.figures.worst?.lossW?.value ?? 0));
  if (!(limitC > ambientC)) return undefined;
  let guess = floorTwoDigits(Math.min(MAX_PROPOSED_K_PER_W, lossW > 0 ? (limitC - ambientC) / lossW : MAX_PROPOSED_K_PER_W));
  for (let tries = 0; tries < MAX_TRIES && guess > 0; tries++) {
    if (passesWith(analysis, group, guess, limitC, solve)) return guess;
    guess = floorTwoDigits(guess / 2);
  }
  return undefined;
}

function passesWith(analysis: RectifierAnalysis, group: readonly number[], rthjaKPerW: number, limitC: number, solve: SolveFn): boolean {
  const devices = analysis.circuit.devices.map((d, k) => (group.includes(k) ? { ...d, rthjaKPerW } : d));
  const circuit = { ...analysis.circuit, devices };
  const solution = solve(circuit, analysis.corners, { waveformPoints: 0 });
  return group.every((k) => {
    const worst = deviceFiguresOf(circuit, solution, k).worst;
    return worst !== undefined && !worst.thermalRunaway && worst.tjC !== undefined && worst.tjC.value <= limitC;
  });
}
