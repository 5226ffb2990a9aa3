/** Finds netlist files under the paths given on the command line, and reads them. */
import { readdirSync, statSync } from 'node:fs';
import { extname, join } from 'node:path';
import type { FileText } from '../circuit/index';
import { readFileSafely } from '../io/read-file-safely';
import { expandPattern, isPattern } from './glob';

export const NETLIST_EXTENSIONS: readonly string[] = ['.cir', '.net', '.sp', '.spi', '.ckt'];
const SKIPPED_FOLDERS = new Set(['node_modules', '.git', 'dist', 'out']);

export interface FileList {
  files: string[];
  /** Paths that do not exist or cannot be listed, with the reason. */
  problems: { path: string; reason: string }[];
  /** Folders named on the command line that hold no netlist file (a wrong folder must not pass as clean). */
  empty: string[];
}

/** Expands folders to the netlist files in them (sorted); files named explicitly are kept whatever their extension. */
export function collectNetlistFiles(paths: readonly string[]): FileList {
  const files: string[] = [];
  const problems: FileList['problems'] = [];
  const empty: string[] = [];
  for (const path of paths) {
    if (isPattern(path) && !exists(path)) {
      const matched = expandPattern(path).filter((p) => NETLIST_EXTENSIONS.includes(extname(p).toLowerCase()));
      if (matched.length) files.push(...matched);
      else problems.push({ path, reason: `no file matches this pattern (of the netlist files: ${NETLIST_EXTENSIONS.join(', ')})` });
      continue;
    }
    try {
      if (statSync(path).isDirectory()) {
        const before = files.length;
        walk(path, files);
        if (files.length === before) empty.push(path);
      } else files.push(path);
    } catch (error) {
      problems.push({ path, reason: describeError(error, path) });
    }
  }
  return { files, problems, empty };
}

/** The stderr line for a folder with no netlist in it. */
export function emptyFolderMessage(path: string): string {
  return `rectilens: no netlist in ${path} (looked for ${NETLIST_EXTENSIONS.join(', ')} files, skipping ${[...SKIPPED_FOLDERS].join(', ')} and hidden folders)\n`;
}

function walk(folder: string, into: string[]): void {
  // Code-unit order, not the locale's: the list (and so every shard of it) is the same on every machine.
  const entries = readdirSync(folder, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    const path = join(folder, entry.name);
    if (entry.isDirectory()) {
      if (!SKIPPED_FOLDERS.has(entry.name) && !entry.name.startsWith('.')) walk(path, into);
    } else if (NETLIST_EXTENSIONS.includes(extname(entry.name).toLowerCase())) into.push(path);
  }
}

/**
 * Reads files on demand through the safe reader (regular files only, size-capped, never blocking)
 * and remembers them, so includes shared by several roots are read once.
 */
export function cachedReader(): (path: string) => FileText {
  const cache = new Map<string, FileText>();
  return (path) => {
    if (!cache.has(path)) cache.set(path, readFileSafely(path));
    return cache.get(path);
  };
}

/** Why a root was not read, for the one-line message on stderr. */
export function unreadReason(read: (path: string) => FileText, path: string): string {
  const text = read(path);
  return typeof text === 'object' ? text.reason : 'it could not be read';
}

export function describeError(error: unknown, path = ''): string {
  const code = (error as NodeJS.ErrnoException)?.code;
  // A pattern reaches us unexpanded when the shell matched nothing (or it was quoted).
  if (code === 'ENOENT') return 'no such file or folder';
  if (code === 'EACCES') return 'permission denied';
  return error instanceof Error ? error.message : String(error);
}

function exists(path: string): boolean {
  try {
    statSync(path);
    return true;
  } catch {
    return false;
  }
}
