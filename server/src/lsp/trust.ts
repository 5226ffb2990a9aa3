/**
 * Workspace trust: in an untrusted workspace no file outside the workspace folders is read. The
 * decision is taken on the path that will be opened, never on the text as written: the URI is
 * converted by the same URL rules the reader uses (WHATWG, as `fileURLToPath`: tabs and newlines
 * dropped, `%2e%2e` and backslashes read as `..` and `/`), normalised, then resolved through every
 * symbolic link with `realpath`. Both the written-out path and the real path must lie inside a
 * folder; the reader then opens the real path, not following a final link.
 */
import { realpathSync } from 'node:fs';
import { isAbsolute, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ReadRefusal } from '../circuit/index';

export interface TrustPolicy {
  trusted: boolean;
  /** Workspace folder URIs. */
  folders: string[];
}

/** The path to open, or why nothing may be opened. */
export type GateResult = { path: string } | ReadRefusal;

/**
 * The one gate for includes, libraries and parts files: where a URI may be read from. In a
 * trusted workspace any local file; in an untrusted one only a file whose real path lies inside a
 * workspace folder. Outside paths are refused before the file system is asked anything about them.
 */
export function gateUri(uri: string, policy: TrustPolicy): GateResult {
  const converted = toPath(uri, policy.trusted);
  if ('refused' in converted || policy.trusted) return converted;
  const roots = rootsOf(policy);
  const path = resolve(converted.path);
  if (!roots.some((root) => isInside(root, path))) return outside(`${path} lies outside its folders`);
  let real: string;
  try {
    real = realpathSync(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException)?.code;
    return code === 'ENOENT' || code === 'ENOTDIR' ? { refused: 'missing', reason: 'no such file' } : { refused: 'unreadable', reason: `its path cannot be resolved (${code ?? String(error)})` };
  }
  if (!roots.some((root) => isInside(root, real))) return outside(`${path} leads through a symbolic link to ${real}, outside its folders`);
  return { path: real };
}

function toPath(uri: string, trusted: boolean): GateResult {
  if (!/^file:/i.test(uri)) {
    return trusted ? { refused: 'unreadable', reason: 'it is not a local file (only file: URIs are read)' } : outside(`${uri} is not a local file`);
  }
  try {
    return { path: fileURLToPath(uri) };
  } catch (error) {
    return { refused: 'unreadable', reason: `it is not a valid file URI (${(error as NodeJS.ErrnoException)?.code ?? 'undecodable escape'})` };
  }
}

function outside(what: string): ReadRefusal {
  return { refused: 'untrusted-outside', reason: `the workspace is untrusted and ${what}` };
}

/** Strictly below `root` (the folder itself is not a file in it); case rules follow the platform's `relative`. */
function isInside(root: string, path: string): boolean {
  const rel = relative(root, path);
  return rel !== '' && rel !== '..' && !rel.startsWith('../') && !rel.startsWith('..\\') && !isAbsolute(rel);
}

const rootCache = new WeakMap<TrustPolicy, string[]>();

/** Each folder as written and as its real path (a workspace may itself sit under a link). */
function rootsOf(policy: TrustPolicy): string[] {
  let roots = rootCache.get(policy);
  if (!roots) {
    roots = policy.folders.flatMap((folder) => {
      const converted = toPath(folder, true);
      if ('refused' in converted) return [];
      const written = resolve(converted.path);
      try {
        return [written, realpathSync(written)];
      } catch {
        return [written];
      }
    });
    rootCache.set(policy, roots);
  }
  return roots;
}
