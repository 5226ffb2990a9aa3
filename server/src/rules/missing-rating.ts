/**
 * `missing-rating` — fires when a rectifier device or filter capacitor has no rating for a
 * figure the rules check: a diode's VRRM, IF(AV), IFSM or Tjmax; a MOSFET's VDS or Tjmax; a
 * capacitor's rated voltage or ripple current. One finding per part lists what is missing.
 *
 * Why: an unrated part passes every check silently; the designer must know which checks did not run.
 *
 * Severity: a warning when the reverse or rated voltage is missing (the check that matters most
 * on a mains design), information otherwise — our choice. A thermal resistance is not required
 * here: without it Tj is the ambient and the solver notes it. Fix: a `rate` template filled with
 * the minimum values the design needs (fixes/rate-template.ts).
 */
import type { Finding } from '../findings/index';
import type { DeviceView } from './rule-context';
import { capacitorsOf, type CapacitorView } from './capacitor-view';
import { rateTemplateFix } from './fixes/rate-template';
import { devicesOf, placeOf } from './rule-context';
import type { Rule, RuleInput } from './registry';
import { capacitorTemplate, deviceTemplate } from './template-values';

export const missingRatingRule: Rule = {
  code: 'missing-rating',
  check(input) {
    const devices = devicesOf(input).flatMap((view) => deviceFinding(input, view));
    const caps = capacitorsOf(input).flatMap((view) => capacitorFinding(input, view));
    return [...devices, ...caps];
  },
};

function files(input: RuleInput) {
  return input.parsed ?? new Map([[input.rootUri, input.netlist]]);
}

function deviceFinding(input: RuleInput, view: DeviceView): Finding[] {
  const r = view.device.ratings.ratings;
  const wanted: [string, boolean][] = r.kind === 'diode'
    ? [['vrrm', !r.vrrmV], ['ifav', !r.ifavA], ['ifsm', !r.ifsmA], ['tjmax', !r.tjmaxC]]
    : r.kind === 'mosfet' ? [['vds', !r.vdsV], ['tjmax', !r.tjmaxC]] : [];
  const missing = wanted.filter(([, absent]) => absent).map(([k]) => k);
  if (missing.length === 0) return [];
  const { ref, model } = view.device;
  const target = model?.name ?? ref.name;
  const place = model ? { uri: model.uri, span: model.span } : { uri: ref.origin.uri, span: ref.origin.span };
  const fix = rateTemplateFix(target, deviceTemplate(input, view, missing), place, files(input));
  const primary = missing.includes('vrrm') || missing.includes('vds');
  return [{
    ...placeOf(ref.origin, ref.name), severity: primary ? 'warning' : 'info', code: 'missing-rating',
    message: `${ref.name}${model ? ` (model ${model.name})` : ''} has no ${missing.join(', ')} rating: those checks did not run`,
    ...(fix ? { fixes: [fix] } : {}),
  }];
}

function capacitorFinding(input: RuleInput, view: CapacitorView): Finding[] {
  const missing = [['vrated', !view.ratings.vratedV], ['iripple', !view.ratings.iRippleA]].filter(([, a]) => a).map(([k]) => k as string);
  if (missing.length === 0) return [];
  const origin = view.element.origin;
  const fix = rateTemplateFix(view.name, capacitorTemplate(input, view, missing), { uri: origin.uri, span: origin.span }, files(input));
  return [{
    ...placeOf(origin, view.name), severity: missing.includes('vrated') ? 'warning' : 'info', code: 'missing-rating',
    message: `filter capacitor ${view.name} has no ${missing.join(', ')} rating: those checks did not run`,
    ...(fix ? { fixes: [fix] } : {}),
  }];
}
