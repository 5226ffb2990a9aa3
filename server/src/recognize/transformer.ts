/**
 * Transformers from `K` coupling. Two coupled inductors L1 (primary) and L2 (secondary) with
 * coefficient k and mutual inductance M = k·√(L1·L2) are exactly the cantilever model: the
 * magnetising inductance L1 across the primary, an ideal transformer of ratio M/L1 = k·√(L2/L1),
 * and a series leakage (1 − k²)·L2 on the secondary. So the secondary's open-circuit EMF is
 * k·√(L2/L1) times the primary voltage, and its Thevenin inductance is (1 − k²)·L2; for k → 1 the
 * ratio is the turns ratio √(L2/L1) of an ideal transformer. (Standard coupled-inductor algebra:
 * v1 = L1·di1/dt + M·di2/dt, v2 = M·di1/dt + L2·di2/dt; eliminate di1/dt.)
 */
import type { CouplingElement, FlatElement, PassiveElement } from '../circuit/index';
import type { RecognizeContext } from './context';
import type { TransformerFinding } from './rectifier';
import { findLoop, hasAcDriver, type Step } from './source-trace';

/** The ratios and leakage of a coupled pair. */
export function transformerOf(coupling: CouplingElement, primary: PassiveElement, secondary: PassiveElement): TransformerFinding | undefined {
  const k = coupling.coefficient;
  const l1 = primary.value;
  const l2 = secondary.value;
  if (k === undefined || l1 === undefined || l2 === undefined || !(l1 > 0) || !(l2 > 0) || !(Math.abs(k) > 0) || Math.abs(k) > 1) return undefined;
  const turnsRatio = Math.sqrt(l2 / l1);
  return {
    coupling: coupling.name, primary: primary.name, secondary: secondary.name, k, primaryH: l1, secondaryH: l2,
    turnsRatio, voltageRatio: k * turnsRatio, leakageH: (1 - k * k) * l2,
  };
}

/** A winding found on a rectifier's loop and what drives it. */
export interface DrivenWinding {
  transformer?: TransformerFinding;
  /** The primary's own loop, oriented from its dotted end round to the other end; undefined when it holds no source. */
  primaryLoop?: Step[];
}

/**
 * For a coupled inductor met on a rectifier's loop, the partner that drives it: the one whose own
 * loop holds an AC source, else the first partner (its drive is then assumed).
 */
export function findDrive(ctx: RecognizeContext, winding: FlatElement): DrivenWinding {
  if (winding.kind !== 'inductor') return {};
  let fallback: DrivenWinding | undefined;
  for (const coupling of ctx.couplings.get(winding.key) ?? []) {
    for (const partnerKey of coupling.inductors) {
      const partner = ctx.graph.element(partnerKey);
      if (partnerKey === winding.key || partner?.kind !== 'inductor' || partner.terminals.length !== 2) continue;
      const transformer = transformerOf(coupling, partner, winding);
      const [p1, p2] = partner.terminals.map((t) => t.node) as [string, string];
      const loop = findLoop(ctx.graph, p1, p2, new Set([partner.key, winding.key]));
      const sourced = loop && loop.some((s) => s.element.kind === 'vsource') && hasAcDriver(loop, ctx.coupled);
      if (sourced) return { transformer, primaryLoop: loop };
      fallback ??= { transformer };
    }
  }
  return fallback ?? {};
}
