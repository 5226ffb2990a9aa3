/** Nests `.subckt … .ends` and `.lib section … .endl` blocks, reporting unmatched ends. */
import type { Card, EndlCard, EndsCard, Item, LibCard, LibSectionBlock, SubcktBlock, SubcktCard, SyntaxDiagnostic } from './syntax-tree';

type OpenBlock = { header: SubcktCard; body: Item[]; kind: 'subckt-block' } | { header: LibCard; body: Item[]; kind: 'lib-section' };

/**
 * Deeper nesting of definitions than this is not read. Real netlists nest one or two; the limit
 * keeps the tree shallow enough to walk, copy to a worker and write as JSON.
 */
export const MAX_BLOCK_DEPTH = 64;

/**
 * `marks`, when given, are the indices of every `.subckt`, `.ends`, `.lib`, `.endl` (and `.end`)
 * card (card-marks.ts): the cards between them are placed as a run without reading each one.
 */
export function nestBlocks(cards: Card[], diagnostics: SyntaxDiagnostic[], marks?: readonly number[]): Item[] {
  const top: Item[] = [];
  const stack: OpenBlock[] = [];
  const current = (): Item[] => (stack.length ? stack[stack.length - 1]!.body : top);
  // Blocks opened past the limit and not yet closed: their cards are left out of the items.
  let tooDeep = 0;
  const placeRun = (from: number, to: number): void => {
    if (tooDeep > 0) return;
    const body = current();
    for (let i = from; i < to; i++) body.push(cards[i]!);
  };
  const place = (card: Card): void => {
    const opens = card.kind === 'subckt' || (card.kind === 'lib' && !card.path && card.section !== undefined);
    if (tooDeep > 0 || (opens && stack.length >= MAX_BLOCK_DEPTH)) {
      if (opens && tooDeep++ === 0) {
        diagnostics.push({ span: card.span, severity: 'error', code: 'subckt-depth', message: `definitions nest deeper than ${MAX_BLOCK_DEPTH} levels (limit: definition nesting); this block and everything in it are not read` });
      } else if (card.kind === 'ends' || card.kind === 'endl') tooDeep--;
      return;
    }
    if (card.kind === 'subckt') stack.push({ kind: 'subckt-block', header: card, body: [] });
    else if (card.kind === 'lib' && !card.path && card.section) stack.push({ kind: 'lib-section', header: card, body: [] });
    else if (card.kind === 'ends') closeSubckt(card, stack, current, diagnostics);
    else if (card.kind === 'endl') closeLib(card, stack, current, diagnostics);
    else current().push(card);
  };
  if (marks) {
    let next = 0;
    for (const mark of marks) {
      placeRun(next, mark);
      place(cards[mark]!);
      next = mark + 1;
    }
    placeRun(next, cards.length);
  } else for (const card of cards) place(card);
  while (stack.length) {
    const open = stack.pop()!;
    const what = open.kind === 'subckt-block' ? `.subckt ${open.header.name?.text ?? ''}`.trim() : `.lib ${open.header.section?.text ?? ''}`;
    const closer = open.kind === 'subckt-block' ? '.ends' : '.endl';
    diagnostics.push({ span: open.header.keyword.span, severity: 'error', code: 'unclosed-block', message: `'${what}' is never closed with ${closer}` });
    current().push(finish(open));
  }
  return top;
}

function finish(open: OpenBlock, closer?: EndsCard | EndlCard): SubcktBlock | LibSectionBlock {
  const last = closer ?? open.body[open.body.length - 1] ?? open.header;
  const span = { start: open.header.span.start, end: last.span.end };
  if (open.kind === 'subckt-block') return { kind: 'subckt-block', header: open.header, body: open.body, ends: closer as EndsCard | undefined, span };
  return { kind: 'lib-section', header: open.header, body: open.body, endl: closer as EndlCard | undefined, span };
}

function closeSubckt(card: EndsCard, stack: OpenBlock[], current: () => Item[], diagnostics: SyntaxDiagnostic[]): void {
  const open = stack[stack.length - 1];
  if (!open || open.kind !== 'subckt-block') {
    diagnostics.push({ span: card.keyword.span, severity: 'error', code: 'unmatched-end', message: "'.ends' without a '.subckt' to close" });
    return;
  }
  stack.pop();
  const name = open.header.name?.text;
  if (card.name && name && card.name.text.toLowerCase() !== name.toLowerCase()) {
    diagnostics.push({ span: card.name.span, severity: 'warning', code: 'unmatched-end', message: `'.ends ${card.name.text}' closes '.subckt ${name}'` });
  }
  current().push(finish(open, card));
}

function closeLib(card: EndlCard, stack: OpenBlock[], current: () => Item[], diagnostics: SyntaxDiagnostic[]): void {
  const open = stack[stack.length - 1];
  if (!open || open.kind !== 'lib-section') {
    diagnostics.push({ span: card.keyword.span, severity: 'error', code: 'unmatched-end', message: "'.endl' without a '.lib' section to close" });
    return;
  }
  stack.pop();
  current().push(finish(open, card));
}
