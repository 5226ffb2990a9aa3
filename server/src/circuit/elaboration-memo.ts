/**
 * What elaboration keeps of its work for the next elaboration, keyed by the cards it came from. The
 * language server's re-parse moves the cards an edit did not touch into the new tree (the same
 * objects, offsets moved in place), so work that is a function of such cards alone stands:
 *
 * - a top-level element card's flat element: every span of it is one of its card's, so it
 *   describes the moved card as well as a new one would. Kept when built at the top level of a
 *   file with no finding and no parameter looked up (a literal value); a device's model is looked
 *   up again on every use.
 * - the global parameters' values: a function of the `.param` definitions alone (names and
 *   expressions), kept when resolving them said nothing.
 *
 * A card that changed is a new object and misses. What is kept equals a fresh build, so an
 * elaboration's result does not depend on it (tests/analysis/incremental.test.ts).
 */
import { key } from '../../../grammar/src/index';
import type { FindingSet } from '../findings/index';
import { buildElement, type Frame } from './elements';
import { resolvePlaced, type PlacedParam } from './scope';
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

const keptGlobals = new WeakMap<PlacedParam['param'], { placed: readonly PlacedParam[]; values: Map<string, number> }>();

/** The global parameters' values: those of the last resolution of the very same definitions, else resolved (and kept when that said nothing). */
export function globalParamValues(placed: readonly PlacedParam[], sink: FindingSet): Map<string, number> {
  const first = placed[0]?.param;
  const was = first && keptGlobals.get(first);
  if (was && samePlaced(was.placed, placed)) return was.values;
  const offered = sink.offered;
  const values = resolvePlaced(placed, () => undefined, sink);
  if (first && sink.offered === offered) keptGlobals.set(first, { placed, values });
  return values;
}

function samePlaced(a: readonly PlacedParam[], b: readonly PlacedParam[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i]!.param !== b[i]!.param || a[i]!.uri !== b[i]!.uri) return false;
  return true;
}
