/**
 * Around each rectifier: the filter capacitors across its output (a resistor in series with a
 * capacitor is its ESR; parallel capacitors are merged), the load (the `*@ load` directive with any
 * resistors and DC current sources across the output drawing beside it, else those parts alone),
 * and the AC source (source-description.ts).
 * Whatever is missing is assumed and said in an `assumed-condition` info finding.
 */
import type { LoadDirective, LoadSpec, MainsDirective } from '../../../grammar/src/index';
import type { Load } from '../solve/equivalent-circuit';
import type { FlatElement, Place } from '../circuit/index';
import type { Finding } from '../findings/index';
import type { RecognizeContext } from './context';
import type { Match } from './match';
import type { CapacitorFinding, CapacitorMember, LoadFinding, Surroundings } from './rectifier';
import { describeSource } from './source-description';

/** The directives that fill gaps in the circuit. */
export interface SurroundingDirectives {
  mains?: MainsDirective;
  load?: LoadDirective;
}

/** Finds the surroundings of a match; assumptions become info findings at `anchor`. */
export function findSurroundings(ctx: RecognizeContext, match: Match, directives: SurroundingDirectives, anchor: Place): { surroundings: Surroundings; diagnostics: Finding[] } {
  const notes: string[] = [];
  const { source, notes: sourceNotes } = describeSource(ctx, match, directives.mains);
  notes.push(...sourceNotes);
  const capacitors: CapacitorFinding[] = [];
  for (const [x, y] of match.capacitorSlots) {
    const found = findCapacitor(ctx, x, y);
    if (found) capacitors.push(found);
    else notes.push(`no capacitor across ${x}/${y}; assuming none there`);
  }
  const load = findLoad(ctx, match.dcPositive, match.dcNegative, directives.load, notes);
  const diagnostics = notes.map((message): Finding => ({ ...anchor, severity: 'info', code: 'assumed-condition', message }));
  return { surroundings: { source, capacitors, load }, diagnostics };
}

/** Capacitors across x–y, directly or through one series resistor (taken as ESR), merged. */
export function findCapacitor(ctx: RecognizeContext, x: string, y: string): CapacitorFinding | undefined {
  const parts: CapacitorMember[] = [];
  for (const c of ctx.between('capacitor', x, y)) if (c.kind === 'capacitor' && c.value) parts.push({ name: c.name, cF: c.value, esrOhm: 0 });
  for (const { element: c, terminal } of [...ctx.graph.at(x), ...ctx.graph.at(y)]) {
    if (c.kind !== 'capacitor' || !c.value || c.terminals.length !== 2) continue;
    const mid = c.terminals[1 - terminal]!.node;
    const far = c.terminals[terminal]!.node === x ? y : x;
    if (mid === x || mid === y) continue;
    const esr = seriesResistor(ctx, mid, far, c);
    if (esr && esr.kind === 'resistor' && esr.value !== undefined) parts.push({ name: c.name, cF: c.value, esrOhm: esr.value, esr: esr.name });
  }
  if (parts.length === 0) return undefined;
  // Parallel branches: capacitances add; the ESRs combine in parallel (exact when the time constants match).
  const cF = parts.reduce((s, p) => s + p.cF, 0);
  const esrOhm = parts.some((p) => p.esrOhm === 0) ? 0 : 1 / parts.reduce((s, p) => s + 1 / p.esrOhm, 0);
  return { names: parts.map((p) => p.name), cF, esrOhm, esrResistors: parts.flatMap((p) => (p.esr ? [p.esr] : [])), members: parts };
}

/** The one resistor from `mid` to `far`, when `mid` holds nothing but it and the capacitor. */
function seriesResistor(ctx: RecognizeContext, mid: string, far: string, cap: FlatElement): FlatElement | undefined {
  const others = ctx.graph.at(mid).filter((i) => i.element !== cap);
  if (others.length !== 1) return undefined;
  const r = others[0]!.element;
  return r.kind === 'resistor' && r.terminals.length === 2 && r.terminals[1 - others[0]!.terminal]!.node === far ? r : undefined;
}

/**
 * The load: the `*@ load` directive (its range's light end as `light`) with the resistors and DC
 * current sources across the output drawing beside it (`fixed`: a bleeder adds to the load, it
 * never replaces it); without a directive those parts alone; else no load (said).
 */
export function findLoad(ctx: RecognizeContext, p: string, n: string, directive: LoadDirective | undefined, notes: string[]): LoadFinding {
  const resistors = ctx.between('resistor', p, n).filter((r) => r.kind === 'resistor' && r.value !== undefined && r.value > 0);
  const currents = ctx.between('isource', p, n);
  const conductanceS = resistors.reduce((s, r) => s + 1 / (r as { value: number }).value, 0);
  // SPICE current flows from n+ through the source to n−: a source from DC+ to DC− draws from the output.
  const drawnA = currents.reduce((s, i) => s + (i.kind === 'isource' ? (i.terminals[0]!.node === p ? i.dc : -i.dc) : 0), 0);
  const names = [...resistors, ...currents].map((e) => e.name);
  const spec = directive?.load;
  if (spec) {
    const found: LoadFinding = { ...loadOfSpec(spec, directive.vminV), elements: names, fromDirective: true };
    if (directive.lightLoad) found.light = loadOfSpec(directive.lightLoad, directive.vminV);
    if (names.length) {
      found.fixed = { elements: names };
      if (resistors.length) found.fixed.ohm = resistors.length === 1 ? (resistors[0] as { value: number }).value : 1 / conductanceS;
      if (currents.length) found.fixed.a = drawnA;
    }
    return found;
  }
  if (resistors.length && currents.length) notes.push(`both resistors and current sources load ${p}/${n}; the current sources are left out`);
  if (resistors.length) return { kind: 'resistance', ohm: 1 / conductanceS, elements: names, fromDirective: false };
  if (currents.length) return { kind: 'current', a: drawnA, elements: names, fromDirective: false };
  notes.push(`no load found across ${p}/${n}; assuming no load`);
  return { kind: 'none', elements: [], fromDirective: false };
}

function loadOfSpec(spec: LoadSpec, vminV: number | undefined): Load {
  if (spec.kind === 'power') return vminV === undefined ? { kind: 'power', w: spec.w } : { kind: 'power', w: spec.w, vminV };
  return spec.kind === 'current' ? { kind: 'current', a: spec.a } : { kind: 'resistance', ohm: spec.ohm };
}
