/**
 * The record takes the source phase sin ωt, cos ωt from the stage that produced each point
 * (stage.ts, off-advance.ts) instead of evaluating it again. Check that phase against the point's
 * own time: while nothing conducts in an ideal bridge with a stiff source, the two upper diodes'
 * voltages differ by the line-to-line EMF, v(D1) − v(D3) = e(t) = Vm·sin ωt (Kirchhoff around
 * the two upper diodes and the source; derived here), at every recorded point, stepped or off.
 */
import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../server/src/solve/network';
import { findSteadyState } from '../../server/src/solve/shooting';
import { bridgeDevices, circuit } from './fixtures';

const VM = 230 * Math.SQRT2;
const W = 2 * Math.PI * 50;

describe('the recorded source phase', () => {
  it('matches each record point time wherever the bridge blocks', () => {
    const c = circuit('diode-bridge', { vrms: 230 }, bridgeDevices(), [[100e-6, 0]], { kind: 'resistance', ohm: 500 });
    const net = buildNetwork(c, 1, [25, 25, 25, 25], [])!;
    const rec = findSteadyState(net).record;
    const nd = net.devices.length;
    let checked = 0;
    for (let k = 0; k < rec.count; k++) {
      if (rec.mode[k]! >= 0) continue;
      const diff = rec.devV[k * nd]! - rec.devV[k * nd + 2]!;
      expect(Math.abs(diff - VM * Math.sin(W * rec.t[k]!))).toBeLessThan(1e-9 * VM);
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });
});
