/**
 * Where each model, subcircuit and node name is defined and used in one netlist. Nodes are scoped:
 * a name inside a `.subckt` body is local to that subcircuit, except ground, which is global.
 */
import { key, type Card, type Item, type Name, type Netlist, type Span } from '../../../grammar/src/index';

export type SymbolKind = 'model' | 'subckt' | 'node';

export interface Occurrence {
  kind: SymbolKind;
  /** Lowercase identity. */
  key: string;
  /** `''` at top level; the subcircuit's lowercase name inside a body (nodes only). */
  scope: string;
  span: Span;
  role: 'definition' | 'reference';
}

const GROUND = new Set(['0', 'gnd']);

/** Every name occurrence of a netlist, in source order. */
export function indexNames(netlist: Netlist): Occurrence[] {
  const out: Occurrence[] = [];
  walk(netlist.items, '', out);
  return out.sort((a, b) => a.span.start - b.span.start);
}

function walk(items: readonly Item[], scope: string, out: Occurrence[]): void {
  for (const item of items) {
    if (item.kind === 'subckt-block') {
      const name = item.header.name;
      if (name) out.push(occurrence('subckt', name, '', 'definition'));
      const inner = name ? key(name) : `@${item.span.start}`;
      for (const port of item.header.ports) out.push(node(port, inner, 'definition'));
      if (item.ends?.name) out.push(occurrence('subckt', item.ends.name, '', 'reference'));
      walk(item.body, inner, out);
    } else if (item.kind === 'lib-section') walk(item.body, scope, out);
    else indexCard(item, scope, out);
  }
}

function occurrence(kind: SymbolKind, name: Name, scope: string, role: Occurrence['role']): Occurrence {
  return { kind, key: key(name), scope, span: name.span, role };
}

function node(name: Name, scope: string, role: Occurrence['role']): Occurrence {
  return occurrence('node', name, GROUND.has(key(name)) ? '' : scope, role);
}

function indexCard(card: Card, scope: string, out: Occurrence[]): void {
  switch (card.kind) {
    case 'model':
      if (card.name) out.push(occurrence('model', card.name, '', 'definition'));
      return;
    case 'diode':
    case 'mosfet':
      card.nodes.forEach((n) => out.push(node(n, scope, 'reference')));
      if (card.model) out.push(occurrence('model', card.model, '', 'reference'));
      return;
    case 'instance':
      card.nodes.forEach((n) => out.push(node(n, scope, 'reference')));
      if (card.subckt) out.push(occurrence('subckt', card.subckt, '', 'reference'));
      return;
    case 'passive':
    case 'source':
      card.nodes.forEach((n) => out.push(node(n, scope, 'reference')));
      return;
    default:
      return;
  }
}

/** The occurrence under an offset (the end of a name counts, so a cursor just after it works). */
export function occurrenceAt(index: readonly Occurrence[], offset: number): Occurrence | undefined {
  return index.find((o) => o.span.start <= offset && offset <= o.span.end);
}

/** All occurrences of the same symbol as `target`. */
export function sameSymbol(index: readonly Occurrence[], target: Occurrence): Occurrence[] {
  return index.filter((o) => o.kind === target.kind && o.key === target.key && o.scope === target.scope);
}
