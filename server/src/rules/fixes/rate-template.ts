/**
 * The rate-template fix (DESIGN.md §6): a `*@ rate` line for a part that lacks ratings, filled
 * with the minimum values this design needs under the policy — so the designer sees what to look
 * for in a datasheet — under a comment that says so. Values are rounded up to two significant
 * digits. The line goes above the part's `.model` card (a rate line for a model name covers every
 * device using it), else above the device's own card. A template that proposes an RθJA proves it
 * by re-solving (rthja-bound.ts), so it is offered as a plan whose values are computed when chosen.
 */
import type { Fix, FixPlan } from '../../findings/index';
import type { Place } from '../../circuit/index';
import type { Netlist } from '../../../../grammar/src/index';
import { insertLinesBefore } from './text-edits';

/** Rounds up to two significant digits: 445 → 450, 0.123 → 0.13. */
export function ceilTwoDigits(value: number): number {
  if (!(value > 0)) return 0;
  const step = 10 ** (Math.floor(Math.log10(value)) - 1);
  return Number((Math.ceil(value / step - 1e-9) * step).toPrecision(2));
}

/** The comment written above a template. */
export const TEMPLATE_NOTE = '* minimum ratings this design needs (Rectilens template): replace them with the part\'s datasheet values';

/** A fix inserting `*@ rate TARGET key=value…` above `place`. */
export function rateTemplateFix(target: string, entries: readonly string[], place: Place, files: ReadonlyMap<string, Netlist>): Fix | undefined {
  const text = files.get(place.uri)?.text;
  if (text === undefined || entries.length === 0) return undefined;
  return {
    title: `Insert a rate line for ${target} (${entries.join(' ')}; check them against the datasheet)`,
    edits: [insertLinesBefore(place.uri, text, place.span.start, [TEMPLATE_NOTE, `*@ rate ${target} ${entries.join(' ')}`])],
  };
}

/**
 * The template as a plan when its values need a re-solve (`solves`), else as the finished fix:
 * `entries` is called only when the plan is verified.
 */
export function rateTemplatePlan(
  target: string, entries: () => readonly string[], place: Place, files: ReadonlyMap<string, Netlist>, solves: boolean,
): Fix | FixPlan | undefined {
  if (!solves) return rateTemplateFix(target, entries(), place, files);
  if (files.get(place.uri)?.text === undefined) return undefined;
  return {
    title: `Insert a rate line for ${target} with the minimum ratings this design needs and the largest RθJA a re-solve confirms`,
    key: `rate-template|${place.uri}|${place.span.start}|${target}`,
    unverified: 'no rating could be proposed for it',
    verify: () => rateTemplateFix(target, entries(), place, files),
  };
}
