/**
 * The minimum rating values a `rate` template proposes, from the part's worst stresses under the
 * policy: VRRM ≥ PIV/vr, IF(AV) ≥ Iavg/if, IFSM (8.3 ms) ≥ surge/ifsm converted at equal I²t,
 * VDS ≥ PIV/vds, rated voltage ≥ the next class above peak/cap, ripple ≥ Irms/ripple. Tjmax is
 * 150 °C, the common class of silicon rectifiers (common practice), or higher when the junction
 * needs it with the default margin.
 */
import { DEFAULT_IFSM_DURATION_S, equivalentSurgeA, junctionLimitC, nextCapacitorVoltageClass } from '../ratings/index';
import type { CapacitorView } from './capacitor-view';
import { ceilTwoDigits } from './fixes/rate-template';
import { groupOf } from './fixes/swap-diode';
import type { RuleInput } from './registry';
import { fmt, policyOf, type DeviceView } from './rule-context';
import { surgeFigureA, surgeStressOf } from './surge-stress';

const CLASS_TJMAX_C = 150;

/** `key=value` entries for a device's missing keys. */
export function deviceTemplate(input: RuleInput, view: DeviceView, missing: readonly string[]): string[] {
  const policy = policyOf(input);
  // A template for a model name covers every device of the rectifier using that model.
  const group = groupOf(view.analysis, view.index).map((index) => ({ ...view, index, worst: view.analysis.solution.devices[index] }));
  const most = (get: (v: DeviceView) => number | undefined) => Math.max(...group.map(get).map((x) => x ?? -Infinity));
  const piv = most((v) => v.worst?.pivV?.value);
  const iavg = most((v) => v.worst?.iavgA?.value);
  const values: Record<string, string | undefined> = {
    vrrm: piv > 0 ? `vrrm=${fmt(ceilTwoDigits(piv / policy.vr.value))}V` : undefined,
    vds: piv > 0 ? `vds=${fmt(ceilTwoDigits(piv / policy.vds.value))}V` : undefined,
    ifav: iavg > 0 ? `ifav=${fmt(ceilTwoDigits(iavg / policy.if.value))}A` : undefined,
    ifsm: surgeEntry(group, policy.ifsm.value),
    tjmax: `tjmax=${fmt(Math.max(...group.map((v) => tjmaxFor(v, input))))}C`,
  };
  return missing.map((k) => values[k]).filter((v): v is string => v !== undefined);
}

/** `key=value` entries for a capacitor's missing keys. */
export function capacitorTemplate(input: RuleInput, view: CapacitorView, missing: readonly string[]): string[] {
  const policy = policyOf(input);
  const classV = view.peakV && nextCapacitorVoltageClass(view.peakV.value / policy.cap.value);
  const values: Record<string, string | undefined> = {
    vrated: classV === undefined ? undefined : `vrated=${fmt(classV)}V`,
    iripple: view.irmsA && `iripple=${fmt(ceilTwoDigits(view.irmsA.value / policy.ripple.value))}A`,
  };
  return missing.map((k) => values[k]).filter((v): v is string => v !== undefined);
}

function surgeEntry(group: readonly DeviceView[], fraction: number): string | undefined {
  const stresses = group.map((v) => surgeStressOf(v.analysis, v.index)).filter((s) => s !== undefined);
  if (stresses.length === 0) return undefined;
  const figureA = Math.max(...stresses.map(surgeFigureA));
  // The IFSM an 8.3 ms rating must state so that, converted to this half-cycle, it covers the surge.
  const at83 = equivalentSurgeA(figureA / fraction, stresses[0]!.durationS, DEFAULT_IFSM_DURATION_S);
  return `ifsm=${fmt(ceilTwoDigits(at83))}A`;
}

function tjmaxFor(view: DeviceView, input: RuleInput): number {
  const tjC = view.worst?.tjC?.value;
  const limit = policyOf(input).tj.value;
  if (tjC === undefined || junctionLimitC(limit, CLASS_TJMAX_C) >= tjC) return CLASS_TJMAX_C;
  return ceilTwoDigits(tjC + (limit.kind === 'below-max' ? limit.marginC : 0));
}
