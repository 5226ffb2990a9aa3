/**
 * Cost against energy (server/src/compare/energy-cost.ts): the file's own part prices per
 * construction ("no price" for what it does not price), the energy the rectifier loses per year
 * and over life under `*@ profile`, and the payback of the dearer construction — each figure
 * re-derived here from the comparison's own losses and the file's prices.
 */
import { describe, expect, it } from 'vitest';
import { parseDirective } from '../../grammar/src/index';
import { memoisedSolver } from '../../server/src/solve/index';
import { compareEnergy, compareTopologies, operatingProfileOf } from '../../server/src/compare/index';
import { energyCells } from '../../server/src/report/energy-table';
import { analyseText } from './bench-12v';

/** A hybrid bridge of our own (12 V, 1 A), its diodes and MOSFETs priced in the file's currency. */
const HYBRID = `12 V hybrid bridge, priced (a scenario of our own invention)
*@ load 1A
*@ profile hours=4000h years=10 price=0.30
*@ rate DSI vrrm=100V ifav=3A ifsm=100A tjmax=150C rthja=60 vf=0.95V@1A,0.78V@0.1A cost=0.05
*@ rate NSR vds=40V id=10A rdson=20m tjmax=150C rthja=60 cost=0.30
V1 ac1 ac2 SIN(0 16.97 50)
RW ac1 a1 0.25
D1 a1 out DSI
D2 ac2 out DSI
M3 a1 ac2 0 0 NSR
M4 ac2 a1 0 0 NSR
C1 out 0 4700u
.model DSI D
.model NSR NMOS(rdson=20m)
.end
`;

describe('the operating profile directive', () => {
  it('reads hours a year, years and the price of a kWh', () => {
    const p = parseDirective('*@ profile hours=4000h years=10 price=0.30', 0);
    expect(p.diagnostics).toEqual([]);
    expect(p.directive).toMatchObject({ keyword: 'profile', hoursPerYear: 4000, years: 10, pricePerKwh: 0.3 });
  });
  it('refuses more hours than a year has (8784 in a leap year, D), unknown keys and empty profiles', () => {
    expect(parseDirective('*@ profile hours=9000h years=10', 0).diagnostics.map((d) => d.message)).toEqual(["hours are the operating hours per year, above zero and at most 8784; got '9000h'"]);
    expect(parseDirective('*@ profile life=10', 0).diagnostics.map((d) => d.code)).toEqual(['directive-error']);
    expect(parseDirective('*@ profile', 0).diagnostics.map((d) => d.code)).toEqual(['directive-error']);
  });
});

describe('cost against energy', () => {
  const file = analyseText(HYBRID);
  const comparison = compareTopologies(file.rectifiers[0]!, file.policy, memoisedSolver(new Map()));
  const profile = operatingProfileOf(file.flat.directives);
  const energy = compareEnergy(comparison, profile);
  const row = (id: string) => energy.rows.find((r) => r.id === id)!;
  const loss = (id: string) => comparison.rows.find((r) => r.id === id)!.typicalLossW!;

  it('prices each construction from the file\'s own cost= ratings and says "no price" for the rest', () => {
    expect(profile).toEqual({ hoursPerYear: 4000, years: 10, pricePerKwh: 0.3 });
    // As drawn and the hybrid variant: 2 × 0.05 + 2 × 0.30; silicon: 4 × 0.05 (the file's silicon diode's price).
    expect(row('as-drawn').cost).toBeCloseTo(0.7, 12);
    expect(row('hybrid').cost).toBeCloseTo(0.7, 12);
    expect(row('silicon').cost).toBeCloseTo(0.2, 12);
    // No Schottky part and no controller in the file: nothing is invented.
    expect(row('schottky').cost).toBeUndefined();
    expect(row('synchronous').cost).toBeUndefined();
    const { head, rows } = energyCells(energy);
    expect(rows[energy.rows.indexOf(row('synchronous'))]![head.indexOf('part cost')]).toBe('no price');
  });

  it('gives the energy lost per year and over life at the nominal corner\'s loss', () => {
    for (const r of energy.rows) {
      // kWh a year = W × h / 1000; over life × years (D).
      expect(r.kwhPerYear).toBeCloseTo((loss(r.id) * 4000) / 1000, 12);
      expect(r.kwhOverLife).toBeCloseTo((loss(r.id) * 4000 * 10) / 1000, 12);
      expect(r.energyCostOverLife).toBeCloseTo((loss(r.id) * 4000 * 10 * 0.3) / 1000, 12);
    }
    expect(loss('as-drawn')).toBeGreaterThan(0.1);
  });

  it('pays the dearer hybrid back against the cheapest priced construction (silicon)', () => {
    expect(energy.referenceId).toBe('silicon');
    const saving = ((loss('silicon') - loss('as-drawn')) * 4000 * 0.3) / 1000;
    const payback = row('as-drawn').payback!;
    expect(payback.kind).toBe('years');
    // Payback = extra cost / the yearly value of the energy saved (D).
    expect(payback.extraCost).toBeCloseTo(0.5, 12);
    expect(payback.savingPerYear).toBeCloseTo(saving, 12);
    if (payback.kind === 'years') {
      expect(payback.years).toBeCloseTo(0.5 / saving, 9);
      expect(payback.withinLife).toBe(0.5 / saving <= 10);
      console.log(`hybrid over silicon at 1 A: saves ${saving.toFixed(3)} a year, pays back in ${payback.years.toFixed(2)} years`);
    }
  });

  it('without a profile gives cost and loss only', () => {
    const bare = compareEnergy(comparison, undefined);
    expect(bare.rows.every((r) => r.kwhPerYear === undefined && r.payback === undefined)).toBe(true);
    expect(energyCells(bare).head).toEqual(['construction', 'part cost', 'typical loss']);
  });
});
