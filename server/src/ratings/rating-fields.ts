/**
 * Which `*@ rate` key fills which field of which part's record. The keys are the IEC 60747 /
 * JEDEC symbols of DESIGN.md §3; `cost` applies to any part.
 */
import type { RatingKey } from '../../../grammar/src/index';
import type { PartKind } from './rating-records';

/** Rating keys by part kind, mapped to the record field they fill. */
export const RATING_FIELDS: Readonly<Record<PartKind, Readonly<Partial<Record<RatingKey, string>>>>> = {
  diode: { vrrm: 'vrrmV', ifav: 'ifavA', ifsm: 'ifsmA', tjmax: 'tjmaxC', rthja: 'rthjaKPerW', vf: 'vfPoints', vfspread: 'vfSpreadV', cost: 'cost' },
  mosfet: { vds: 'vdsV', id: 'idA', rdson: 'rdsonOhm', tjmax: 'tjmaxC', rthja: 'rthjaKPerW', vsd: 'vsdV', cost: 'cost' },
  capacitor: { vrated: 'vratedV', iripple: 'iRippleA', esr: 'esrOhm', tol: 'capTolerance', life: 'capLifeLoss', esrlife: 'esrLifeFactor', endurance: 'endurance', rth: 'rthKPerW', cost: 'cost' },
  controller: { vmin: 'vminV', iq: 'iqA', cost: 'cost', vmax: 'vmaxV' },
};

/** The record field a rating key fills for a part kind, or undefined when it does not apply. */
export function ratingFieldFor(kind: PartKind, key: RatingKey): string | undefined {
  return RATING_FIELDS[kind][key];
}

/** The rating keys a part kind accepts, for completion and for `rate` templates. */
export function ratingKeysFor(kind: PartKind): RatingKey[] {
  return Object.keys(RATING_FIELDS[kind]) as RatingKey[];
}
