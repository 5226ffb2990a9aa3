/**
 * The capacitor-voltage fix (DESIGN.md §6): raise the capacitor's rated voltage to the lowest
 * standard aluminium-electrolytic class that holds its peak voltage within the policy's `cap`
 * fraction, by editing the `vrated=` entry of the `*@ rate` line that gave the rating. Above the
 * highest class no single electrolytic will do, and no fix is offered.
 */
import type { Fix } from '../../findings/index';
import { CAPACITOR_CLASS_SOURCE, nextCapacitorVoltageClass } from '../../ratings/index';
import type { CapacitorView } from '../capacitor-view';
import { fmt } from '../rule-context';

/** The fix for a capacitor whose peak voltage needs `requiredV` of rating. */
export function raiseCapacitorVoltageFix(view: CapacitorView, requiredV: number): Fix | undefined {
  const rated = view.ratings.vratedV;
  const classV = nextCapacitorVoltageClass(requiredV);
  if (!rated || classV === undefined || rated.origin.kind !== 'rate-directive') return undefined;
  return {
    title: `Raise ${view.name} to the ${fmt(classV)} V class (${CAPACITOR_CLASS_SOURCE})`,
    edits: [{ uri: rated.origin.uri, span: rated.origin.span, newText: `vrated=${fmt(classV)}V` }],
    preferred: true,
  };
}
