/**
 * NTC inrush limiters: a resistor rated with a hot resistance (`*@ rate RNTC hot=1ohm`) is taken
 * as an NTC thermistor in the source loop. Its card value is its cold (25 °C) resistance, as an
 * NTC's nominal value is stated (common practice); `hot=` is what it falls to while it carries the
 * running current. The rating names the instance; the last directive in reading order wins.
 */
import type { Directive } from '../../../grammar/src/index';
import type { Rated } from './rating-records';

/** The hot resistance each rated resistor instance has, by lowercase instance name. */
export function limiterHotResistances(directives: readonly { uri: string; directive: Directive }[]): Map<string, Rated<number>> {
  const out = new Map<string, Rated<number>>();
  for (const { uri, directive: d } of directives) {
    if (d.keyword !== 'rate' || !d.target) continue;
    for (const entry of d.entries) {
      if (entry.key !== 'hot' || entry.value === undefined) continue;
      out.set(d.target.text.toLowerCase(), {
        value: entry.value, origin: { kind: 'rate-directive', target: 'instance', targetName: d.target.text, uri, span: entry.span },
      });
    }
  }
  return out;
}
