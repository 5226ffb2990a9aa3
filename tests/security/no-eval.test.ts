/**
 * Netlist text is never executed: expressions are parsed by our own parser into a closed set of
 * operators and functions, so host-language code written in a value is an expression error.
 */
import { describe, expect, it } from 'vitest';
import { evaluateExpression, parseExpression } from '../../grammar/src/index';
import { analyseText } from '../limits/check';

const HOSTILE = [
  'process.exit(1)', "require('fs')", "constructor.constructor('return 1')()", 'this', 'globalThis.process',
  "eval('1')", 'Function(1)', '(() => 1)()', '`1`', '1; process.exit(1)', 'x[0]', 'a.b.c(1)', 'import(1)',
];

describe('expressions are data, not code', () => {
  it.each(HOSTILE)('{%s} is an error on its card and runs nothing', (source) => {
    const file = analyseText(`hostile\nR1 a 0 {${source}}\nR2 a 0 1k\n`);
    const onR1 = file.findings.filter((f) => f.severity === 'error' && f.span.start >= file.text.indexOf('R1') && f.span.end <= file.text.indexOf('R2'));
    expect(onR1.length).toBeGreaterThan(0);
    expect(file.flat.elements.find((e) => e.name === 'R1')).toMatchObject({ value: undefined });
    expect(file.flat.elements.find((e) => e.name === 'R2')).toMatchObject({ value: 1000 });
  });

  it.each(['constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf'])('the name %s is an undefined parameter, not an object property', (name) => {
    const file = analyseText(`proto\nR1 a 0 {${name}}\n`);
    expect(file.findings.map((f) => f.code)).toContain('undefined-param');
    expect(file.flat.elements[0]).toMatchObject({ value: undefined });
  });

  it('a parameter may be named like an object property and still holds only its number', () => {
    const file = analyseText('proto\n.param constructor=2 __proto__=3\nR1 a 0 {constructor*__proto__}\n');
    expect(file.flat.elements[0]).toMatchObject({ value: 6 });
  });

  it('the parser and evaluator refuse each of them (a parse or evaluation error, never a value)', () => {
    for (const source of HOSTILE) {
      const parsed = parseExpression(source, 0);
      const outcome = parsed.expr ? evaluateExpression(parsed.expr, () => undefined) : parsed;
      expect(outcome.error, source).toBeDefined();
    }
  });
});
