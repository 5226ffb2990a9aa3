import { describe, expect, it } from 'vitest';
import { evaluateExpression, parseExpression, parseNetlist, resolveParams, type ParamDefinition } from '../../grammar/src/index';

/** The `.param` definitions of a netlist, in order. */
function definitionsOf(text: string): ParamDefinition[] {
  return parseNetlist(text).cards.flatMap((c) =>
    c.kind === 'param' ? c.params.map((p) => ({ name: p.name.text.toLowerCase(), value: p.value, span: p.span })) : [],
  );
}

function evaluate(text: string, names: Record<string, number> = {}): number | undefined {
  const parsed = parseExpression(text);
  expect(parsed.error).toBeUndefined();
  return evaluateExpression(parsed.expr!, (n) => names[n]).value;
}

describe('expressions (our own evaluator, never eval)', () => {
  it('follows the usual precedence and associativity (analytic)', () => {
    expect(evaluate('1 + 2 * 3')).toBe(7);
    expect(evaluate('(1 + 2) * 3')).toBe(9);
    expect(evaluate('2 ^ 3 ^ 2')).toBe(512); // right-associative: 2^(3^2)
    expect(evaluate('2 ** 3')).toBe(8);
    expect(evaluate('-2 ^ 2')).toBe(-4);
    expect(evaluate('10 / 4 - 1')).toBe(1.5);
  });

  it('reads SPICE suffixes inside expressions', () => {
    expect(evaluate('2 * 1k')).toBe(2000);
    expect(evaluate('1meg / 1m')).toBeCloseTo(1e9, 3);
  });

  it('knows sqrt exp ln log log10 abs min max pow and pi', () => {
    expect(evaluate('sqrt(2) * sqrt(2)')).toBeCloseTo(2, 14);
    expect(evaluate('ln(exp(3))')).toBeCloseTo(3, 14);
    expect(evaluate('log(exp(1))')).toBeCloseTo(1, 14);
    expect(evaluate('log10(1000)')).toBeCloseTo(3, 14);
    expect(evaluate('abs(-4) + min(1, 2) + max(1, 2) + pow(2, 10)')).toBe(4 + 1 + 2 + 1024);
    expect(evaluate('2 * pi * 50')).toBeCloseTo(314.159265, 5);
  });

  it('looks parameter names up case-insensitively', () => {
    expect(evaluate('VPK / sqrt(2)', { vpk: 325 })).toBeCloseTo(229.81, 2);
  });

  it('reports unknown names and functions with their ranges', () => {
    const parsed = parseExpression('a + nope(1)', 10);
    expect(parsed.error).toMatchObject({ start: 14, end: 18 });
    const unknown = evaluateExpression(parseExpression('x + 1', 0).expr!, () => undefined);
    expect(unknown.error).toMatchObject({ message: "unknown parameter 'x'", start: 0, end: 1 });
  });

  it('refuses nesting deeper than its limit instead of overflowing the stack', () => {
    const deep = '('.repeat(5000) + '1' + ')'.repeat(5000);
    expect(parseExpression(deep).error?.message).toMatch(/nested deeper/);
  });
});

describe('.param resolution', () => {
  it('allows forward references', () => {
    const defs = definitionsOf('t\n.param rload={2*r0} vout={r0*0.1}\n.param r0=50\n');
    const { values, diagnostics } = resolveParams(defs);
    expect(diagnostics).toEqual([]);
    expect(values.get('rload')).toBe(100);
    expect(values.get('vout')).toBe(5);
  });

  it('reports a cycle on each parameter in it, and does not hang', () => {
    const text = 't\n.param a={b+1} b={c+1} c={a+1} d=4\n';
    const { values, diagnostics } = resolveParams(definitionsOf(text));
    expect(values.get('d')).toBe(4);
    expect(values.has('a')).toBe(false);
    const cycle = diagnostics.filter((d) => d.code === 'param-cycle');
    expect(cycle).toHaveLength(3);
    expect(cycle[0]!.message).toMatch(/a → b → c → a|b → c → a → b|c → a → b → c/);
  });

  it('reports a self-reference', () => {
    const { diagnostics } = resolveParams(definitionsOf('t\n.param x={x*2}\n'));
    expect(diagnostics.map((d) => d.code)).toEqual(['param-cycle']);
  });

  it('resolves a 10,000-deep chain without recursion', () => {
    const lines = ['t', '.param p0=1'];
    for (let i = 1; i <= 10_000; i++) lines.push(`.param p${i}={p${i - 1}+1}`);
    const { values, diagnostics } = resolveParams(definitionsOf(lines.reverse().join('\n').replace(/^(.*)$/, 't\n$1')));
    expect(diagnostics).toEqual([]);
    expect(values.get('p10000')).toBe(10_001);
  });

  it('takes names from an outer scope and reports missing ones', () => {
    const { values, diagnostics } = resolveParams(definitionsOf('t\n.param y={x*2} z={w}\n'), (n) => (n === 'x' ? 21 : undefined));
    expect(values.get('y')).toBe(42);
    expect(diagnostics).toMatchObject([{ code: 'undefined-param', message: "unknown parameter 'w'" }]);
  });

  it('refuses non-finite results such as 1/0 or 1e400', () => {
    const { values, diagnostics } = resolveParams(definitionsOf('t\n.param a={1/0} b=1e400\n'));
    expect(values.size).toBe(0);
    expect(diagnostics.map((d) => d.code)).toEqual(['bad-value', 'bad-value']);
  });
});
