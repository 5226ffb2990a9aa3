/**
 * Where the cards that shape a file sit: `.subckt`, `.ends`, `.lib`, `.endl` and `.end`. The passes
 * over the whole card list (nesting, the cut at `.end`) need to look only at these; reading the kind
 * of every card instead costs far more than the list's length suggests, because the cards come in a
 * dozen shapes and a property read over mixed shapes is a slow lookup each time.
 *
 * A parse records its marks beside its tree (not in it, so the tree stays plain data); a tree that
 * arrives without them (copied from another thread) has them found again by reading every card.
 */
import type { TokenType } from 'chevrotain';
import type { Card, Netlist } from './syntax-tree';
import { DotEnd, DotEndl, DotEnds, DotLib, DotSubckt } from './tokens';

const SHAPING: ReadonlySet<TokenType> = new Set([DotSubckt, DotEnds, DotLib, DotEndl, DotEnd]);
const SHAPING_KINDS: ReadonlySet<string> = new Set(['subckt', 'ends', 'lib', 'endl', 'end']);

/** Whether a card with this head shapes the file (its kind is then one of the marked kinds, always). */
export function isShapingHead(type: TokenType): boolean {
  return SHAPING.has(type);
}

const remembered = new WeakMap<Netlist, readonly number[]>();

/** Records the marks of a parse: indices into its cards without the title. */
export function rememberMarks(netlist: Netlist, marks: readonly number[]): void {
  remembered.set(netlist, marks);
}

/** The marks of a tree (indices into its cards without the title), recorded or found again. */
export function marksOf(netlist: Netlist): readonly number[] {
  const known = remembered.get(netlist);
  if (known) return known;
  const body = netlist.title ? netlist.cards.slice(1) : netlist.cards;
  return marksIn(body);
}

export function marksIn(cards: readonly Card[]): number[] {
  const marks: number[] = [];
  cards.forEach((card, index) => {
    if (SHAPING_KINDS.has(card.kind)) marks.push(index);
  });
  return marks;
}
