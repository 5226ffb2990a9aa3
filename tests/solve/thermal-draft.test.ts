/**
 * The electro-thermal loop with draft evaluations (solve/thermal.ts `finish`): an evaluation the
 * loop goes on from may be a draft; the one it stops on must be final, and the stop is judged on
 * the final loss. A diode's loss falling linearly with its junction temperature,
 * P(T) = P0·(1 − α·(T − 25 °C)), has the fixed point of T = Ta + Rθ·P(T) in closed form (derived
 * here): T* = (Ta + Rθ·P0·(1 + 25·α)) / (1 + Rθ·P0·α). The draft loss is the final one off by a
 * factor (1 + ε), as a period short of periodic leaves it.
 */
import { describe, expect, it } from 'vitest';
import { settleJunctionTemperatures } from '../../server/src/solve/thermal';

const TA = 40;
const RTH = 60;
const P0 = 1.2;
const ALPHA = 2e-3;
const loss = (t: number) => P0 * (1 - ALPHA * (t - 25));
const FIXED_POINT = (TA + RTH * P0 * (1 + 25 * ALPHA)) / (1 + RTH * P0 * ALPHA); // derived in the header

/** A loop over one device whose drafts are off by ε; counts the evaluations of each kind. */
function settle(epsilon: number, startC?: number) {
  const counts = { drafts: 0, finals: 0, finishes: 0 };
  let lastT = NaN;
  let lastWasDraft = false;
  const lossAt = (tj: number[], mayDraft: boolean) => {
    lastT = tj[0]!;
    lastWasDraft = mayDraft;
    if (mayDraft) counts.drafts++; else counts.finals++;
    return [loss(lastT) * (mayDraft ? 1 + epsilon : 1)];
  };
  const finish = () => {
    if (!lastWasDraft) return undefined;
    counts.finishes++;
    lastWasDraft = false;
    return [loss(lastT)];
  };
  const result = settleJunctionTemperatures(TA, [RTH], lossAt, { toleranceK: 0.1 }, startC === undefined ? undefined : [startC], finish);
  return { result, counts };
}

describe('the thermal loop with draft evaluations', () => {
  it('stops on a final evaluation whose own residual is within the tolerance', () => {
    const { result, counts } = settle(1e-4);
    const tj = result.tjC[0]!;
    expect(result.converged).toBe(true);
    // The reported loss is the final loss at the reported Tj, and its residual is within 0.1 K.
    expect(result.lossW[0]).toBe(loss(tj));
    expect(Math.abs(TA + RTH * loss(tj) - tj)).toBeLessThanOrEqual(0.1);
    // Near the closed-form fixed point: the map's slope is −Rθ·P0·α, so |T − T*| ≤ 0.1 K / (1 + Rθ·P0·α).
    expect(Math.abs(tj - FIXED_POINT)).toBeLessThanOrEqual(0.1 / (1 + RTH * P0 * ALPHA));
    // Every evaluation was a draft, and only the last was finished.
    expect(counts.finals).toBe(0);
    expect(counts.finishes).toBe(1);
    expect(counts.drafts).toBe(result.iterations + 1);
  });

  it('goes on when a draft passed but its final loss does not', () => {
    // Started at the draft law's own fixed point: the draft passes at once, the final loss (5 % less) does not.
    const epsilon = 0.05;
    const draftFixedPoint = (TA + RTH * P0 * (1 + epsilon) * (1 + 25 * ALPHA)) / (1 + RTH * P0 * (1 + epsilon) * ALPHA);
    const { result, counts } = settle(epsilon, draftFixedPoint);
    const tj = result.tjC[0]!;
    // The one draft was finished, overturned, and the loop went on with final evaluations only.
    expect(counts.drafts).toBe(1);
    expect(counts.finishes).toBe(1);
    expect(counts.finals).toBeGreaterThanOrEqual(1);
    expect(result.iterations).toBeGreaterThanOrEqual(1);
    expect(result.converged).toBe(true);
    expect(result.lossW[0]).toBe(loss(tj));
    expect(Math.abs(TA + RTH * loss(tj) - tj)).toBeLessThanOrEqual(0.1);
  });

  it('evaluates only finally without a finish', () => {
    let drafts = 0;
    const result = settleJunctionTemperatures(TA, [RTH], (tj, mayDraft) => { if (mayDraft) drafts++; return [loss(tj[0]!)]; }, { toleranceK: 0.1 });
    expect(drafts).toBe(0);
    expect(Math.abs(TA + RTH * loss(result.tjC[0]!) - result.tjC[0]!)).toBeLessThanOrEqual(0.1);
  });
});
