/**
 * Resolves a set of `.param` definitions: in any order (forward references allowed), cycles
 * reported instead of followed, and without recursion so a chain thousands deep cannot exhaust
 * the stack.
 */
import { evaluateExpression, referencedNames } from './expression';
import type { Span, SyntaxDiagnostic, Value } from './syntax-tree';

export interface ParamDefinition {
  /** Lowercase name. */
  name: string;
  value?: Value;
  span: Span;
}

export type Lookup = (name: string) => number | undefined;

export interface ResolvedParams {
  values: Map<string, number>;
  diagnostics: SyntaxDiagnostic[];
}

/** Evaluates one value against a lookup; a non-finite result is an error, never a number. */
export function evaluateValue(value: Value, lookup: Lookup): { value?: number; diagnostic?: SyntaxDiagnostic } {
  if (value.form === 'number') {
    if (value.number !== undefined && Number.isFinite(value.number)) return { value: value.number };
    return { diagnostic: { span: value.span, severity: 'error', code: 'bad-value', message: `'${value.text}' is not a finite number` } };
  }
  if (!value.expr) return {};
  const result = evaluateExpression(value.expr, lookup);
  if (result.error) return { diagnostic: { span: result.error, severity: 'error', code: 'undefined-param', message: result.error.message } };
  if (!Number.isFinite(result.value)) {
    return { diagnostic: { span: value.span, severity: 'error', code: 'bad-value', message: `${value.text} does not give a finite number` } };
  }
  return { value: result.value };
}

/** Resolves definitions in dependency order; `outer` supplies names from enclosing scopes. */
export function resolveParams(definitions: ParamDefinition[], outer: Lookup = () => undefined): ResolvedParams {
  const diagnostics: SyntaxDiagnostic[] = [];
  const byName = new Map<string, ParamDefinition>();
  for (const def of definitions) {
    const earlier = byName.get(def.name);
    if (earlier) diagnostics.push({ span: def.span, severity: 'warning', code: 'param-redefined', message: `parameter '${def.name}' is defined again; this value wins` });
    byName.set(def.name, def);
  }
  const values = new Map<string, number>();
  const order = orderByDependency(byName, diagnostics);
  const lookup: Lookup = (name) => (byName.has(name) ? values.get(name) : outer(name));
  for (const def of order) {
    if (!def.value) continue;
    const missing = [...dependenciesOf(def)].find((dep) => byName.has(dep) && !values.has(dep));
    if (missing) {
      diagnostics.push({ span: def.value.span, severity: 'error', code: 'undefined-param', message: `'${def.name}' depends on '${missing}', which has no value` });
      continue;
    }
    const result = evaluateValue(def.value, lookup);
    if (result.diagnostic) diagnostics.push(result.diagnostic);
    else if (result.value !== undefined) values.set(def.name, result.value);
  }
  return { values, diagnostics };
}

function dependenciesOf(def: ParamDefinition): Set<string> {
  return def.value?.expr ? referencedNames(def.value.expr) : new Set();
}

/** Post-order of the dependency graph by an explicit stack; definitions on a cycle are reported and left out. */
function orderByDependency(byName: Map<string, ParamDefinition>, diagnostics: SyntaxDiagnostic[]): ParamDefinition[] {
  const state = new Map<string, 'visiting' | 'done' | 'cyclic'>();
  const order: ParamDefinition[] = [];
  for (const root of byName.keys()) {
    if (state.has(root)) continue;
    const stack: { name: string; deps: string[] }[] = [{ name: root, deps: [...dependenciesOf(byName.get(root)!)] }];
    state.set(root, 'visiting');
    while (stack.length) {
      const frame = stack[stack.length - 1]!;
      const next = frame.deps.pop();
      if (next === undefined) {
        stack.pop();
        if (state.get(frame.name) === 'visiting') {
          state.set(frame.name, 'done');
          order.push(byName.get(frame.name)!);
        }
        continue;
      }
      if (!byName.has(next) || state.get(next) === 'done' || state.get(next) === 'cyclic') continue;
      if (state.get(next) === 'visiting') {
        reportCycle(stack.map((f) => f.name), next, byName, state, diagnostics);
        continue;
      }
      state.set(next, 'visiting');
      stack.push({ name: next, deps: [...dependenciesOf(byName.get(next)!)] });
    }
  }
  return order;
}

function reportCycle(
  path: string[], back: string, byName: Map<string, ParamDefinition>, state: Map<string, string>, diagnostics: SyntaxDiagnostic[],
): void {
  const loop = path.slice(path.indexOf(back));
  // A long cycle is named by its first few members, so one message stays short.
  const shown = loop.length <= 6 ? [...loop, back] : [...loop.slice(0, 5), '…', back];
  const text = shown.join(' → ') + (loop.length > 6 ? ` (${loop.length} parameters)` : '');
  for (const name of loop) {
    if (state.get(name) === 'cyclic') continue;
    state.set(name, 'cyclic');
    diagnostics.push({ span: byName.get(name)!.span, severity: 'error', code: 'param-cycle', message: `parameters refer to each other in a cycle: ${text}` });
  }
}
