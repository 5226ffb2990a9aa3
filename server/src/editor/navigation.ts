/** Go to definition, find references and rename for models, subcircuits and nodes. */
import type { Span } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import type { TextEdit } from '../findings/index';
import { indexNames, occurrenceAt, sameSymbol, type Occurrence } from './name-index';

export interface Location {
  uri: string;
  span: Span;
}

/** The files a name may live in: the file itself first, then the files it includes. */
export type FileSet = readonly FileAnalysis[];

function symbolAt(files: FileSet, offset: number): { target: Occurrence; all: { uri: string; o: Occurrence }[] } | undefined {
  const [self, ...others] = files;
  if (!self) return undefined;
  const target = occurrenceAt(indexNames(self.netlist), offset);
  if (!target) return undefined;
  const all = [self, ...others].flatMap((f) => {
    const index = indexNames(f.netlist);
    // Nodes are local to a file's own scopes; models and subcircuits are shared through includes.
    const matches = target.kind === 'node' && f !== self ? [] : sameSymbol(index, target);
    return matches.map((o) => ({ uri: f.uri, o }));
  });
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

/** The range a rename would change, or undefined when nothing renameable is there (ground cannot be renamed). */
export function prepareRename(files: FileSet, offset: number): Span | undefined {
  const found = symbolAt(files, offset);
  if (!found || (found.target.kind === 'node' && found.target.scope === '' && ['0', 'gnd'].includes(found.target.key))) return undefined;
  return found.target.span;
}

export function rename(files: FileSet, offset: number, newName: string): TextEdit[] | { error: string } {
  if (!/^[A-Za-z0-9_][\w.+-]*$/.test(newName)) return { error: `'${newName}' is not a valid netlist name` };
  if (prepareRename(files, offset) === undefined) return { error: 'nothing to rename here' };
  return findReferences(files, offset, true).map((l) => ({ uri: l.uri, span: l.span, newText: newName }));
}
