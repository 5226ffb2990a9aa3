/**
 * Which findings a file shows, when several roots read it: the one rule both adapters follow (the
 * language server publishing diagnostics, the command line listing them), so they agree. A finding
 * belongs to the file that holds its text; a file that another root includes is shown as that root
 * reads it (an included file has no title line), not as its own analysis as a root would.
 */
import { withoutRepeats, type Finding } from '../findings/index';
import type { FileAnalysis } from './analyze';

/**
 * A root's findings by the file they are about; every file it read (`files`, by default those it
 * parsed) has an entry, empty when it found nothing there.
 */
export function findingsByFile(file: Pick<FileAnalysis, 'uri' | 'findings' | 'parsed'>, files: Iterable<string> = file.parsed.keys()): Map<string, Finding[]> {
  const byUri = new Map<string, Finding[]>([...files].map((uri) => [uri, []]));
  for (const f of file.findings) {
    const list = byUri.get(f.uri);
    if (list) list.push(f);
    else byUri.set(f.uri, [f]);
  }
  return byUri;
}

/** The findings of one file from every root that read it (`byRoot`: root → its findings there), each once. */
export function findingsOfFile(uri: string, byRoot: ReadonlyMap<string, readonly Finding[]>): Finding[] {
  const includedElsewhere = [...byRoot.keys()].some((root) => root !== uri);
  return withoutRepeats([...byRoot].filter(([root]) => !includedElsewhere || root !== uri).flatMap(([, list]) => list));
}
