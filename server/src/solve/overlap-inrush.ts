/**
 * Switch-on inrush of the three-phase bridge with line inductance: the cases of inrush-cases.ts
 * (both crests of the first path's EMF, cold start and hot restart with an NTC limiter), each
 * from empty capacitor and zero line currents over the first half-cycle, the line inductance in
 * the loop. Per device: its peak and ∫i²dt, the worst case by the surge figure.
 */
import type { EquivalentCircuit } from './equivalent-circuit';
import { inrushCasesOf, surgeFigureA, type DeviceInrush } from './inrush-cases';
import { refinedMax } from './figures';
import { INRUSH_STEP_FRACTION } from './inrush';
import { setDeviceTemperatures } from './network';
import { OverlapIntegrator } from './overlap-integrator';
import { OverlapRecord } from './overlap-record';
import { overlapOptions } from './overlap-shooting';
import type { OverlapSystem } from './overlap-stage';
import { zeros } from './vec';

export interface OverlapInrush {
  peakA: number;
  peakCase: string;
  devices: DeviceInrush[];
  record: OverlapRecord;
}

/** Every case at one corner; undefined when a case ran out of steps. */
export function overlapWorstInrush(c: EquivalentCircuit, sys: OverlapSystem, ambientC: number, relTol = 1e-5): OverlapInrush | undefined {
  const net = sys.net;
  setDeviceTemperatures(net, c.devices.map(() => ambientC));
  const T = net.periodS;
  const durationS = 1 / (2 * c.source.freqHz);
  const p = net.paths[0]!;
  const phi = Math.atan2(p.b, p.a);
  let worst: OverlapInrush | undefined;
  for (const k of inrushCasesOf(c)) {
    const caseSys: OverlapSystem = { ...sys, rOhm: k.seriesROhm };
    const crest = k.polarity === 'positive' ? Math.PI / 2 : (3 * Math.PI) / 2;
    const tOn = ((((crest - phi) / net.omega) % T) + T) % T;
    const record = new OverlapRecord(caseSys);
    const opts = { ...overlapOptions(caseSys, relTol, 20000), sensitivity: false, record, hMaxOnS: T * INRUSH_STEP_FRACTION };
    if (!new OverlapIntegrator(caseSys).run(tOn, tOn + T / 2, zeros(caseSys.n), opts)) return undefined;
    const label = `${k.start} at the ${k.polarity} crest`;
    const devs = net.devices.map((_, d): DeviceInrush => {
      let i2t = 0;
      for (let j = 0; j < record.count; j++) i2t += record.w[j]! * record.deviceCurrentA(j, d) ** 2;
      return { peakA: Math.max(0, refinedMax(record.t, (j) => record.deviceCurrentA(j, d), record.count)), i2tA2s: i2t, case: label };
    });
    const peakA = Math.max(0, ...devs.map((d) => d.peakA));
    if (!worst) { worst = { peakA, peakCase: label, devices: devs, record }; continue; }
    if (peakA > worst.peakA) Object.assign(worst, { peakA, peakCase: label, record });
    worst.devices.forEach((d, i) => {
      const e = devs[i]!;
      if (surgeFigureA(e.peakA, e.i2tA2s, durationS) > surgeFigureA(d.peakA, d.i2tA2s, durationS)) Object.assign(d, e);
    });
  }
  return worst;
}
