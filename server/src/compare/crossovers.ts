/**
 * Where one construction's efficiency overtakes another's along a load sweep: between two
 * neighbouring points where the difference of their efficiencies changes sign, the load at which
 * it is zero, by linear interpolation of the difference (in log load on a log sweep).
 */
import type { SeriesId, SweepPoint } from './load-sweep';

export interface Crossover {
  /** The construction that is more efficient above this load… */
  above: SeriesId;
  /** …than this one, which is more efficient below it. */
  below: SeriesId;
  /** The load amount, in the sweep's unit. */
  amount: number;
}

/** Crossovers of every pair of series (the as-drawn series is left out: it is one of the constructions, or beside them). */
export function findCrossovers(points: readonly SweepPoint[], series: readonly { id: SeriesId }[], logScale: boolean): Crossover[] {
  const ids = series.map((s) => s.id).filter((id) => id !== 'as-drawn');
  const out: Crossover[] = [];
  const x = (p: SweepPoint) => (logScale ? Math.log(p.amount) : p.amount);
  for (let i = 0; i < ids.length; i++) {
    for (let j = i + 1; j < ids.length; j++) {
      const a = ids[i]!, b = ids[j]!;
      const diff = (p: SweepPoint) => {
        const ea = p.figures[a]?.efficiency, eb = p.figures[b]?.efficiency;
        return ea === undefined || eb === undefined ? undefined : ea - eb;
      };
      for (let k = 1; k < points.length; k++) {
        const p = points[k - 1]!, q = points[k]!;
        const d0 = diff(p), d1 = diff(q);
        if (d0 === undefined || d1 === undefined || d0 === 0 || Math.sign(d0) === Math.sign(d1)) continue;
        const f = d0 / (d0 - d1);
        const at = x(p) + f * (x(q) - x(p));
        // Points run from light to heavy load: the one whose lead grows with load is "above".
        out.push({ above: d1 > 0 ? a : b, below: d1 > 0 ? b : a, amount: logScale ? Math.exp(at) : at });
      }
    }
  }
  return out.sort((m, n) => loadOrder(points, m.amount) - loadOrder(points, n.amount));
}

/** Position along the sweep's load order (a resistance sweep runs downward in ohms). */
function loadOrder(points: readonly SweepPoint[], amount: number): number {
  const rising = points.length < 2 || points[points.length - 1]!.amount >= points[0]!.amount;
  return rising ? amount : -amount;
}
