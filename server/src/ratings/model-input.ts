/**
 * The little the ratings need from a `.model` card: its name, numeric parameters and where it is.
 * A flattened circuit's model record already has this shape; a bare syntax-tree card is read by
 * {@link modelInputFromCard}.
 */
import type { ModelCard, Span } from '../../../grammar/src/index';

/** A `.model` card with evaluated numeric parameters (lowercase keys). */
export interface ModelInput {
  /** Name as written. */
  name: string;
  params: Readonly<Record<string, number>>;
  uri: string;
  /** Span of the card. */
  span: Span;
  /** Span of each parameter's `name=value`, by lowercase name, when known. */
  paramSpans?: Readonly<Record<string, Span>>;
}

/**
 * Reads a syntax-tree `.model` card. Only plain numbers are taken: expressions need the
 * parameter scope that the circuit layer evaluates, so a caller that has a flattened model
 * should pass that instead. Undefined for a card whose name recovery dropped.
 */
export function modelInputFromCard(card: ModelCard, uri: string): ModelInput | undefined {
  if (!card.name) return undefined;
  const params: Record<string, number> = {};
  const paramSpans: Record<string, Span> = {};
  for (const param of card.params) {
    const value = param.value?.number;
    if (value === undefined) continue;
    const key = param.name.text.toLowerCase();
    params[key] = value;
    paramSpans[key] = param.span;
  }
  return { name: card.name.text, params, uri, span: card.span, paramSpans };
}
