/**
 * The minimum rating values a `rate` template proposes, from the part's worst stresses under the
 * policy: VRRM ≥ PIV/vr, IF(AV) ≥ Iavg/if, IFSM (8.3 ms) covering the surge's peak and I²t (/ifsm),
 * VDS ≥ PIV/vds (the stress checks inverted, ratings/stress-checks.ts `leastPassingRatings`),
 * rated voltage ≥ the next class above peak/cap, ripple ≥ Irms/ripple. Tjmax is
 * 150 °C, the common class of silicon rectifiers (common practice), or higher when the junction
 * needs it with the default margin. RθJA, a maximum rather than a minimum, is the largest value
 * that keeps the junction within the policy's limit, proven by a re-solve (fixes/rthja-bound.ts).
 */
import {
  DEFAULT_IFSM_DURATION_S, junctionLimitC, leastIfsmA, leastPassingRatings, nextCapacitorVoltageClass, type StressInputs,
} from '../ratings/index';
import type { CapacitorView } from './capacitor-view';
import { ceilTwoDigits } from './fixes/rate-template';
import { provenRthjaBound } from './fixes/rthja-bound';
import { groupOf } from './fixes/swap-diode';
import type { RuleInput } from './registry';
import { fmt, type DeviceView } from './rule-context';

const CLASS_TJMAX_C = 150;

/** `key=value` entries for a device's missing keys. */
export function deviceTemplate(input: RuleInput, view: DeviceView, missing: readonly string[]): string[] {
  // A template for a model name covers every device of the rectifier using that model.
  const group = groupOf(view.analysis, view.index).map((index): DeviceView => {
    const device = view.analysis.devices[index]!;
    return { ...view, index, device, worst: device.figures.worst };
  });
  const least = leastPassingRatings(groupStress(group), input.policy);
  const tjmaxC = Math.max(...group.map((v) => tjmaxFor(v, input)));
  const entry = (key: string, value: number | undefined, unit: string) => (value === undefined ? undefined : `${key}=${fmt(ceilTwoDigits(value))}${unit}`);
  const values: Record<string, string | undefined> = {
    vrrm: entry('vrrm', least.vrrmV, 'V'),
    vds: entry('vds', least.vdsV, 'V'),
    ifav: entry('ifav', least.ifavA, 'A'),
    // The IFSM an 8.3 ms rating must state so that its peak and its I²t both cover the surge.
    ifsm: least.surge && entry('ifsm', leastIfsmA(least.surge, DEFAULT_IFSM_DURATION_S), 'A'),
    tjmax: `tjmax=${fmt(tjmaxC)}C`,
  };
  if (missing.includes('rthja')) {
    // The Tjmax the junction is held to once the template is in: the part's own, else the template's.
    const rated = Math.min(...group.map((v) => v.device.ratings.ratings.tjmaxC?.value ?? Infinity));
    const rth = provenRthjaBound(view.analysis, group.map((v) => v.index), Number.isFinite(rated) ? rated : tjmaxC, input.policy, input.solve);
    if (rth !== undefined) values.rthja = `rthja=${fmt(rth)}`;
  }
  return missing.map((k) => values[k]).filter((v): v is string => v !== undefined);
}

/** `key=value` entries for a capacitor's missing keys. */
export function capacitorTemplate(input: RuleInput, view: CapacitorView, missing: readonly string[]): string[] {
  const policy = input.policy;
  const classV = view.peakV && nextCapacitorVoltageClass(view.peakV.value / policy.cap.value);
  const values: Record<string, string | undefined> = {
    vrated: classV === undefined ? undefined : `vrated=${fmt(classV)}V`,
    iripple: view.irmsA && `iripple=${fmt(ceilTwoDigits(view.irmsA.value / policy.ripple.value))}A`,
  };
  return missing.map((k) => values[k]).filter((v): v is string => v !== undefined);
}

/** The group's worst stresses: the largest positive PIV and average current, the largest surge figure. */
function groupStress(group: readonly DeviceView[]): StressInputs {
  const most = (get: (v: DeviceView) => number | undefined) => Math.max(...group.map(get).map((x) => x ?? -Infinity));
  const piv = most((v) => v.worst?.pivV?.value);
  const iavg = most((v) => v.worst?.iavgA?.value);
  const worst: NonNullable<StressInputs['worst']> = {};
  if (piv > 0) worst.pivV = { value: piv };
  if (iavg > 0) worst.iavgA = { value: iavg };
  const surges = group.map((v) => v.device.figures.surge).filter((s) => s !== undefined);
  if (surges.length === 0) return { worst };
  const most2 = (get: (s: (typeof surges)[number]) => number) => Math.max(...surges.map(get));
  return { worst, surge: { ...surges[0]!, figureA: most2((s) => s.figureA), peakA: most2((s) => s.peakA), i2tA2s: most2((s) => s.i2tA2s) } };
}

function tjmaxFor(view: DeviceView, input: RuleInput): number {
  const tjC = view.worst?.tjC?.value;
  const limit = input.policy.tj.value;
  if (tjC === undefined || junctionLimitC(limit, CLASS_TJMAX_C) >= tjC) return CLASS_TJMAX_C;
  return ceilTwoDigits(tjC + (limit.kind === 'below-max' ? limit.marginC : 0));
}
