/**
 * Cost against energy: each construction's part cost (from the file's `cost=` ratings; a
 * construction of catalog parts the file does not price has "no price", never an invented one),
 * and with an operating profile (`*@ profile hours= years= price=`) the energy its rectifier loses
 * per year and over the product's life at the typical operating point (the nominal corner), and
 * the payback of each dearer construction against the cheapest priced one: the extra part cost
 * over the yearly value of the energy it saves.
 */
import type { Directive, ProfileDirective } from '../../../grammar/src/index';
import type { ComparisonRow, TopologyComparison } from './compare-topologies';

export interface OperatingProfile {
  hoursPerYear: number;
  years: number;
  /** Price of one kWh in the file's own currency; absent: energy in kWh only, no payback. */
  pricePerKwh?: number;
}

export interface EnergyRow {
  id: ComparisonRow['id'];
  label: string;
  /** Part cost in the file's currency; absent: "no price". */
  cost?: number;
  /** Typical rectifier loss (nominal corner). */
  lossW?: number;
  kwhPerYear?: number;
  kwhOverLife?: number;
  /** Value of the energy lost over life, in the file's currency. */
  energyCostOverLife?: number;
  /** Against the reference row: the extra part cost, the yearly saving and the payback in years. */
  payback?: Payback;
}

export type Payback =
  | { kind: 'years'; years: number; extraCost: number; savingPerYear: number; withinLife: boolean }
  | { kind: 'at-once'; extraCost: number; savingPerYear: number }
  | { kind: 'never'; extraCost: number; savingPerYear: number };

export interface EnergyComparison {
  profile?: OperatingProfile;
  /** The row paybacks are counted against: the cheapest priced construction. */
  referenceId?: ComparisonRow['id'];
  rows: EnergyRow[];
}

/** The file's operating profile: the last `*@ profile` with hours and years. */
export function operatingProfileOf(directives: readonly { directive: Directive }[]): OperatingProfile | undefined {
  const found = directives.map((d) => d.directive).filter((d): d is ProfileDirective => d.keyword === 'profile' && d.hoursPerYear !== undefined && d.years !== undefined).pop();
  if (!found) return undefined;
  return { hoursPerYear: found.hoursPerYear!, years: found.years!, ...(found.pricePerKwh !== undefined ? { pricePerKwh: found.pricePerKwh } : {}) };
}

export function compareEnergy(comparison: TopologyComparison, profile: OperatingProfile | undefined): EnergyComparison {
  const rows = comparison.rows.filter((r) => r.applicable).map((r): EnergyRow => {
    const row: EnergyRow = { id: r.id, label: r.label };
    if (r.cost !== undefined) row.cost = r.cost;
    if (r.typicalLossW !== undefined) row.lossW = r.typicalLossW;
    if (profile && row.lossW !== undefined) {
      row.kwhPerYear = (row.lossW * profile.hoursPerYear) / 1000;
      row.kwhOverLife = row.kwhPerYear * profile.years;
      if (profile.pricePerKwh !== undefined) row.energyCostOverLife = row.kwhOverLife * profile.pricePerKwh;
    }
    return row;
  });
  const priced = rows.filter((r) => r.cost !== undefined && r.lossW !== undefined);
  // The cheapest priced construction (the bridge as drawn first among equals): every dearer one must earn its extra cost back.
  const reference = [...priced].sort((a, b) => a.cost! - b.cost! || Number(b.id === 'as-drawn') - Number(a.id === 'as-drawn'))[0];
  const price = profile?.pricePerKwh;
  if (reference && profile && price !== undefined) {
    for (const row of priced) {
      if (row === reference) continue;
      row.payback = paybackOf(row.cost! - reference.cost!, ((reference.lossW! - row.lossW!) * profile.hoursPerYear * price) / 1000, profile.years);
    }
  }
  return { ...(profile ? { profile } : {}), ...(reference ? { referenceId: reference.id } : {}), rows };
}

function paybackOf(extraCost: number, savingPerYear: number, years: number): Payback {
  if (extraCost <= 0 && savingPerYear >= 0) return { kind: 'at-once', extraCost, savingPerYear };
  if (extraCost > 0 && savingPerYear > 0) {
    const y = extraCost / savingPerYear;
    return { kind: 'years', years: y, extraCost, savingPerYear, withinLife: y <= years };
  }
  return { kind: 'never', extraCost, savingPerYear };
}
