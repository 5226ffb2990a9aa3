/**
 * Fixes computed when first read, and fixes planned cheaply and verified on demand: most findings
 * are never opened for a fix, and of those opened, most fixes shown in a menu are never chosen.
 */
import type { Finding, Fix } from './finding';

/**
 * A fix whose edits need trial solves, offered before they run: a title that is true without them
 * (it may name a candidate, never claim what only the solve proves) and the verifying computation.
 */
export interface FixPlan {
  title: string;
  preferred?: boolean;
  /**
   * Names the edits the plan will make, so that plans of several findings that will make the same
   * edits (the four diodes of a bridge sharing one part swap) are offered once.
   */
  key: string;
  /** Why there is nothing to apply when the verification finds no fix, in words for the editor. */
  unverified: string;
  /** The fix as its trial solves prove it; undefined when they find none. */
  verify: () => Fix | undefined;
}

/** What a finding offers: a finished fix, or a plan still to be verified. */
export type OfferedFix = Fix | FixPlan;

/** A plan's verification: the proven fix, or why there is none. */
export type Verified = { fix: Fix } | { fix: undefined; reason: string };

export function isFixPlan(offer: OfferedFix): offer is FixPlan {
  return typeof (offer as Partial<FixPlan>).verify === 'function';
}

const offersOf = new WeakMap<Finding, () => OfferedFix[]>();
const verifiedOf = new WeakMap<FixPlan, Fix | null>();

/**
 * Gives a finding fixes that are computed on first read of `fixes` and then kept. Fix trials
 * re-solve the rectifier, and most findings are never opened for a fix, so they are not computed
 * with every keystroke's analysis. Reading `fixes` verifies every plan (the command line's and
 * the eager editor path); `offeredFixes` gives the plans unverified.
 */
export function withLazyFixes(finding: Finding, compute: () => (OfferedFix | undefined)[]): Finding {
  let offers: OfferedFix[] | undefined;
  let fixes: Fix[] | undefined;
  const offered = () => (offers ??= computeSafely(compute));
  offersOf.set(finding, offered);
  return Object.defineProperty(finding, 'fixes', {
    get: () => (fixes ??= offered().flatMap((offer) => (isFixPlan(offer) ? verifiedFix(offer) ?? [] : [offer]))),
    enumerable: true,
    configurable: true,
  });
}

/** A finding's fixes with its plans left unverified: cheap, no trial solve runs. */
export function offeredFixes(finding: Finding): OfferedFix[] {
  return offersOf.get(finding)?.() ?? finding.fixes ?? [];
}

/** Runs a plan's trial solves once; a plan whose verification throws offers nothing. */
export function verifiedFix(plan: FixPlan): Fix | undefined {
  if (!verifiedOf.has(plan)) {
    let fix: Fix | undefined;
    try {
      fix = plan.verify();
    } catch {
      fix = undefined;
    }
    verifiedOf.set(plan, fix ?? null);
  }
  return verifiedOf.get(plan) ?? undefined;
}

/** An offer as the editor applies it: a finished fix as it is, a plan verified with its reason if it fails. */
export function verifyOffer(offer: OfferedFix): Verified {
  if (!isFixPlan(offer)) return { fix: offer };
  const fix = verifiedFix(offer);
  return fix ? { fix } : { fix: undefined, reason: offer.unverified };
}

/**
 * An offer as plain data (it crosses from the analysis worker): a finished fix with its edits, or
 * a plan's title and key alone.
 */
export interface OfferSummary {
  title: string;
  preferred?: boolean;
  key: string;
  /** The edits' fix, present when the offer needed no trial solve. */
  fix?: Fix;
}

export function summariseOffer(offer: OfferedFix): OfferSummary {
  const preferred = offer.preferred ? { preferred: true } : {};
  return isFixPlan(offer) ? { title: offer.title, key: offer.key, ...preferred } : { title: offer.title, key: editsKey(offer), ...preferred, fix: offer };
}

/** Two fixes with the same edits are one choice. */
export function editsKey(fix: Fix): string {
  return JSON.stringify(fix.edits.map((e) => [e.uri, e.span.start, e.span.end, e.newText]));
}

/** A fix that fails to compute is not offered; the finding itself still stands. */
function computeSafely(compute: () => (OfferedFix | undefined)[]): OfferedFix[] {
  try {
    return compute().filter((f): f is OfferedFix => f !== undefined);
  } catch {
    return [];
  }
}
