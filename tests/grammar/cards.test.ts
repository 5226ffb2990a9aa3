import { describe, expect, it } from 'vitest';
import { parseNetlist, type Card, type Netlist } from '../../grammar/src/index';

function parse(text: string): Netlist {
  return parseNetlist(text);
}

function only<K extends Card['kind']>(netlist: Netlist, kind: K): Extract<Card, { kind: K }>[] {
  return netlist.cards.filter((c): c is Extract<Card, { kind: K }> => c.kind === kind);
}

const slice = (n: Netlist, span: { start: number; end: number }) => n.text.slice(span.start, span.end);

describe('cards', () => {
  it('reads a title line, then R, C and L cards with exact ranges', () => {
    const n = parse('Demo title\nR1 a b 10k\nC2 b 0 100uF ic=0\nL3 a 0 {2*1m}\n');
    expect(n.title?.text).toBe('Demo title');
    expect(n.diagnostics).toEqual([]);
    const [r, c, l] = only(n, 'passive');
    expect(r!.letter).toBe('R');
    expect(slice(n, r!.name.span)).toBe('R1');
    expect(r!.nodes.map((x) => slice(n, x.span))).toEqual(['a', 'b']);
    expect(r!.value!.number).toBe(10_000);
    expect(slice(n, r!.value!.span)).toBe('10k');
    expect(c!.params[0]!.name.text).toBe('ic');
    expect(l!.value!.form).toBe('expression');
    expect(slice(n, l!.span)).toBe('L3 a 0 {2*1m}');
  });

  it('takes a first line that parses cleanly as a card, not as a title', () => {
    const n = parse('R1 a b 10\nR2 b 0 10\n');
    expect(n.title).toBeUndefined();
    expect(only(n, 'passive')).toHaveLength(2);
  });

  it('reads diodes with a model and an optional area, MOSFETs with four nodes', () => {
    const n = parse('t\nD1 in out DMAIN\nD2 a k DX 2\nM1 d g s b NCH W=10u L=1u\n');
    const [d1, d2] = only(n, 'diode');
    expect(d1!.nodes.map((x) => x.text)).toEqual(['in', 'out']);
    expect(d1!.model!.text).toBe('DMAIN');
    expect(d2!.area!.number).toBe(2);
    const [m] = only(n, 'mosfet');
    expect(m!.nodes.map((x) => x.text)).toEqual(['d', 'g', 's', 'b']);
    expect(m!.model!.text).toBe('NCH');
    expect(m!.params.map((p) => p.name.text)).toEqual(['W', 'L']);
    expect(m!.params[0]!.value!.number).toBeCloseTo(10e-6, 18);
  });

  it('reads V and I sources: DC, AC and SIN(VO VA FREQ TD THETA PHASE)', () => {
    const n = parse('t\nV1 a 0 SIN(0 325 50 0 0 90)\nV2 b 0 DC 5 AC 1 45\nI1 c 0 0.5\nV3 d 0 dc=3\n');
    const [v1, v2, i1, v3] = only(n, 'source');
    expect(v1!.waveform!.name.text).toBe('SIN');
    expect(v1!.waveform!.args.map((a) => a.number)).toEqual([0, 325, 50, 0, 0, 90]);
    expect(v2!.dc!.number).toBe(5);
    expect(v2!.acMagnitude!.number).toBe(1);
    expect(v2!.acPhase!.number).toBe(45);
    expect(i1!.letter).toBe('I');
    expect(i1!.dc!.number).toBe(0.5);
    expect(v3!.params[0]!.name.text).toBe('dc');
  });

  it('reads K couplings and X instances with parameter overrides', () => {
    const n = parse('t\nK1 LP LS 0.99\nX1 a b p n BRIDGE rs=1\n');
    const [k] = only(n, 'coupling');
    expect(k!.inductors.map((x) => x.text)).toEqual(['LP', 'LS']);
    expect(k!.coefficient!.number).toBe(0.99);
    const [x] = only(n, 'instance');
    expect(x!.nodes.map((y) => y.text)).toEqual(['a', 'b', 'p', 'n']);
    expect(x!.subckt!.text).toBe('BRIDGE');
    expect(x!.params[0]!.value!.number).toBe(1);
  });

  it('keeps unknown element letters as opaque cards with a hint', () => {
    const n = parse('t\nQ1 c b e NPN\n');
    expect(only(n, 'opaque')[0]!.words.map((w) => w.text)).toEqual(['c', 'b', 'e', 'NPN']);
    expect(n.diagnostics).toMatchObject([{ severity: 'hint', code: 'unknown-element' }]);
  });

  it('reads .model with parenthesised, comma-separated or bare parameter lists', () => {
    const n = parse('t\n.model D1 D(IS=1n N=1.8)\n.model D2 D (IS=2n, RS=0.1)\n.model D3 D IS=3n BV=600\n.model SW VSWITCH\n');
    const models = only(n, 'model');
    expect(models.map((m) => [m.name!.text, m.type!.text, m.params.map((p) => p.name.text).join(' ')])).toEqual([
      ['D1', 'D', 'IS N'], ['D2', 'D', 'IS RS'], ['D3', 'D', 'IS BV'], ['SW', 'VSWITCH', ''],
    ]);
    expect(models[2]!.params[1]!.value!.number).toBe(600);
    expect(n.diagnostics).toEqual([]);
  });

  it('joins continuation lines into the card above', () => {
    const n = parse('t\n.model DX D(IS=1n\n+ N=1.9\n+ RS=0.2)\nR1 a b\n+ 10\n');
    const [model] = only(n, 'model');
    expect(model!.params.map((p) => p.name.text)).toEqual(['IS', 'N', 'RS']);
    expect(only(n, 'passive')[0]!.value!.number).toBe(10);
    expect(n.diagnostics).toEqual([]);
  });

  it('skips full-line and trailing comments, keeps them as ranges', () => {
    const text = 't\n* a comment\nR1 a b 10 ; trailing\nR2 a b 20 $ also trailing\n  * indented comment\n';
    const n = parse(text);
    expect(only(n, 'passive').map((r) => r.value!.number)).toEqual([10, 20]);
    expect(n.comments.map((c) => slice(n, c))).toEqual(['* a comment', '; trailing', '$ also trailing', '* indented comment']);
  });

  it('is case-insensitive for keywords and element letters', () => {
    const n = parse('t\n.SUBCKT top a\nr1 a 0 1K\n.ENDS\n.Model dd d\n.END\n');
    expect(n.items.map((i) => i.kind)).toEqual(['subckt-block', 'model', 'end']);
    expect(n.diagnostics).toEqual([]);
  });

  it('nests .subckt blocks and reads ports and default parameters', () => {
    const n = parse('t\n.subckt outer a b params: r=10\n.subckt inner x y\nR1 x y 1\n.ends inner\nX1 a b inner\n.ends outer\n');
    const [outer] = n.items;
    expect(outer!.kind).toBe('subckt-block');
    if (outer!.kind !== 'subckt-block') return;
    expect(outer.header.name!.text).toBe('outer');
    expect(outer.header.ports.map((p) => p.text)).toEqual(['a', 'b']);
    expect(outer.header.params[0]!.name.text).toBe('r');
    expect(outer.body.map((i) => i.kind)).toEqual(['subckt-block', 'instance']);
    expect(outer.ends!.name!.text).toBe('outer');
  });

  it('reports an unclosed .subckt and a stray .ends', () => {
    const n = parse('t\n.ends\n.subckt open a\nR1 a 0 1\n');
    expect(n.diagnostics.map((d) => [d.code, slice(n, d.span)])).toEqual([
      ['unmatched-end', '.ends'], ['unclosed-block', '.subckt'],
    ]);
  });

  it('reads .param, .include, .lib references and sections, and keeps other dot cards', () => {
    const n = parse('t\n.param a=1 b={a+1}\n.include "parts/diodes.lib"\n.inc models.cir\n.lib "lib/main.lib" fast\n.lib fast\n.endl\n.tran 1u 40m\n.end\n');
    expect(only(n, 'param')[0]!.params.map((p) => p.name.text)).toEqual(['a', 'b']);
    expect(only(n, 'include').map((c) => c.path!.text)).toEqual(['parts/diodes.lib', 'models.cir']);
    const [ref, section] = only(n, 'lib');
    expect([ref!.path!.text, ref!.section!.text]).toEqual(['lib/main.lib', 'fast']);
    expect([section!.path, section!.section!.text]).toEqual([undefined, 'fast']);
    expect(n.items.map((i) => i.kind)).toEqual(['param', 'include', 'include', 'lib', 'lib-section', 'control', 'end']);
    expect(only(n, 'control')[0]!.keyword.text).toBe('.tran');
  });

  it('ignores cards after .end with a hint', () => {
    const n = parse('t\nR1 a 0 1\n.end\nR2 a 0 2\n');
    expect(only(n, 'passive')).toHaveLength(1);
    expect(n.diagnostics).toMatchObject([{ code: 'after-end', severity: 'hint' }]);
  });

  it('treats node names that look like numbers as nodes', () => {
    const n = parse('t\nR1 1 2 3\n');
    expect(only(n, 'passive')[0]!.nodes.map((x) => x.text)).toEqual(['1', '2']);
  });
});
