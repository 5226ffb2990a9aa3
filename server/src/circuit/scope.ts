/**
 * `.param` scoping: global parameters (every top-level `.param` of the root and its includes),
 * subcircuit parameters (header defaults, overridden by the instance), and `.param` cards inside a
 * subcircuit body. A name is looked up body → header → global. Resolution itself (forward
 * references, cycles, long chains) is the grammar's `resolveParams`, which is iterative.
 */
import {
  evaluateValue, foldExpr, key, resolveParams,
  type Expr, type Lookup, type Param, type ParamDefinition, type Span, type Value,
} from '../../../grammar/src/index';
import type { FindingSet } from '../findings/index';

/** A parameter definition with the file it is written in. */
export interface PlacedParam {
  param: Param;
  uri: string;
}

/**
 * Definitions from several files are resolved together, yet offsets of different files overlap.
 * Each file's spans are moved into a band of their own for the resolution and moved back for the
 * report, so every diagnostic lands in the right file. 2^40 characters per band is far beyond any
 * netlist, and 2^53 / 2^40 leaves room for 8192 files.
 */
const BAND = 2 ** 40;

/** Resolves placed definitions against an outer lookup; diagnostics go to the sink in their own files. */
export function resolvePlaced(placed: readonly PlacedParam[], outer: Lookup, sink: FindingSet): Map<string, number> {
  const uris: string[] = [];
  const defs: ParamDefinition[] = placed.map(({ param, uri }) => {
    let band = uris.indexOf(uri);
    if (band < 0) band = uris.push(uri) - 1;
    const base = band * BAND;
    return { name: key(param.name), value: param.value && shiftValue(param.value, base), span: shiftSpan(param.span, base) };
  });
  const resolved = resolveParams(defs, outer);
  for (const d of resolved.diagnostics) {
    const band = Math.floor(d.span.start / BAND);
    sink.addSyntax(uris[band] ?? uris[0] ?? '', { ...d, span: shiftSpan(d.span, -band * BAND) });
  }
  return resolved.values;
}

/** A lookup that tries each map in turn, then the outer lookup. */
export function chainLookup(maps: readonly ReadonlyMap<string, number>[], outer: Lookup): Lookup {
  return (name) => {
    for (const map of maps) {
      const value = map.get(name);
      if (value !== undefined) return value;
    }
    return outer(name);
  };
}

/**
 * The scope of one subcircuit instance: header defaults with the instance's overrides (evaluated
 * in the caller's scope), then the body's `.param` cards.
 */
export function instanceScope(
  header: { params: readonly Param[]; uri: string },
  overrides: { params: readonly Param[]; uri: string; lookup: Lookup },
  body: readonly PlacedParam[],
  global: Lookup,
  sink: FindingSet,
): Lookup {
  const declared = new Set(header.params.map((p) => key(p.name)));
  const given = new Map<string, number>();
  for (const p of overrides.params) {
    if (!declared.has(key(p.name))) {
      sink.add({ uri: overrides.uri, span: p.name.span, severity: 'warning', code: 'unknown-param', message: `the subcircuit declares no parameter '${p.name.text}'; it is passed on anyway` });
    }
    const result = p.value ? evaluateValue(p.value, overrides.lookup) : {};
    if (result.diagnostic) sink.addSyntax(overrides.uri, result.diagnostic);
    if (result.value !== undefined) given.set(key(p.name), result.value);
  }
  // Defaults that the instance overrides are left out, so a default that fails cannot hide a good override.
  const defaults = header.params.filter((p) => !given.has(key(p.name))).map((param) => ({ param, uri: header.uri }));
  const headerValues = resolvePlaced(defaults, chainLookup([given], global), sink);
  const outer = chainLookup([given, headerValues], global);
  const bodyValues = resolvePlaced(body, outer, sink);
  return chainLookup([bodyValues], outer);
}

/** Evaluates a value, reporting a failure in the file it is written in. */
export function evaluateIn(value: Value | undefined, lookup: Lookup, uri: string, sink: FindingSet): number | undefined {
  if (!value) return undefined;
  const result = evaluateValue(value, lookup);
  if (result.diagnostic) sink.addSyntax(uri, result.diagnostic);
  return result.value;
}

/** Evaluates `name=value` parameters of a card into a record (flags without a value are left out). */
export function evaluateParams(params: readonly Param[], lookup: Lookup, uri: string, sink: FindingSet): Record<string, number> {
  const out: Record<string, number> = {};
  for (const p of params) {
    const v = evaluateIn(p.value, lookup, uri, sink);
    if (v !== undefined) out[key(p.name)] = v;
  }
  return out;
}

function shiftSpan(span: Span, by: number): Span {
  return { start: span.start + by, end: span.end + by };
}

function shiftValue(value: Value, by: number): Value {
  return { ...value, span: shiftSpan(value.span, by), expr: value.expr && shiftExpr(value.expr, by) };
}

/** Rebuilds the tree bottom-up with the grammar's stack-free fold. */
function shiftExpr(expr: Expr, by: number): Expr {
  return foldExpr<Expr>(expr, (e, operands) => {
    const at = { start: e.start + by, end: e.end + by };
    switch (e.type) {
      case 'unary': return { ...e, ...at, arg: operands[0]! };
      case 'binary': return { ...e, ...at, left: operands[0]!, right: operands[1]! };
      case 'call': return { ...e, ...at, args: operands };
      default: return { ...e, ...at };
    }
  });
}
