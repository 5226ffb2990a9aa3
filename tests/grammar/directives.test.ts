import { describe, expect, it } from 'vitest';
import { parseNetlist, type Directive } from '../../grammar/src/index';

function directives(text: string) {
  const netlist = parseNetlist(`t\n${text}\n`);
  const records = netlist.cards.flatMap((c) => (c.kind === 'directive' && c.directive ? [c.directive] : []));
  return { records, diagnostics: netlist.diagnostics, text: netlist.text };
}

function one<K extends Directive['keyword']>(text: string, keyword: K): Extract<Directive, { keyword: K }> {
  const { records, diagnostics } = directives(text);
  expect(diagnostics).toEqual([]);
  expect(records[0]!.keyword).toBe(keyword);
  return records[0] as Extract<Directive, { keyword: K }>;
}

describe('directives', () => {
  it('mains: voltage, frequency, asymmetric and symmetric tolerance, phases', () => {
    expect(one('*@ mains 230V 50Hz tol=-15%,+10%', 'mains')).toMatchObject({ vrms: 230, freqHz: 50, tolLow: -0.15, tolHigh: 0.1 });
    expect(one('*@ mains 120V 60Hz tol=10%', 'mains')).toMatchObject({ vrms: 120, freqHz: 60, tolLow: -0.1, tolHigh: 0.1 });
    expect(one('*@ mains 400V 50Hz phases=3', 'mains')).toMatchObject({ vrms: 400, phases: 3 });
  });

  it('ambient: a nominal..maximum range or one temperature', () => {
    expect(one('*@ ambient 25C..60C', 'ambient')).toMatchObject({ nominalC: 25, maxC: 60 });
    expect(one('*@ ambient 40C', 'ambient')).toMatchObject({ nominalC: 40, maxC: 40 });
    expect(one('*@ ambient -20C..85C', 'ambient')).toMatchObject({ nominalC: -20, maxC: 85 });
  });

  it('load: power, current or resistance by unit, and vmin', () => {
    expect(one('*@ load 45W vmin=250V', 'load')).toMatchObject({ load: { kind: 'power', w: 45 }, vminV: 250 });
    expect(one('*@ load 0.8A', 'load')).toMatchObject({ load: { kind: 'current', a: 0.8 } });
    expect(one('*@ load 33ohm', 'load')).toMatchObject({ load: { kind: 'resistance', ohm: 33 } });
    expect(one('*@ load 4.7kohm', 'load')).toMatchObject({ load: { kind: 'resistance', ohm: 4700 } });
    expect(one('*@ load 150mA', 'load').load).toMatchObject({ kind: 'current' });
  });

  it('rate: every diode key, with vf points and a 10 ms surge duration', () => {
    const rate = one('*@ rate DMAIN vrrm=600V ifav=1A ifsm=30A@10ms tjmax=150C rthja=60 vf=0.93V@1A,0.78V@0.1A cost=0.02', 'rate');
    expect(rate.target!.text).toBe('DMAIN');
    const byKey = Object.fromEntries(rate.entries.map((e) => [e.key, e]));
    expect(byKey.vrrm!.value).toBe(600);
    expect(byKey.ifav!.value).toBe(1);
    expect(byKey.ifsm!.value).toBe(30);
    expect(byKey.ifsm!.durationS).toBeCloseTo(0.01, 12);
    expect(byKey.tjmax!.value).toBe(150);
    expect(byKey.rthja!.value).toBe(60);
    expect(byKey.vf!.points).toEqual([{ vV: 0.93, iA: 1 }, { vV: 0.78, iA: 0.1 }]);
    expect(byKey.cost!.value).toBe(0.02);
  });

  it('rate: MOSFET, capacitor and controller keys; K/W written out is not read as kilo', () => {
    const mosfet = one('*@ rate QSYNC vds=60V id=10A rdson=25mohm tjmax=175C rthja=62K/W vsd=0.8V', 'rate');
    const values = Object.fromEntries(mosfet.entries.map((e) => [e.key, e.value]));
    expect(values).toMatchObject({ vds: 60, id: 10, tjmax: 175, rthja: 62, vsd: 0.8 });
    expect(values.rdson).toBeCloseTo(0.025, 12);
    const cap = one('*@ rate C1 vrated=400V iripple=1.2A esr=0.3ohm', 'rate');
    expect(cap.entries.map((e) => [e.key, e.value])).toEqual([['vrated', 400], ['iripple', 1.2], ['esr', 0.3]]);
    const ctl = one('*@ rate XCTL vmin=9V iq=2mA', 'rate');
    expect(ctl.entries.map((e) => e.key)).toEqual(['vmin', 'iq']);
  });

  it('derate: fractions and a junction limit', () => {
    const derate = one('*@ derate vr=80% if=70% tj=125C cap=80%', 'derate');
    expect(derate.entries.map((e) => [e.key, e.value])).toEqual([['vr', 0.8], ['if', 0.7], ['tj', 125], ['cap', 0.8]]);
  });

  it('rate: an NTC limiter’s hot resistance, a capacitor’s endurance at a temperature and its thermal resistance', () => {
    const ntc = one('*@ rate RNTC hot=1.5ohm', 'rate');
    expect(ntc.entries.map((e) => [e.key, e.value])).toEqual([['hot', 1.5]]);
    const cap = one('*@ rate CB endurance=5kh@105C rth=25', 'rate');
    expect(cap.entries.map((e) => [e.key, e.value, e.atC])).toEqual([['endurance', 5000, 105], ['rth', 25, undefined]]);
  });

  it('derate: a capacitor life in hours', () => {
    expect(one('*@ derate life=50000h', 'derate').entries.map((e) => [e.key, e.value])).toEqual([['life', 50000]]);
  });

  it('reports an endurance without its temperature, a non-positive hot value and a life that is no number of hours', () => {
    const { diagnostics, text } = directives('*@ rate CB endurance=5000h\n*@ rate RNTC hot=0\n*@ derate life=80%\n*@ rate CB endurance=5000h@hot');
    expect(diagnostics.map((d) => text.slice(d.span.start, d.span.end))).toEqual(['endurance=5000h', 'hot=0', '80%', 'hot']);
    expect(diagnostics[0]!.message).toContain('endurance=5000h@105C');
  });

  it('allow: one or more finding codes', () => {
    expect(one('*@ allow piv-margin surge-rating', 'allow').codes.map((c) => c.text)).toEqual(['piv-margin', 'surge-rating']);
  });

  it('reports a wrong unit on the exact value, in our own words', () => {
    const { diagnostics, text } = directives('*@ rate DMAIN vrrm=600A');
    expect(diagnostics).toHaveLength(1);
    expect(text.slice(diagnostics[0]!.span.start, diagnostics[0]!.span.end)).toBe('600A');
    expect(diagnostics[0]!.message).toBe("expected a voltage such as 230V, got '600A'");
  });

  it('reports unknown keys, unknown directives and missing values', () => {
    const { diagnostics, text } = directives('*@ rate DMAIN vrrm=600V foo=3\n*@ colour red\n*@ load\n*@ derate vr=120%');
    expect(diagnostics.map((d) => [d.severity, text.slice(d.span.start, d.span.end)])).toEqual([
      ['error', 'foo=3'], ['warning', 'colour'], ['error', '*@ load'], ['error', '120%'],
    ]);
  });

  it('leaves ordinary comments alone', () => {
    expect(directives('* @ not a directive\n*not either').records).toEqual([]);
  });
});
