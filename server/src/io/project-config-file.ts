/**
 * Where a netlist's project configuration is: the nearest `rectilens.json` in its folder or a
 * folder above it (as a design library keeps one per design, or one at the top).
 */
import { statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { PROJECT_CONFIG_FILE } from '../ratings/index';

/** Most folders walked up (a guard against a loop of mounts, far above any real depth). */
const MAX_LEVELS = 64;

export function findProjectConfig(netlistPath: string): string | undefined {
  let dir = dirname(resolve(netlistPath));
  for (let level = 0; level < MAX_LEVELS; level++) {
    const candidate = join(dir, PROJECT_CONFIG_FILE);
    try {
      if (statSync(candidate).isFile()) return candidate;
    } catch {
      // not here; look further up
    }
    const parent = dirname(dir);
    if (parent === dir) return undefined;
    dir = parent;
  }
  return undefined;
}
