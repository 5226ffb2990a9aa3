/**
 * Thermal resistance (issue 16, item 7): a catalog diode takes its package's default RθJA (typical,
 * from memory, and said so in its origin), and its junction temperature is then the solver's
 * Tj = Ta + P·RθJA (DESIGN.md §5), checked here by hand from the solver's own loss; a device with
 * no RθJA anywhere gets a missing-rating finding saying its junction temperature was not checked,
 * whose template proposes an RθJA that passes. Fixtures of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { DIODE_CATALOG, PACKAGE_RTHJA_K_PER_W, describeOrigin, findCatalogDiode } from '../../server/src/ratings/index';
import { devicesAtCard } from '../../server/src/editor/rectifier-lookup';
import { stressHover } from '../../server/src/editor/stress-hover';
import { analyseText, applyFix, findingsOf, fixTitled } from './check';

/** The stress hover of the card named `name`. */
function hoverOf(file: ReturnType<typeof analyseText>, name: string): string {
  const card = file.netlist.cards.find((c) => 'name' in c && c.name?.text === name)!;
  return stressHover(file, devicesAtCard(file, card.span));
}
import { bridge } from './fixtures';

describe('catalog entries carry a package and its RθJA', () => {
  it('every entry has the RθJA of its package, from memory, with the package named in the origin', () => {
    for (const entry of DIODE_CATALOG) {
      const rth = entry.ratings.rthjaKPerW!;
      expect(rth.value).toBe(PACKAGE_RTHJA_K_PER_W[entry.packageName]);
      expect(rth.origin).toMatchObject({ kind: 'catalog', confidence: 'from-memory' });
      expect(describeOrigin(rth.origin)).toContain(`${entry.packageName} package`);
      expect(describeOrigin(rth.origin)).toContain('from memory');
    }
    expect(findCatalogDiode('1N4007')!.packageName).toBe('DO-41');
    expect(findCatalogDiode('1N5408')!.packageName).toBe('DO-201AD');
  });
});

describe('a catalog diode\'s junction temperature', () => {
  // The rule fixtures' 230 V bridge on 1N4007 parts at 150 W, with no rate line: every rating, RθJA included, is
  // the catalog's. 150 W draws about 0.5 A, so each diode dissipates some tenths of a watt: a rise of several kelvin.
  const text = bridge({ diode: '', load: '150W' }).replace(/ DR$/gm, ' 1N4007').replace('.model DR D(IS=5n N=1.8 RS=0.05)', '.model 1N4007 D');

  it('is Ta + P·RθJA with the solver\'s loss and the DO-41 default, at every corner', () => {
    const file = analyseText(text);
    const analysis = file.rectifiers[0]!;
    const rthja = PACKAGE_RTHJA_K_PER_W['DO-41'];
    for (const device of analysis.devices) {
      expect(device.ratings.ratings.rthjaKPerW?.value).toBe(rthja);
      expect(device.figures.rthjaKPerW).toBe(rthja);
      for (const at of device.figures.corners) {
        const ambientC = analysis.corners.find((c) => c.name === at.corner)!.ambientC;
        const { lossW, tjC } = at.figures!;
        expect(lossW).toBeGreaterThan(0);
        // Tj = Ta + P·RθJA (DESIGN.md §5): the loop stops within 0.1 K of its fixed point (solve/thermal.ts),
        // and the loss it reports is the one solved at that Tj, so the identity holds to that tolerance.
        expect(Math.abs(tjC! - (ambientC + lossW! * rthja))).toBeLessThan(0.1);
        expect(tjC! - ambientC).toBeGreaterThan(5);
      }
    }
    // The hover names where the value comes from.
    expect(describeOrigin(analysis.devices[0]!.ratings.ratings.rthjaKPerW!.origin)).toContain('typical RθJA of the DO-41 package');
    expect(hoverOf(file, 'D1')).toContain('RθJA 50 K/W: built-in catalog 1N4007 (typical RθJA of the DO-41 package');
  });

  it('no missing-rating finding for the catalog part (its RθJA is known)', () => {
    expect(findingsOf(analyseText(text), 'missing-rating').filter((f) => /^D\d/.test(f.message))).toEqual([]);
  });

  it('a rate line with rthja overrides the package default', () => {
    const file = analyseText(text.replace('*@ mains 230V 50Hz', '*@ mains 230V 50Hz\n*@ rate 1N4007 rthja=30'));
    expect(file.rectifiers[0]!.devices[0]!.ratings.ratings.rthjaKPerW).toMatchObject({ value: 30, origin: { kind: 'rate-directive' } });
  });
});

describe('a device with no RθJA anywhere', () => {
  const text = bridge({ diode: 'vrrm=600V ifav=1A ifsm=60A tjmax=150C', load: '150W' });

  it('gets missing-rating saying its junction temperature was not checked, and Tj stays the ambient', () => {
    const file = analyseText(text);
    const found = findingsOf(file, 'missing-rating').filter((f) => /^D\d/.test(f.message));
    expect(found).toHaveLength(4);
    expect(found[0]!.severity).toBe('info');
    expect(found[0]!.message).toContain('has no rthja rating');
    expect(found[0]!.message).toContain('its junction temperature was not checked');
    const device = file.rectifiers[0]!.devices[0]!;
    const hot = device.figures.worst!.tjC!;
    expect(hot.value).toBe(file.rectifiers[0]!.corners.find((c) => c.name === hot.corner)!.ambientC);
    expect(findingsOf(file, 'junction-temp')).toEqual([]);
    expect(hoverOf(file, 'D1')).toContain('**No RθJA:** the junction temperature is taken as the ambient and was not checked.');
  });

  it('the template proposes the largest RθJA the junction limit allows, and applied, the finding is gone and Tj passes', () => {
    const file = analyseText(text);
    const fix = fixTitled(findingsOf(file, 'missing-rating').find((f) => f.message.startsWith('D1')), 'Insert a rate line for DR');
    const rth = Number(/rthja=([\d.]+)/.exec(fix.title)![1]);
    // (Tlimit − Ta)/P with the default limit min(125 °C, Tjmax − 20 °C) = 125 °C (IPC-9592B, from memory), Ta 50 °C
    // at the hot corners (solve/corners.ts) and P the solver's worst loss, rounded down to two digits.
    const lossW = Math.max(...file.rectifiers[0]!.devices.map((d) => d.figures.worst!.lossW!.value));
    const bound = (125 - 50) / lossW;
    expect(rth).toBeLessThanOrEqual(bound);
    // At most one halving of the first guess: the loss of a silicon diode barely changes with Tj.
    expect(rth).toBeGreaterThan(0.4 * bound);
    const fixed = applyFix(text, fix);
    const after = analyseText(fixed);
    expect(findingsOf(after, 'missing-rating').filter((f) => /^D\d/.test(f.message))).toEqual([]);
    expect(findingsOf(after, 'junction-temp')).toEqual([]);
    const tj = after.rectifiers[0]!.devices.map((d) => d.figures.worst!.tjC!.value);
    expect(Math.max(...tj)).toBeLessThanOrEqual(125);
    expect(Math.max(...tj)).toBeGreaterThan(50);
  });
});
