/**
 * `no-rectifier` — fires when a file has an AC voltage source (a SIN source with a non-zero
 * amplitude) and diodes or MOSFETs, yet recognition found no rectifier and no near miss.
 *
 * Why: everything Rectilens checks hangs on a recognised rectifier. A wrong node name in one
 * device card (a typo), a device the wrong way round in a pattern that is not a near miss, or a
 * topology we do not know all end the same way: nothing is checked, and without this finding the
 * file would pass. An error, so that `rectilens check` fails; a designer whose diodes really
 * rectify nothing (a clamp, a detector) accepts it with `*@ allow no-rectifier`.
 *
 * Not raised when the recognition budget ran out (that finding says so already).
 */
import { anchorOf, type SourceElement } from '../circuit/index';
import type { Finding } from '../findings/index';
import type { RecognizeContext } from './context';

export const NO_RECTIFIER_CODE = 'no-rectifier';

/** How many devices the message names before "and N more". */
const NAMED = 4;

/** The finding for a file whose AC source and rectifying devices form no recognised rectifier. */
export function noRectifierFinding(ctx: RecognizeContext, recognised: number): Finding[] {
  if (recognised > 0 || ctx.exhausted || ctx.devices.length === 0) return [];
  const source = ctx.flat.elements.find((e): e is SourceElement => e.kind === 'vsource' && (e.sine?.amplitude ?? 0) !== 0);
  if (!source) return [];
  const devices = ctx.devices.map((d) => d.element);
  const first = devices[0]!;
  const names = devices.slice(0, NAMED).map((d) => d.name).join(', ') + (devices.length > NAMED ? ` and ${devices.length - NAMED} more` : '');
  const kinds = [...new Set(ctx.devices.map((d) => (d.type === 'diode' ? 'diodes' : 'MOSFETs')))].join(' and ');
  return [{
    ...anchorOf(first.origin), severity: 'error', code: NO_RECTIFIER_CODE,
    message: `no rectifier was recognised among the ${kinds} (${names}) although ${source.name} is an AC source: nothing in this file was checked; ` +
      'look for a wrong node name in a device card, or allow this code if no device here rectifies',
    related: [{ ...anchorOf(source.origin), message: `${source.name}: the AC source` }],
  }];
}
