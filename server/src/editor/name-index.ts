/**
 * Where each model, subcircuit, node and parameter name is defined and used in one netlist. Nodes
 * are scoped: a name inside a `.subckt` body is local to that subcircuit, except ground, which is
 * global. Parameters likewise: a `.param` or `params:` inside a body belongs to it, and a use there
 * means the body's own parameter when it has one, else the global one. A `*@ rate NAME` line names
 * a model or a subcircuit (`rated`), and counts as a reference of either.
 */
import { key, type Card, type Expr, type Item, type Name, type Netlist, type Span, type Value } from '../../../grammar/src/index';

export type SymbolKind = 'model' | 'subckt' | 'node' | 'param' | 'rated';

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
  walk(netlist.items, '', out, new Set());
  return out.sort((a, b) => a.span.start - b.span.start);
}

/** `local`: the parameter names the current body defines (a use of one is the body's own). */
function walk(items: readonly Item[], scope: string, out: Occurrence[], local: ReadonlySet<string>): void {
  for (const item of items) {
    if (item.kind === 'subckt-block') {
      const name = item.header.name;
      if (name) out.push(occurrence('subckt', name, '', 'definition'));
      const inner = name ? key(name) : `@${item.span.start}`;
      for (const port of item.header.ports) out.push(node(port, inner, 'definition'));
      if (item.ends?.name) out.push(occurrence('subckt', item.ends.name, '', 'reference'));
      const own = new Set([...item.header.params, ...item.body.flatMap((b) => (b.kind === 'param' ? b.params : []))].map((p) => key(p.name)));
      for (const p of item.header.params) {
        out.push(occurrence('param', p.name, inner, 'definition'));
        paramUses(p.value, inner, own, out);
      }
      walk(item.body, inner, out, own);
    } else if (item.kind === 'lib-section') walk(item.body, scope, out, local);
    else indexCard(item, scope, out, local);
  }
}

/** The parameter names an expression uses, each in the scope that defines it. */
function paramUses(value: Value | undefined, scope: string, local: ReadonlySet<string>, out: Occurrence[]): void {
  const visit = (e: Expr): void => {
    if (e.type === 'ref') {
      const k = e.name.toLowerCase();
      out.push({ kind: 'param', key: k, scope: local.has(k) ? scope : '', span: { start: e.start, end: e.end }, role: 'reference' });
    } else if (e.type === 'unary') visit(e.arg);
    else if (e.type === 'binary') { visit(e.left); visit(e.right); } else if (e.type === 'call') e.args.forEach(visit);
  };
  if (value?.expr) visit(value.expr);
}

/** Every value written on a card (its value, its parameters, a source's arguments), wherever it sits. */
function valuesOf(card: Card): Value[] {
  const found: Value[] = [];
  const seen = new Set<object>();
  const visit = (x: unknown): void => {
    if (!x || typeof x !== 'object' || seen.has(x)) return;
    seen.add(x);
    if ('form' in x && 'text' in x && 'span' in x) {
      found.push(x as Value);
      return;
    }
    for (const v of Object.values(x)) visit(v);
  };
  visit(card);
  return found;
}

function occurrence(kind: SymbolKind, name: Name, scope: string, role: Occurrence['role']): Occurrence {
  return { kind, key: key(name), scope, span: name.span, role };
}

function node(name: Name, scope: string, role: Occurrence['role']): Occurrence {
  return occurrence('node', name, GROUND.has(key(name)) ? '' : scope, role);
}

function indexCard(card: Card, scope: string, out: Occurrence[], local: ReadonlySet<string>): void {
  if (card.kind === 'param') for (const p of card.params) out.push(occurrence('param', p.name, local.has(key(p.name)) ? scope : '', 'definition'));
  if (card.kind === 'directive') {
    const d = card.directive;
    if (d?.keyword === 'rate' && d.target && !d.target.text.includes('.')) out.push(occurrence('rated', d.target, '', 'reference'));
    return;
  }
  for (const value of valuesOf(card)) paramUses(value, scope, local, out);
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

/** All occurrences of the same symbol as `target`: a `rated` name goes with the model or subcircuit of that name. */
export function sameSymbol(index: readonly Occurrence[], target: Occurrence): Occurrence[] {
  return index.filter((o) => o.key === target.key && o.scope === target.scope && sameKind(o.kind, target.kind));
}

const PARTS: ReadonlySet<SymbolKind> = new Set(['model', 'subckt', 'rated']);

function sameKind(a: SymbolKind, b: SymbolKind): boolean {
  return a === b || (PARTS.has(a) && PARTS.has(b) && (a === 'rated' || b === 'rated'));
}
