/**
 * A tree's offsets listed in idle time (grammar `listOffsetsAhead`), a chunk of cards per turn of
 * the event loop. The first edit after a file opens moves every card below it, and listing each
 * card's offsets as it moved was most of that edit: on the 5,000-line benchmark netlist about
 * 70 ms in the worker and 50 ms on the main thread. A request or an edit that arrives meanwhile
 * waits for one chunk at most; the listing stops once the tree is no longer the current one.
 * Timing only: the lists are what a move would make, so no answer changes.
 */
import { listOffsetsAhead, type Netlist } from '../../../grammar/src/index';

/** Cards listed per turn: a few milliseconds before the JIT has warmed up, well under one after. */
export const OFFSETS_CHUNK_CARDS = 200;

export function listOffsetsWhenIdle(netlist: Netlist, stillCurrent: () => boolean): void {
  let next = 0;
  const step = (): void => {
    if (!stillCurrent()) return;
    next = listOffsetsAhead(netlist, next, OFFSETS_CHUNK_CARDS);
    if (next >= 0) setImmediate(step);
  };
  setImmediate(step);
}
