/**
 * The two ways an edit's move of offsets is made on a posted rectifier: in a copy (`movedByEdit`)
 * and in place (`moveInPlace`, on the main thread's held analysis as it is replaced). Property test
 * over random values shaped like an analysis (spans of the root and of an included file, nested,
 * some objects reached twice as a structured clone leaves them): both give the same values. And the
 * worker's proof that a rectifier only moved (`movedInPlaceMatches`) says yes exactly when the moved
 * copy deep-equals the new value, for new values that equal it or differ by one key or one number.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isDeepStrictEqual } from 'node:util';
import { moveInPlace, movedByEdit, movedInPlaceMatches, type RootEdit } from '../../server/src/lsp/root-edit';

const ROOT = 'file:///root.cir';
const SHARED: ReadonlySet<string> = new Set(['solution']);

type Value = { [key: string]: unknown };

const span = fc.tuple(fc.nat(200), fc.nat(20)).map(([start, length]) => ({ start, end: start + length }));
const node: fc.Arbitrary<Value> = fc.letrec<{ node: Value }>((tie) => ({
  node: fc.record({
    uri: fc.option(fc.constantFrom(ROOT, 'file:///lib.inc'), { nil: undefined }),
    span,
    value: fc.double({ noNaN: true }),
    children: fc.oneof({ depthSize: 'small', withCrossShrink: true }, fc.constant([]), fc.array(tie('node'), { maxLength: 3 })),
  }, { requiredKeys: ['span', 'value', 'children'] }),
})).node;

/** The value with its own span also in a `twin` field (one object reached twice), and solver data beside it. */
function withTwin(value: Value): Value {
  return { ...value, twin: value.span, solution: { start: 1, end: 2 } };
}

describe('an edit moved in place', () => {
  it('equals the move made in a copy, each shared object moved once', () => {
    fc.assert(fc.property(node, fc.nat(220), fc.integer({ min: -30, max: 30 }), (tree, from, delta) => {
      const edit: RootEdit = { uri: ROOT, from, delta };
      const value = withTwin(tree);
      const copy = movedByEdit(structuredClone(value), edit, SHARED);
      const inPlace = structuredClone(value);
      moveInPlace(inPlace, edit, SHARED);
      // The copy moves the twin separately from the span it aliases: the same offsets either way.
      expect(inPlace).toEqual(copy);
      expect(inPlace.twin).toBe(inPlace.span);
      // Shared (solver) data keeps its numbers: it holds no offsets.
      expect(inPlace.solution).toEqual({ start: 1, end: 2 });
    }), { numRuns: 300, seed: 1803 });
  });

  it('is proven by the walk exactly when the moved copy equals the new value', () => {
    // The new value: the moved copy itself, or it with one key added, one removed or one number changed.
    const change = fc.constantFrom('none', 'add', 'remove', 'number');
    fc.assert(fc.property(node, fc.nat(220), fc.integer({ min: -30, max: 30 }), change, (tree, from, delta, how) => {
      const edit: RootEdit = { uri: ROOT, from, delta };
      const now = movedByEdit(structuredClone(tree), edit, SHARED) as Value;
      const target = (now.children as Value[])[0] ?? now;
      if (how === 'add') target.extra = 1;
      if (how === 'remove') delete target.value;
      if (how === 'number') (target.span as { end: number }).end += 1;
      const expected = isDeepStrictEqual(movedByEdit(structuredClone(tree), edit, SHARED), now);
      expect(movedInPlaceMatches(structuredClone(tree), now, edit, SHARED)).toBe(expected);
      if (how === 'none') expect(expected).toBe(true);
    }), { numRuns: 300, seed: 1804 });
  });
});
