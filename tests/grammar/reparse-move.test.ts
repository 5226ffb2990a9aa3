import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { listOffsetsAhead, parseNetlist, type Netlist } from '../../grammar/src/index';
import { MAX_BLOCK_DEPTH } from '../../grammar/src/structure';
import { netlistText } from '../fuzz/netlist-arbitrary';

// A re-parse that may consume the previous tree moves the cards after the edit instead of copying
// them; it must still equal a fresh parse, and the moved cards must be the very same objects.

const SOURCE = `Move fixture (our own)
.param r0=50
V1 a b SIN(0 325 50) ; source
R1 p 0 {r0}
+ tc=0
*@ rate D1 vrrm=600V ifav=1A
D1 a p DX
C1 p 0 100u
`;

/** Each object of a tree at most once, except frozen shared empties: moving offsets in place relies on it. */
function repeatedObjects(netlist: Netlist): number {
  const seen = new Set<object>();
  let repeated = 0;
  const walk = (value: unknown): void => {
    if (value === null || typeof value !== 'object' || (Array.isArray(value) && Object.isFrozen(value))) return;
    if (seen.has(value)) { repeated++; return; }
    seen.add(value);
    for (const field of Object.values(value)) walk(field);
  };
  walk(netlist.cards);
  walk(netlist.comments);
  return repeated;
}

/** Applies each edit in turn, re-parsing from the last tree (consumed; `beforeEach` sees it first), and holds each result equal to a fresh parse. */
function editChainMatchesFreshParses(text: string, steps: readonly { at: number; cut: number; insert: string }[], beforeEach?: (previous: Netlist) => void): void {
  let current = text;
  let previous = parseNetlist(current);
  for (const { at, cut, insert } of steps) {
    beforeEach?.(previous);
    const start = at % (current.length + 1);
    current = current.slice(0, start) + insert + current.slice(Math.min(current.length, start + cut));
    const incremental = parseNetlist(current, { previous, consumePrevious: true });
    expect(incremental).toEqual(parseNetlist(current));
    previous = incremental;
  }
}

describe('re-parsing with consumePrevious', () => {
  it('keeps the cards after the edit as the same objects, moved', () => {
    const previous = parseNetlist(SOURCE);
    const last = previous.cards[previous.cards.length - 1]!;
    const oldStart = last.span.start;
    const next = parseNetlist(SOURCE.replace('{r0}', '{r0*2}'), { previous, consumePrevious: true });
    expect(next.cards[next.cards.length - 1]).toBe(last);
    expect(last.span.start).toBe(oldStart + 2); // '*2' inserted before it
    expect(next).toEqual(parseNetlist(SOURCE.replace('{r0}', '{r0*2}')));
  });

  it('copies by default, leaving the previous tree as it was', () => {
    const previous = parseNetlist(SOURCE);
    const before = structuredClone(previous);
    const next = parseNetlist(SOURCE.replace('{r0}', '{r0*2}'), { previous });
    expect(previous).toEqual(before);
    expect(next.cards[next.cards.length - 1]).not.toBe(previous.cards[previous.cards.length - 1]);
  });

  it('holds no object twice in a tree, so each offset is moved once (fast-check)', () => {
    fc.assert(fc.property(netlistText, (text) => { expect(repeatedObjects(parseNetlist(text))).toBe(0); }), { seed: 20261205, numRuns: 200 });
    expect(repeatedObjects(parseNetlist(SOURCE))).toBe(0);
  });

  it('equals a fresh parse after any chain of random edits, each consuming the last tree (fast-check)', () => {
    const piece = fc.oneof(fc.constantFrom('\n', '+', '*', '*@ ', ' ', '.ends', '.end\n', 'R1 a b 1', '{', '(', ')', '\n+ x=1', ';'), fc.string({ maxLength: 6 }));
    const edit = fc.record({ at: fc.nat(), cut: fc.nat({ max: 12 }), insert: piece });
    fc.assert(
      fc.property(fc.oneof(netlistText, fc.constant(SOURCE)), fc.array(edit, { minLength: 1, maxLength: 6 }), (text, steps) => editChainMatchesFreshParses(text, steps)),
      { seed: 20261206, numRuns: 200, endOnFailure: true },
    );
  });

  it('equals a fresh parse when each tree\'s offsets were listed ahead, in chunks, before the edit that moves it (fast-check)', () => {
    const edit = fc.record({ at: fc.nat(), cut: fc.nat({ max: 12 }), insert: fc.constantFrom('\n', 'R9 q 0 1\n', '* note\n', 'x', '') });
    fc.assert(
      fc.property(fc.oneof(netlistText, fc.constant(SOURCE)), fc.array(edit, { minLength: 1, maxLength: 5 }), fc.integer({ min: 1, max: 7 }), (text, steps, chunk) => {
        editChainMatchesFreshParses(text, steps, (previous) => {
          let next = 0;
          let turns = 0;
          while (next >= 0) { next = listOffsetsAhead(previous, next, chunk); turns++; }
          expect(turns).toBe(Math.max(1, Math.ceil(previous.cards.length / chunk)));
        });
      }),
      { seed: 20261207, numRuns: 150, endOnFailure: true },
    );
  });

  it('reports definitions nested too deep once after a re-parse, as a fresh parse does', () => {
    const depth = MAX_BLOCK_DEPTH + 2;
    const text = 'Deep fixture\n' + Array.from({ length: depth }, (_, i) => `.subckt S${i} a`).join('\n') + '\nR1 a 0 1\n' + '.ends\n'.repeat(depth) + 'R2 a 0 1\n';
    const edited = text.replace('R2 a 0 1', 'R2 a 0 2');
    for (const consumePrevious of [false, true]) {
      const incremental = parseNetlist(edited, { previous: parseNetlist(text), consumePrevious });
      expect(incremental).toEqual(parseNetlist(edited));
      expect(incremental.diagnostics.filter((d) => d.code === 'subckt-depth')).toHaveLength(1);
    }
  });
});
