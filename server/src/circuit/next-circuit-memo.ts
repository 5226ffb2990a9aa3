/**
 * One value kept from a root's flat circuit for the next flat circuit of the same root, found by
 * the card the first element came from: that card's span object, which an edit below the card
 * leaves the same (the re-parse moves the card, and a rebuilt element keeps its card's span). The
 * entry is a candidate, never an answer: whoever takes it checks that it still fits the new circuit.
 * Keyed weakly, so it goes with the tree it came from.
 */
import type { FlatElement } from './flat-circuit';

export class NextCircuitMemo<T> {
  private readonly kept = new WeakMap<object, T>();

  /** What was kept for the circuit of these elements' root, if anything. */
  get(elements: readonly FlatElement[]): T | undefined {
    const anchor = elements[0]?.origin.span;
    return anchor && this.kept.get(anchor);
  }

  /** Keeps `value` for the root's next circuit (nothing for a circuit without elements). */
  set(elements: readonly FlatElement[], value: T): void {
    const anchor = elements[0]?.origin.span;
    if (anchor) this.kept.set(anchor, value);
  }
}
