/**
 * Cost against energy, as cells shared by the HTML table and the terminal: part cost ("no price"
 * where the file prices no part of a construction), typical loss, energy per year and over life,
 * its value, and the payback of each dearer construction against the cheapest priced one.
 */
import type { EnergyComparison, EnergyRow } from '../compare/index';
import { escapeMarkup } from '../presentation/markup';
import { formatFixed, formatSi, trim } from '../presentation/format';

export const NO_PRICE = 'no price';

/** Column heads, and one row of cells per construction. */
export function energyCells(energy: EnergyComparison): { head: string[]; rows: string[][] } {
  const p = energy.profile;
  const priced = p?.pricePerKwh !== undefined;
  const head = ['construction', 'part cost', 'typical loss', ...(p ? ['energy per year', `energy over ${trim(p.years)} years`] : []), ...(priced ? ['its value', 'payback'] : [])];
  const rows = energy.rows.map((r) => [
    r.label,
    r.cost === undefined ? NO_PRICE : formatFixed(r.cost, 2),
    formatSi(r.lossW, 'W'),
    ...(p ? [kwh(r.kwhPerYear), kwh(r.kwhOverLife)] : []),
    ...(priced ? [r.energyCostOverLife === undefined ? '—' : formatFixed(r.energyCostOverLife, 2), paybackWords(r, energy)] : []),
  ]);
  return { head, rows };
}

/** A sentence on the profile the figures assume, or how to give one. */
export function profileSentence(energy: EnergyComparison): string {
  const p = energy.profile;
  if (!p) return 'No operating profile in the file: add e.g. "*@ profile hours=4000h years=10 price=0.25" (price per kWh, in the currency of cost=) for energy and payback.';
  const price = p.pricePerKwh !== undefined ? `, energy at ${formatFixed(p.pricePerKwh, 3)} per kWh (the currency of the file's cost= ratings)` : ', no energy price given';
  return `Energy at the typical operating point (nominal line and ambient), ${trim(p.hoursPerYear)} h a year for ${trim(p.years)} years${price}. Costs are the file's own prices; construction parts it does not price have no price.`;
}

export function renderEnergyHtml(energy: EnergyComparison): string {
  const { head, rows } = energyCells(energy);
  return [
    `<p class="rl-sub">${escapeMarkup(profileSentence(energy))}</p>`,
    '<table class="rl-table rl-energy-table">',
    `<thead><tr>${head.map((h) => `<th scope="col">${escapeMarkup(h)}</th>`).join('')}</tr></thead>`,
    `<tbody>${rows.map((cells, k) => `<tr data-energy="${escapeMarkup(energy.rows[k]!.id)}"><th scope="row">${escapeMarkup(cells[0]!)}</th>${cells.slice(1).map((c) => `<td>${escapeMarkup(c)}</td>`).join('')}</tr>`).join('\n')}</tbody></table>`,
  ].join('\n');
}

function kwh(value: number | undefined): string {
  return value === undefined ? '—' : `${trim(value)} kWh`;
}

function paybackWords(row: EnergyRow, energy: EnergyComparison): string {
  if (row.id === energy.referenceId) return 'cheapest priced: the reference';
  const b = row.payback;
  if (!b) return row.cost === undefined ? NO_PRICE : '—';
  const extra = formatFixed(b.extraCost, 2);
  const saving = formatFixed(b.savingPerYear, 2);
  if (b.kind === 'at-once') return `no dearer, saves ${saving} a year: pays at once`;
  if (b.kind === 'never') return `${extra} more, saves ${saving} a year: never pays back`;
  return `${extra} more, saves ${saving} a year: pays back in ${trim(b.years)} years${b.withinLife ? '' : ', beyond the product\'s life'}`;
}
