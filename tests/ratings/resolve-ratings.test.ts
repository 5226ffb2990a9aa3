import { describe, expect, it } from 'vitest';
import {
  BV_FALLBACK_NOTE, DEFAULT_IFSM_DURATION_S, createRatingResolver, describeOrigin, resolveRatings, validatePartsFile,
} from '../../server/src/ratings/index';
import type { PartsFile, RatingSources } from '../../server/src/ratings/index';
import { URI, directivesOf, modelsOf, textAt } from './check';

const PARTS_URI = 'file:///work/lib.rectilens-parts.json';

function partsFile(parts: unknown[]): PartsFile {
  const { file, problems } = validatePartsFile({ version: 1, parts }, PARTS_URI);
  expect(problems).toEqual([]);
  return file;
}

// One netlist exercising every layer: an instance directive, a model directive, a parts-file
// entry, a catalog part and a BV fallback. Numbers are arbitrary test data, not part ratings.
const NETLIST = `*@ rate D1 vrrm=900V ifav=0.5A
*@ rate DX ifav=2A ifsm=40A@10ms
*@ rate DX ifav=2.5A
*@ rate DX vds=100V
D1 a b DX
D2 a b DX
D3 a b 1N4004
D4 a b DBV
.model DX D(IS=1n BV=300)
.model 1N4004 D
.model DBV D(BV=250 N=1.8)
`;

function sources(files: PartsFile[] = []): RatingSources {
  return { directives: directivesOf(NETLIST), partsFiles: files };
}

describe('resolveRatings precedence: instance > model > parts file > catalog > BV', () => {
  const dxFile = partsFile([{ name: 'DX', kind: 'diode', technology: 'fast', vrrmV: 400, ifavA: 1, tjmaxC: 175 }]);
  const models = modelsOf(NETLIST);
  const resolve = createRatingResolver(sources([dxFile]));

  it('takes the instance directive over everything', () => {
    const { ratings } = resolve({ kind: 'diode', instanceName: 'd1', model: models.get('dx') });
    expect(ratings.vrrmV?.value).toBe(900);
    expect(ratings.vrrmV?.origin).toMatchObject({ kind: 'rate-directive', target: 'instance', targetName: 'D1' });
    expect(textAt(NETLIST, (ratings.vrrmV!.origin as { span: { start: number; end: number } }).span)).toBe('vrrm=900V');
    // The model directive (ifav=2.5A) names the same key; the instance wins.
    expect(ratings.ifavA?.value).toBe(0.5);
    expect(ratings.ifavA?.origin).toMatchObject({ target: 'instance' });
  });

  it('takes the model directive over the parts file, the later directive winning', () => {
    const { ratings } = resolve({ kind: 'diode', instanceName: 'D2', model: models.get('dx') });
    expect(ratings.vrrmV?.origin.kind).toBe('parts-file'); // no directive gives vrrm for D2
    expect(ratings.vrrmV?.value).toBe(400);
    expect(ratings.ifavA?.value).toBe(2.5);
    expect(ratings.ifavA?.origin).toMatchObject({ kind: 'rate-directive', target: 'model', targetName: 'DX' });
    expect(ratings.tjmaxC?.origin).toMatchObject({ kind: 'parts-file', pointer: '/parts/0/tjmaxC' });
    expect(ratings.technology?.value).toBe('fast');
  });

  it('keeps IFSM and its duration from one source', () => {
    const { ratings } = resolve({ kind: 'diode', instanceName: 'D2', model: models.get('dx') });
    expect(ratings.ifsmA?.value).toBe(40);
    expect(ratings.ifsmDurationS?.value).toBeCloseTo(0.01, 12);
    expect(ratings.ifsmDurationS?.origin).toEqual(ratings.ifsmA?.origin);
  });

  it('reports rating keys that do not apply to the part', () => {
    const { problems } = resolve({ kind: 'diode', instanceName: 'D2', model: models.get('dx') });
    expect(problems).toHaveLength(1);
    expect(problems[0]!.message).toMatch(/vds does not apply to a diode/);
    expect(textAt(NETLIST, problems[0]!.span)).toBe('vds=100V');
  });

  it('falls back to the catalog by model name', () => {
    const { ratings, forwardModel } = resolve({ kind: 'diode', instanceName: 'D3', model: models.get('1n4004') });
    // REFERENCES.md §7 (C): 1N4004 is the 400 V step of the 1 A ladder.
    expect(ratings.vrrmV?.value).toBe(400);
    expect(ratings.vrrmV?.origin).toMatchObject({ kind: 'catalog', confidence: 'confirmed' });
    expect(describeOrigin(ratings.ifsmA!.origin)).toMatch(/from memory, not a check value/);
    expect(forwardModel?.n).toBeGreaterThan(1);
  });

  it('uses .model BV as VRRM only as the last resort, and says so', () => {
    const { ratings } = resolve({ kind: 'diode', instanceName: 'D4', model: models.get('dbv') });
    expect(ratings.vrrmV?.value).toBe(250);
    expect(ratings.vrrmV?.origin).toMatchObject({ kind: 'model-param', param: 'bv', modelName: 'DBV', note: BV_FALLBACK_NOTE });
    expect(textAt(NETLIST, (ratings.vrrmV!.origin as { span: { start: number; end: number } }).span)).toBe('BV=250');
    expect(describeOrigin(ratings.vrrmV!.origin)).toMatch(/BV .*used as VRRM because no rating was given/);
    // BV never overrides a rating from a better source (DX has BV=300 but the parts file says 400).
    expect(resolve({ kind: 'diode', instanceName: 'D2', model: models.get('dx') }).ratings.vrrmV?.value).toBe(400);
  });

  it('lets the parts file override the catalog for a catalog name', () => {
    const file = partsFile([{ name: 'MY4004', aliases: ['1N4004'], kind: 'diode', vrrmV: 450, source: 'our lot test' }]);
    const { ratings } = resolveRatings({ kind: 'diode', model: models.get('1n4004') }, sources([file]));
    expect(ratings.vrrmV?.value).toBe(450);
    expect(ratings.vrrmV?.origin).toMatchObject({ kind: 'parts-file', partName: 'MY4004', pointer: '/parts/0/vrrmV' });
    expect(ratings.ifavA?.origin.kind).toBe('catalog'); // the rest still comes from the catalog
  });

  it('gives IFSM from a source without a duration the 8.3 ms default, said so', () => {
    const file = partsFile([{ name: 'DY', kind: 'diode', ifsmA: 50 }]);
    const { ratings } = resolveRatings({ kind: 'diode', modelName: 'dy' }, { directives: [], partsFiles: [file] });
    expect(ratings.ifsmDurationS?.value).toBe(DEFAULT_IFSM_DURATION_S);
    expect(ratings.ifsmDurationS?.origin).toMatchObject({ kind: 'default', text: expect.stringMatching(/8\.3 ms/) });
  });

  it('returns an empty record when nothing matches', () => {
    const { ratings, forwardModel } = resolveRatings({ kind: 'diode', instanceName: 'D9', modelName: 'nothing' }, { directives: [] });
    expect(ratings).toEqual({ kind: 'diode' });
    expect(forwardModel).toBeUndefined();
  });
});

describe('resolveRatings for other kinds', () => {
  const text = `*@ rate Q1 vds=100V id=20A rdson=8m
*@ rate C1 vrated=400V iripple=1.2A esr=0.3
*@ rate UCTL vmin=4.5V iq=2mA cost=1.2
*@ rate Q1 vrrm=600V
`;
  const resolve = createRatingResolver({ directives: directivesOf(text, URI) });

  it('reads MOSFET, capacitor and controller keys into their records', () => {
    const q = resolve({ kind: 'mosfet', instanceName: 'Q1' });
    expect([q.ratings.vdsV?.value, q.ratings.idA?.value, q.ratings.rdsonOhm?.value]).toEqual([100, 20, 0.008]);
    expect(q.problems.map((p) => p.message)).toEqual(['vrrm does not apply to a mosfet; it is ignored']);
    const c = resolve({ kind: 'capacitor', instanceName: 'c1' });
    expect([c.ratings.vratedV?.value, c.ratings.iRippleA?.value, c.ratings.esrOhm?.value]).toEqual([400, 1.2, 0.3]);
    const u = resolve({ kind: 'controller', instanceName: 'X1', modelName: 'uctl' });
    expect([u.ratings.vminV?.value, u.ratings.iqA?.value, u.ratings.cost?.value]).toEqual([4.5, 0.002, 1.2]);
    expect(u.ratings.vminV?.origin).toMatchObject({ target: 'model' });
  });

  it('takes vf points from a directive and fits a model to them', () => {
    const withVf = createRatingResolver({ directives: directivesOf('*@ rate DV vf=0.93V@1A,0.78V@0.1A\n') });
    const { ratings, forwardModel } = withVf({ kind: 'diode', modelName: 'DV' });
    expect(ratings.vfPoints?.value).toEqual([{ vV: 0.93, iA: 1 }, { vV: 0.78, iA: 0.1 }]);
    // Two points: N = ΔV/(Vt·ln 10) = 0.15/(0.025693·2.3026) = 2.535 at 25 °C (D).
    expect(forwardModel?.n).toBeCloseTo(0.15 / (((1.380649e-23 * 298.15) / 1.602176634e-19) * Math.LN10), 6);
  });
});
