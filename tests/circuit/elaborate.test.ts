/** Elaboration: parameter scopes, hierarchical names, ground aliases, origins, models. */
import { describe, expect, it } from 'vitest';
import { anchorOf, type FlatElement } from '../../server/src/circuit/index';
import { flatten, ROOT, wiring } from './check';

function valueOf(elements: FlatElement[], name: string): number | undefined {
  const e = elements.find((x) => x.name === name);
  return e && 'value' in e ? e.value : undefined;
}

describe('parameter scopes', () => {
  const flat = flatten(`scopes
.param gain={rload/2} rload=2k
.subckt stage in out r=100 c=1u
.param rr={r*2}
R1 in mid {rr}
C1 mid out {c}
.ends
X1 a b stage
X2 b c stage r=10
X3 c d stage r={rload} c={gain*1n}
R9 d 0 {gain}
`);
  it.each([
    ['R9', 1000, 'a global, defined after the one that uses it'],
    ['X1.R1', 200, 'the subcircuit default, through a body .param'],
    ['X2.R1', 20, 'an instance override'],
    ['X3.R1', 4000, 'an override evaluated in the caller scope (global rload)'],
    ['X1.C1', 1e-6, 'a default'],
    ['X3.C1', 1e-6, 'an override from a global expression'],
  ])('%s = %d (%s)', (name, value) => {
    expect(valueOf(flat.elements, name)).toBeCloseTo(value, 12);
  });
  it('reports nothing', () => expect(flat.diagnostics).toEqual([]));
});

describe('flattening', () => {
  const flat = flatten(`hierarchy
.subckt inner p q
R1 p n 1
R2 n GND 1
.ends
.subckt outer x y
X2 x m inner
R3 m y 1
.ends
X1 a Gnd outer
R4 a 0 1
`);
  it('names elements and internal nodes by the instance path; ports map to the outer nodes; gnd is ground', () => {
    expect(wiring(flat)).toEqual([
      'X1.X2.R1: a x1.x2.n',
      'X1.X2.R2: x1.x2.n 0',
      'X1.R3: x1.m 0',
      'R4: a 0',
    ]);
  });
  it('keeps the origin: the card in its file, and the chain of X cards from the root', () => {
    const r1 = flat.elements[0]!;
    expect(r1.origin.chain.map((s) => s.name)).toEqual(['X1', 'X2']);
    expect(anchorOf(r1.origin).uri).toBe(ROOT);
    const text = `hierarchy\n`;
    expect(anchorOf(r1.origin).span.start).toBeGreaterThan(text.length);
    expect(r1.terminals.map((t) => t.text)).toEqual(['p', 'n']);
  });
});

describe('origins across files', () => {
  const flat = flatten(`across\n.include "lib/bridge.cir"\nX1 ac1 ac2 out 0 DB\n`, {
    'lib/bridge.cir': '.subckt DB a b p n\nD1 a p DL\n.model DL D(IS=1n)\n.ends\n',
  });
  it('points the element at the library card and its anchor at the X card in the root', () => {
    const d1 = flat.elements.find((e) => e.name === 'X1.D1')!;
    expect(d1.origin.uri).toBe('file:///work/lib/bridge.cir');
    const anchor = anchorOf(d1.origin);
    expect(anchor.uri).toBe(ROOT);
    expect(`across\n.include "lib/bridge.cir"\nX1 ac1 ac2 out 0 DB\n`.slice(anchor.span.start, anchor.span.end)).toBe('X1');
  });
  it('gives a model local to a subcircuit a key under the instance', () => {
    expect(d1Model(flat.elements)).toBe('x1.dl');
    expect(flat.models.get('x1.dl')?.params).toEqual({ is: 1e-9 });
  });
  it('lists the dependencies, the root first', () => {
    expect(flat.dependencies).toEqual([ROOT, 'file:///work/lib/bridge.cir']);
  });
});

function d1Model(elements: FlatElement[]): string | undefined {
  const d = elements.find((e) => e.name === 'X1.D1');
  return d?.kind === 'diode' ? d.model : undefined;
}

describe('sources', () => {
  it('reads SIN with SPICE defaults, DC and AC', () => {
    const flat = flatten('src\nV1 a 0 SIN(1 325 50)\nV2 b 0 DC 5 AC 1\nV3 c 0 PULSE(0 1 0 1n 1n 1m 2m)\n');
    const [v1, v2, v3] = flat.elements;
    expect(v1).toMatchObject({ kind: 'vsource', dc: 0, sine: { offset: 1, amplitude: 325, freqHz: 50, delayS: 0, dampingPerS: 0, phaseDeg: 0 } });
    expect(v2).toMatchObject({ kind: 'vsource', dc: 5, acMagnitude: 1 });
    expect(v3).toMatchObject({ kind: 'vsource', otherWaveform: 'pulse' });
  });
});

describe('faults in the hierarchy', () => {
  const text = 'faults\n.subckt two a b\nR1 a b 1\n.ends\nX1 n1 two\nX2 n1 n2 nothere\nD1 n1 0 nomodel\n';
  const flat = flatten(text);
  it.each([
    ['port-count', 'X1'],
    ['unknown-subckt', 'nothere'],
    ['unknown-model', 'nomodel'],
  ])('%s on %s', (code, under) => {
    const d = flat.diagnostics.find((x) => x.code === code)!;
    expect(d).toBeDefined();
    expect(text.slice(d.span.start, d.span.end)).toBe(under);
  });
  it('keeps a black-box instance with its ports', () => {
    expect(flat.instances.find((i) => i.name === 'X2')).toMatchObject({ resolved: false, subckt: 'nothere' });
  });
});

describe('parameter diagnostics across files', () => {
  it('lands each in its own file even when offsets coincide', () => {
    const flat = flatten('*\n.param a=1\n.include "p.cir"\n', { 'p.cir': '*\n.param b={zz}\n' });
    expect(flat.diagnostics.map((d) => [d.code, d.uri])).toEqual([['undefined-param', 'file:///work/p.cir']]);
  });
});
