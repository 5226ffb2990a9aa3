/** Fixes computed when first read: most findings are never opened for a fix. */
import type { Finding, Fix } from './finding';

/**
 * Gives a finding fixes that are computed on first read of `fixes` and then kept. Fix trials
 * re-solve the rectifier, and most findings are never opened for a fix, so they are not computed
 * with every keystroke's analysis.
 */
export function withLazyFixes(finding: Finding, compute: () => (Fix | undefined)[]): Finding {
  let fixes: Fix[] | undefined;
  return Object.defineProperty(finding, 'fixes', {
    get: () => (fixes ??= computeSafely(compute)),
    enumerable: true,
    configurable: true,
  });
}

/** A fix that fails to compute is not offered; the finding itself still stands. */
function computeSafely(compute: () => (Fix | undefined)[]): Fix[] {
  try {
    return compute().filter((f): f is Fix => f !== undefined);
  } catch {
    return [];
  }
}
