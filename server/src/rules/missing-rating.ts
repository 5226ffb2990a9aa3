/**
 * `missing-rating` — fires when a rectifier device or filter capacitor has no rating for a
 * figure the rules check: a diode's VRRM, IF(AV), IFSM, Tjmax or RθJA; a MOSFET's VDS, Tjmax or
 * RθJA; a capacitor's rated voltage or ripple current. One finding per part lists what is missing.
 *
 * Why: an unrated part passes every check silently; the designer must know which checks did not run.
 *
 * Severity: a warning when the reverse or rated voltage is missing (the check that matters most
 * on a mains design), information otherwise — our choice. A device without RθJA is named too: its
 * Tj is only the ambient, so its junction temperature was not checked. Fix: a `rate` template
 * filled with the minimum values the design needs (fixes/rate-template.ts), and the largest RθJA
 * that keeps the junction within the policy; for a device whose model name is not defined, the
 * rename to the nearest defined model instead (circuit/did-you-mean.ts), never invented ratings
 * for a misspelt name.
 */
import type { Origin } from '../circuit/index';
import { withLazyFixes, type Finding } from '../findings/index';
import type { DeviceView } from './rule-context';
import { capacitorsOf, type CapacitorView } from './capacitor-view';
import { rateTemplateFix, rateTemplatePlan } from './fixes/rate-template';
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
    ? [['vrrm', !r.vrrmV], ['ifav', !r.ifavA], ['ifsm', !r.ifsmA], ['tjmax', !r.tjmaxC], ['rthja', !r.rthjaKPerW]]
    : r.kind === 'mosfet' ? [['vds', !r.vdsV], ['tjmax', !r.tjmaxC], ['rthja', !r.rthjaKPerW]] : [];
  const missing = wanted.filter(([, absent]) => absent).map(([k]) => k);
  if (missing.length === 0) return [];
  const { ref, model } = view.device;
  const target = model?.name ?? ref.name;
  const place = model ? { uri: model.uri, span: model.span } : { uri: ref.origin.uri, span: ref.origin.span };
  const primary = missing.includes('vrrm') || missing.includes('vds');
  // A device whose model name is not defined: the rename the elaboration found is the fix, never
  // invented ratings for the misspelt name (they would hide the typo).
  const unknown = unknownModelOf(input, ref.origin);
  const renames = unknown?.fixes ?? [];
  const junction = missing.includes('rthja') ? '; without RθJA its junction temperature was not checked (taken as the ambient)' : '';
  const named = unknown ? ` (its model '${textOf(input, unknown)}' is not defined)` : model ? ` (model ${model.name})` : '';
  const finding: Finding = {
    ...placeOf(ref.origin, ref.name), severity: primary ? 'warning' : 'info', code: 'missing-rating',
    message: `${ref.name}${named} has no ${missing.join(', ')} rating: those checks did not run${junction}`,
  };
  // The template may re-solve (to prove an RθJA), so it is computed when the editor asks.
  return [withLazyFixes(finding, () => (renames.length
    ? renames.map((fix) => ({ ...fix }))
    : [rateTemplatePlan(target, () => deviceTemplate(input, view, missing), place, files(input), missing.includes('rthja'))]))];
}

const unknownModels = new WeakMap<RuleInput, Finding[]>();

/** The `unknown-model` finding of the elaboration on a device's card, if its model name is not defined. */
function unknownModelOf(input: RuleInput, origin: Origin): Finding | undefined {
  let found = unknownModels.get(input);
  if (!found) unknownModels.set(input, (found = input.flat.diagnostics.filter((f) => f.code === 'unknown-model')));
  return found.find((f) => f.uri === origin.uri && f.span.start >= origin.span.start && f.span.end <= origin.span.end);
}

/** The text a finding points at, in its file. */
function textOf(input: RuleInput, finding: Finding): string {
  return files(input).get(finding.uri)?.text.slice(finding.span.start, finding.span.end) ?? '';
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
