/** Test helpers for the ratings: directives and models read from inline netlists. */
import { parseNetlist } from '../../grammar/src/index';
import type { Directive, ModelCard } from '../../grammar/src/index';
import { modelInputFromCard } from '../../server/src/ratings/index';
import type { ModelInput, PlacedDirectiveInput } from '../../server/src/ratings/index';

export const URI = 'file:///work/root.cir';

/** Every directive of an inline netlist (no title line), placed in `URI`. */
export function directivesOf(text: string, uri = URI): PlacedDirectiveInput[] {
  const netlist = parseNetlist(text, { titleLine: false });
  return netlist.cards.flatMap((card) => (card.kind === 'directive' && card.directive ? [{ uri, directive: card.directive as Directive }] : []));
}

/** Every `.model` of an inline netlist, by lowercase name. */
export function modelsOf(text: string, uri = URI): Map<string, ModelInput> {
  const netlist = parseNetlist(text, { titleLine: false });
  const models = new Map<string, ModelInput>();
  for (const card of netlist.cards) {
    if (card.kind !== 'model') continue;
    const model = modelInputFromCard(card as ModelCard, uri);
    if (model) models.set(model.name.toLowerCase(), model);
  }
  return models;
}

/** The text under a span of `text`. */
export function textAt(text: string, span: { start: number; end: number }): string {
  return text.slice(span.start, span.end);
}
