/** Test helper: elaborates inline netlists (a root and named included files). */
import { parseNetlist } from '../../grammar/src/index';
import { elaborate, type ElaborateOptions, type FlatCircuit } from '../../server/src/circuit/index';

export const ROOT = 'file:///work/root.cir';

/** Elaborates `root` with extra files given by URI (or path relative to the root's folder). */
export function flatten(root: string, extra: Record<string, string> = {}, options: ElaborateOptions = {}): FlatCircuit {
  const files = new Map([[ROOT, parseNetlist(root)]]);
  for (const [name, text] of Object.entries(extra)) {
    const uri = name.includes('://') ? name : `file:///work/${name}`;
    files.set(uri, parseNetlist(text, { titleLine: false }));
  }
  return elaborate(ROOT, files, options);
}

/** `name: node node …` for each element, in order. */
export function wiring(flat: FlatCircuit): string[] {
  return flat.elements.map((e) => `${e.name}: ${e.terminals.map((t) => t.node).join(' ')}`);
}

