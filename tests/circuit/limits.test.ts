/**
 * Inputs that could loop or explode: include cycles, missing files, subcircuits that instantiate
 * themselves, very deep chains. Each ends with a diagnostic (or the right result); the work is
 * bounded by construction (explicit stacks, depth limits, an element cap), so no timing is asserted.
 */
import { describe, expect, it } from 'vitest';
import { flatten, ROOT, wiring } from './check';

describe('include faults', () => {
  it('reports an include cycle on the include card that closes it, and keeps what was read', () => {
    const flat = flatten('cyc\n.include "a.cir"\nR0 x 0 1\n', { 'a.cir': 'R1 a 0 1\n.include "b.cir"\n', 'b.cir': 'R2 b 0 1\n.include "a.cir"\n' });
    expect(flat.diagnostics.map((d) => [d.code, d.uri])).toEqual([['include-cycle', 'file:///work/b.cir']]);
    expect(wiring(flat)).toEqual(['R1: a 0', 'R2: b 0', 'R0: x 0']);
  });
  it('reports a file that includes itself', () => {
    const text = 'self\n.include "root.cir"\n';
    const flat = flatten(text);
    expect(flat.diagnostics.map((d) => [d.code, text.slice(d.span.start, d.span.end)])).toEqual([['include-cycle', '"root.cir"']]);
  });
  it('reports a missing file on the path of its include card', () => {
    const text = 'miss\n.include "nowhere/parts.cir"\nR1 a 0 1\n';
    const flat = flatten(text);
    expect(flat.diagnostics.map((d) => [d.code, d.uri, text.slice(d.span.start, d.span.end)])).toEqual([['missing-include', ROOT, '"nowhere/parts.cir"']]);
    expect(wiring(flat)).toEqual(['R1: a 0']);
  });
});

describe('subcircuits that instantiate themselves', () => {
  it('directly: a diagnostic on the inner X card, no expansion loop', () => {
    const text = 'rec\n.subckt loop a b\nR1 a b 1\nXin a b loop\n.ends\nX1 n1 n2 loop\n';
    const flat = flatten(text);
    const d = flat.diagnostics.filter((x) => x.code === 'recursive-subckt');
    expect(d.map((x) => text.slice(x.span.start, x.span.end))).toEqual(['Xin', 'X1']);
    expect(wiring(flat)).toEqual(['X1.R1: n1 n2']);
  });
  it('indirectly, through another subcircuit', () => {
    const text = 'rec2\n.subckt ping a\nXq a pong\n.ends\n.subckt pong a\nXp a ping\n.ends\nX1 n ping\n';
    const flat = flatten(text);
    const d = flat.diagnostics.find((x) => x.code === 'recursive-subckt')!;
    expect(d.message).toContain('ping → pong → ping');
  });
});

describe('very deep inputs', () => {
  it('a 10,000-deep parameter chain resolves', () => {
    const lines = ['chain', '.param p0=1'];
    for (let i = 1; i < 10_000; i++) lines.push(`.param p${i}={p${i - 1}+1}`);
    lines.push('R1 a 0 {p9999}');
    const flat = flatten(lines.join('\n'));
    expect(flat.elements[0]).toMatchObject({ value: 10_000 });
    expect(flat.diagnostics).toEqual([]);
  });
  it('the same chain written backwards (forward references) resolves', () => {
    const lines = ['chain', 'R1 a 0 {p9999}'];
    for (let i = 9_999; i >= 1; i--) lines.push(`.param p${i}={p${i - 1}+1}`);
    lines.push('.param p0=1');
    expect(flatten(lines.join('\n')).elements[0]).toMatchObject({ value: 10_000 });
  });
  it('a 10,000-long parameter cycle is a diagnostic', () => {
    const lines = ['cycle'];
    for (let i = 0; i < 10_000; i++) lines.push(`.param p${i}={p${(i + 1) % 10_000}+1}`);
    lines.push('R1 a 0 {p0}');
    const flat = flatten(lines.join('\n'));
    expect(flat.diagnostics.some((d) => d.code === 'param-cycle')).toBe(true);
    expect(flat.elements[0]).toMatchObject({ value: undefined });
  });
  it('10,000 nested subcircuits stop at the depth limit with a diagnostic', () => {
    const lines = ['deep'];
    for (let i = 0; i < 10_000; i++) lines.push(`.subckt s${i} a`, `R1 a 0 1`, `X1 a s${i + 1}`, '.ends');
    lines.push('.subckt s10000 a', '.ends', 'X0 top s0');
    const flat = flatten(lines.join('\n'));
    expect(flat.diagnostics.map((d) => d.code)).toEqual(['subckt-depth']);
    expect(flat.elements).toHaveLength(64);
  });
  it('a doubling hierarchy (2^40 elements) is refused at its top instance, counted before anything is built', () => {
    const lines = ['wide'];
    for (let i = 0; i < 40; i++) lines.push(`.subckt w${i} a`, `X1 a w${i + 1}`, `X2 a w${i + 1}`, '.ends');
    lines.push('.subckt w40 a', 'R1 a 0 1', '.ends', 'X0 top w0');
    const flat = flatten(lines.join('\n'), {}, { maxDepth: 64, maxElements: 5_000 });
    expect(flat.diagnostics.map((d) => [d.code, d.message])).toEqual([['circuit-too-large', expect.stringContaining('with X0 (more than 5000 cards once expanded) the flattened circuit passes 5000 elements')]]);
    expect(flat.instances.map((i) => [i.name, i.resolved])).toEqual([['X0', false]]);
    expect(flat.elements).toEqual([]);
  });
  it('a hierarchy that fits is expanded whole: the count before building is exact', () => {
    const lines = ['fits'];
    // w0 → 2 × w1 → 4 × w2: 2 + 4 instance cards and 4 resistors (each body counts whole).
    for (let i = 0; i < 2; i++) lines.push(`.subckt w${i} a`, `X1 a w${i + 1}`, `X2 a w${i + 1}`, '.ends');
    lines.push('.subckt w2 a', 'R1 a 0 1', '.ends', 'X0 top w0');
    expect(flatten(lines.join('\n'), {}, { maxElements: 11 }).elements).toHaveLength(4);
    expect(flatten(lines.join('\n'), {}, { maxElements: 10 }).diagnostics.map((d) => d.code)).toEqual(['circuit-too-large']);
  });
});
