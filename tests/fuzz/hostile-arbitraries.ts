/**
 * Hostile structure rather than hostile characters: nesting far past every depth limit, include
 * graphs with fan-out, cycles, chains past the include depth and missing targets, and subcircuit
 * hierarchies that multiply ("billion laughs"). Each generator returns plain text or a map of
 * files, small enough to analyse quickly, large enough to cross the limits the analysis has.
 */
import fc from 'fast-check';

/** How deep a generated construct goes: mostly past the limits (32 parentheses, 64 blocks, 200 expression levels), sometimes far past. */
const depth = fc.oneof({ weight: 3, arbitrary: fc.integer({ min: 0, max: 300 }) }, { weight: 1, arbitrary: fc.integer({ min: 300, max: 4_000 }) });

/** An expression nested by one construct repeated `n` times; closed or left open. */
const deepExpression = fc.tuple(fc.constantFrom('paren', 'unary', 'power', 'chain', 'call', 'mixed'), depth, fc.boolean()).map(([shape, n, closed]) => {
  const close = (s: string) => (closed ? s : '');
  switch (shape) {
    case 'paren': return `{${'('.repeat(n)}1${close(')'.repeat(n))}}`;
    case 'unary': return `{${'-+'.repeat(n)}1}`;
    case 'power': return `{${'2^'.repeat(n)}1}`;
    case 'chain': return `{${'1*2+'.repeat(n)}1}`;
    case 'call': return `{${'max(1,'.repeat(n)}1${close(')'.repeat(n))}}`;
    default: return `{${'(1+'.repeat(n)}1${close(')'.repeat(n))}}`;
  }
});

/** A card whose arguments nest parentheses `n` deep, closed or not. */
const deepGroup = fc.tuple(fc.constantFrom('V1 a 0 SIN', 'D1 a b D', '.model DM D', 'R1 a 0 ', 'X1 a b s'), depth, fc.boolean())
  .map(([head, n, closed]) => `${head}${'('.repeat(n)}1${closed ? ')'.repeat(n) : ''}`);

/** `.subckt` (or `.lib` section) blocks opened `n` deep, each with a card, closed or not. */
const deepBlocks = fc.tuple(fc.constantFrom('.subckt s{k} a', '.lib sec{k}'), depth, fc.boolean()).map(([open, n, closed]) => {
  const lines: string[] = [];
  for (let k = 0; k < n; k++) lines.push(open.replace('{k}', String(k)), `R${k} a 0 1`, `X${k} a s${k + 1}`);
  if (closed) for (let k = n - 1; k >= 0; k--) lines.push(open.startsWith('.lib') ? '.endl' : `.ends s${k}`);
  return [...lines, 'X0 top s0'].join('\n');
});

/** A card continued over `n` lines. */
const longContinuation = depth.map((n) => `R1 a 0 {1${'\n+ +1'.repeat(n)}}`);

/** One directive line with many words: valid keys, bad keys or nested junk. */
const wideDirective = fc.tuple(fc.constantFrom('*@ rate DM', '*@ allow', '*@ derate', '*@ mains 230V', '*@ load'), fc.constantFrom('vrrm=600V', 'x=1', 'piv-margin', '((((', 'vr=80%'), fc.integer({ min: 0, max: 5_000 }))
  .map(([head, word, n]) => `${head} ${Array(n).fill(word).join(' ')}`);

/** A netlist made of deep and wide constructs in random order, with a rectifier to analyse among them. */
export const deepNestingText = fc.array(fc.oneof(deepExpression.map((e) => `R9 a 0 ${e}`), deepGroup, deepBlocks, longContinuation, wideDirective), { minLength: 1, maxLength: 4 })
  .map((parts) => ['deep', 'V1 a b SIN(0 325 50)', 'D1 a p DM', 'D2 b p DM', 'D3 0 a DM', 'D4 0 b DM', 'C1 p 0 100u', ...parts, '.model DM D'].join('\n'));

/** A subcircuit hierarchy: `levels` deep, each level instantiating the next `fanOut` times; the leaf holds `leaf` resistors. */
export interface Hierarchy {
  levels: number;
  fanOut: number;
  leaf: number;
  /** Whether the last level instantiates the first again (a recursion the elaborator cuts). */
  recursive: boolean;
}

export const hierarchy: fc.Arbitrary<Hierarchy> = fc.record({
  levels: fc.integer({ min: 1, max: 45 }), fanOut: fc.integer({ min: 1, max: 4 }), leaf: fc.integer({ min: 1, max: 5 }), recursive: fc.boolean(),
});

export function hierarchyText(h: Hierarchy): string {
  const lines = ['laughs'];
  for (let k = 0; k < h.levels; k++) {
    lines.push(`.subckt s${k} a b`, ...Array.from({ length: h.fanOut }, (_, j) => `X${j} a b s${k + 1}`), '.ends');
  }
  lines.push(`.subckt s${h.levels} a b`, ...Array.from({ length: h.leaf }, (_, j) => `R${j} a b 1k`), ...(h.recursive ? ['XR a b s0'] : []), '.ends', 'X0 p q s0');
  return lines.join('\n');
}

/** A set of files that include each other: fan-out, cycles, chains, missing targets, sections and paths of every kind. */
export interface IncludeWorld {
  /** File name (relative to the root's folder) → text. */
  files: Record<string, string>;
  root: string;
}

const includeCard = (names: readonly string[]) => fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(...names).map((n) => `.include "${n}"`) },
  { weight: 2, arbitrary: fc.tuple(fc.constantFrom(...names), fc.constantFrom('sa', 'sb', 'none')).map(([n, s]) => `.lib "${n}" ${s}`) },
  { weight: 1, arbitrary: fc.constantFrom(...names).map((n) => `.inc "./sub/../${n}"`) },
  { weight: 1, arbitrary: fc.constantFrom('.include "missing.cir"', '.include "/nowhere/x.cir"', '.include "file:///elsewhere/y.cir"', '.include ""', '.include "."', '.include "..\\w\\f0.cir"', '.include', '.lib "f0.cir"') },
);

export const includeWorld: fc.Arbitrary<IncludeWorld> = fc.integer({ min: 1, max: 6 }).chain((count) => {
  const names = Array.from({ length: count }, (_, k) => `f${k}.cir`);
  const body = fc.array(fc.oneof(
    { weight: 4, arbitrary: includeCard([...names, 'root.cir']) },
    { weight: 2, arbitrary: fc.nat(99).map((k) => `R${k} a${k % 7} 0 1k`) },
    { weight: 1, arbitrary: fc.constantFrom('.lib sa\nR_sa a 0 1\n.endl', '.lib sb\n.include "f0.cir"\n.endl', '.subckt sx a\n.include "f1.cir"\n.ends\nXS a sx', 'D1 a b DM\n.model DM D') },
  ), { maxLength: 40, size: 'medium' });
  // Sometimes a chain of files each including the next, past the include depth limit (64) or not.
  const chain = fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 90 }));
  return fc.tuple(fc.array(body, { minLength: count, maxLength: count }), body, chain).map(([bodies, rootBody, links]) => {
    const files: Record<string, string> = {};
    names.forEach((n, k) => (files[n] = bodies[k]!.join('\n')));
    for (let k = 0; k < links; k++) files[`c${k}.cir`] = `R_c${k} a 0 1\n${k + 1 < links ? `.include "c${k + 1}.cir"` : ''}`;
    files['root.cir'] = ['world', ...(links ? ['.include "c0.cir"'] : []), ...rootBody].join('\n');
    return { files, root: 'root.cir' };
  });
});
