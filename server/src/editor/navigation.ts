/**
 * Go to definition, find references and rename for models, subcircuits, parameters and nodes,
 * across the files of a netlist: the file at the cursor, the files it includes and the files that
 * include it. Models, subcircuits and global parameters are shared through includes; nodes and a
 * subcircuit's own parameters are local to their file.
 */
import type { Netlist, Span } from '../../../grammar/src/index';
import { listIncludeTargets } from '../circuit/index';
import type { TextEdit } from '../findings/index';
import { indexNames, occurrenceAt, sameSymbol, type Occurrence } from './name-index';

export interface Location {
  uri: string;
  span: Span;
}

/** The files a name may live in: the file at the cursor first, then the files it includes and that include it. */
export type FileSet = readonly { uri: string; netlist: Netlist }[];

function symbolAt(files: FileSet, offset: number): { target: Occurrence; all: { uri: string; o: Occurrence }[] } | undefined {
  const [self] = files;
  if (!self) return undefined;
  const target = occurrenceAt(indexNames(self.netlist), offset);
  if (!target) return undefined;
  const local = target.kind === 'node' || (target.kind === 'param' && target.scope !== '');
  const all = files.flatMap((f) => (local && f.uri !== self.uri ? [] : sameSymbol(indexNames(f.netlist), target).map((o) => ({ uri: f.uri, o }))));
  return { target, all };
}

/** Where the symbol at `offset` is defined; for a node, its first appearance. */
export function findDefinition(files: FileSet, offset: number): Location[] {
  const found = symbolAt(files, offset);
  if (!found) return [];
  const definitions = found.all.filter((x) => x.o.role === 'definition');
  const chosen = definitions.length ? definitions : found.target.kind === 'node' ? found.all.slice(0, 1) : [];
  return chosen.map((x) => ({ uri: x.uri, span: x.o.span }));
}

export function findReferences(files: FileSet, offset: number, includeDeclaration: boolean): Location[] {
  const found = symbolAt(files, offset);
  if (!found) return [];
  return found.all.filter((x) => includeDeclaration || x.o.role === 'reference').map((x) => ({ uri: x.uri, span: x.o.span }));
}

/**
 * The range a rename would change, or undefined when a rename would break the netlist: ground
 * (`0`, `gnd`) is fixed, and a model, subcircuit or parameter defined in none of the files (a
 * catalog part known by its name, or a name from a file not read) would stop matching.
 */
export function prepareRename(files: FileSet, offset: number): Span | undefined {
  const found = symbolAt(files, offset);
  if (!found) return undefined;
  const { target } = found;
  if (target.kind === 'node') return target.scope === '' && ['0', 'gnd'].includes(target.key) ? undefined : target.span;
  return found.all.some((x) => x.o.role === 'definition') ? target.span : undefined;
}

export function rename(files: FileSet, offset: number, newName: string): TextEdit[] | { error: string } {
  if (!/^[A-Za-z0-9_][\w.+-]*$/.test(newName)) return { error: `'${newName}' is not a valid netlist name` };
  if (prepareRename(files, offset) === undefined) return { error: 'nothing to rename here' };
  return findReferences(files, offset, true).map((l) => ({ uri: l.uri, span: l.span, newText: newName }));
}

/** A link on every `.include` and `.lib` path to the file it names (resolved as the analysis resolves it). */
export function includeLinksOf(uri: string, netlist: Netlist): { span: Span; target: string }[] {
  return listIncludeTargets(uri, netlist).flatMap((t) => (t.card.path ? [{ span: t.card.path.span, target: t.uri }] : []));
}

/** The finding codes the file's `*@ allow` lines name, where they are written. */
export function allowedCodesOf(netlist: Netlist): { code: string; span: Span }[] {
  return netlist.cards.flatMap((card) => (card.kind === 'directive' && card.directive?.keyword === 'allow'
    ? card.directive.codes.map((c) => ({ code: c.text.toLowerCase(), span: c.span }))
    : []));
}
