/**
 * Resistor tolerances (`*@ rate RB1 tol=1%`, or `tol=-1%,+2%`), by lowercase instance name: the
 * balancing resistors of a series capacitor string set its DC share, so their spread moves it.
 * The rating names the instance; the last directive in reading order wins. A resistor without one
 * is taken at its card value.
 */
import type { Directive } from '../../../grammar/src/index';
import type { Rated } from './rating-records';

export function resistorTolerances(directives: readonly { uri: string; directive: Directive }[]): Map<string, Rated<readonly [number, number]>> {
  const out = new Map<string, Rated<readonly [number, number]>>();
  for (const { uri, directive: d } of directives) {
    if (d.keyword !== 'rate' || !d.target) continue;
    for (const entry of d.entries) {
      if (entry.key !== 'tol' || !entry.range) continue;
      out.set(d.target.text.toLowerCase(), {
        value: entry.range, origin: { kind: 'rate-directive', target: 'instance', targetName: d.target.text, uri, span: entry.span },
      });
    }
  }
  return out;
}
