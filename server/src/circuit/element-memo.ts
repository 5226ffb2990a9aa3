/**
 * A top-level element card's flat element, kept with the card for the next elaboration. The
 * language server's re-parse moves the cards an edit did not touch into the new tree (the same
 * objects, offsets moved in place), and every span of such an element is one of its card's, so the
 * element describes the moved card as well as a new one would. Most cards of a large netlist are
 * such cards, and building their elements again was most of an edit's elaboration.
 *
 * Kept only when the element is a function of its card alone: built at the top level of a file,
 * with no finding and no parameter looked up (a literal value); a device's model is looked up again
 * on every use. A card that changed is a new object and misses. Values equal to a fresh build, so
 * the elaboration's result does not depend on what was kept (tests/analysis/incremental.test.ts).
 */
import { key } from '../../../grammar/src/index';
import type { FindingSet } from '../findings/index';
import { buildElement, type Frame } from './elements';
import type { FlatElement } from './flat-circuit';

type ElementCard = Parameters<typeof buildElement>[0];

const kept = new WeakMap<ElementCard, { uri: string; element: FlatElement }>();

/** Counts the parameter look-ups of the top-level scope, so that a card that made none is known. */
export interface LookupCounter {
  lookups: number;
}

/** The flat element of a top-level card: the kept one when it still stands, else built (and kept when it may be). */
export function topLevelElement(card: ElementCard, frame: Frame, sink: FindingSet, counter: LookupCounter): FlatElement {
  const was = kept.get(card);
  if (was && was.uri === frame.uri && sameModel(card, was.element, frame)) return was.element;
  const lookups = counter.lookups;
  const offered = sink.offered;
  const element = buildElement(card, frame, sink);
  if (counter.lookups === lookups && sink.offered === offered) kept.set(card, { uri: frame.uri, element });
  else kept.delete(card);
  return element;
}

/** A device's model resolves as it did when the element was built (a `.model` may have been added, renamed or removed since). */
function sameModel(card: ElementCard, element: FlatElement, frame: Frame): boolean {
  if (card.kind !== 'diode' && card.kind !== 'mosfet') return true;
  const model = (element as { model?: string }).model;
  return card.model === undefined ? model === undefined : frame.modelKey(key(card.model)) === model;
}
