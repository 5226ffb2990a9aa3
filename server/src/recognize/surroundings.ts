/**
 * Around each rectifier: the filter capacitors across its output (a resistor in series with a
 * capacitor is its ESR; parallel capacitors and series strings are merged: capacitor-strings.ts), the load (the `*@ load` directive with any
 * resistors and DC current sources across the output drawing beside it, else those parts alone),
 * and the AC source (source-description.ts).
 * Whatever is missing is assumed and said in an `assumed-condition` info finding.
 */
import type { LoadDirective, LoadSpec, MainsDirective } from '../../../grammar/src/index';
import type { Load } from '../solve/equivalent-circuit';
import type { Place } from '../circuit/index';
import type { Finding } from '../findings/index';
import type { RecognizeContext } from './context';
import type { Match } from './match';
import type { CapacitorFinding, LoadFinding, Surroundings } from './rectifier';
import { balancingLoadOf, findStrings, membersBetween, mergeGroup } from './capacitor-strings';
import { describeSource } from './source-description';
import { findDcChoke, type ChokeSide } from './dc-choke';

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
  const bleeders: { ohm: number; elements: string[] }[] = [];
  let choke: ChokeSide | undefined;
  for (const [x, y] of match.capacitorSlots) {
    let found = findCapacitor(ctx, x, y);
    // No capacitor across the rails: a choke to one beyond them (choke input) is the filter.
    if (!found && match.kind !== 'doubler') { choke = findDcChoke(ctx, x, y, findCapacitor); found = choke?.capacitor; }
    if (found) capacitors.push(found);
    else notes.push(`no capacitor across ${x}/${y}; assuming none there`);
    // The balancing resistors of a string across the output draw from it like a bleeder.
    const across = (x === match.dcPositive && y === match.dcNegative) || (x === match.dcNegative && y === match.dcPositive);
    if (found && across) bleeders.push(...(found.strings ?? []).flatMap((s) => balancingLoadOf(s) ?? []));
  }
  const load = findLoad(ctx, choke?.p ?? match.dcPositive, choke?.n ?? match.dcNegative, directives.load, notes, bleeders);
  const diagnostics = notes.map((message): Finding => ({ ...anchor, severity: 'info', code: 'assumed-condition', message }));
  return { surroundings: { source, capacitors, load, ...(choke ? { choke: choke.choke } : {}) }, diagnostics };
}

/** Capacitors across x–y, directly, through one series resistor (taken as ESR) or in series strings, merged. */
export function findCapacitor(ctx: RecognizeContext, x: string, y: string): CapacitorFinding | undefined {
  return mergeGroup(membersBetween(ctx, x, y), findStrings(ctx, x, y));
}

/**
 * The load: the `*@ load` directive (its range's light end as `light`) with the resistors and DC
 * current sources across the output drawing beside it (`fixed`: a bleeder adds to the load, it
 * never replaces it); without a directive those parts alone; else no load (said).
 */
export function findLoad(
  ctx: RecognizeContext, p: string, n: string, directive: LoadDirective | undefined, notes: string[], bleeders: readonly { ohm: number; elements: string[] }[] = [],
): LoadFinding {
  // A string's balancing resistors count as one resistor across the output (their series sum).
  const resistors = [
    ...ctx.between('resistor', p, n).flatMap((r) => (r.kind === 'resistor' && r.value !== undefined && r.value > 0 ? [{ value: r.value, names: [r.name] }] : [])),
    ...bleeders.map((b) => ({ value: b.ohm, names: b.elements })),
  ];
  const currents = ctx.between('isource', p, n);
  const conductanceS = resistors.reduce((s, r) => s + 1 / r.value, 0);
  // SPICE current flows from n+ through the source to n−: a source from DC+ to DC− draws from the output.
  const drawnA = currents.reduce((s, i) => s + (i.kind === 'isource' ? (i.terminals[0]!.node === p ? i.dc : -i.dc) : 0), 0);
  const names = [...resistors.flatMap((r) => r.names), ...currents.map((e) => e.name)];
  const spec = directive?.load;
  if (spec) {
    const found: LoadFinding = { ...loadOfSpec(spec, directive.vminV), elements: names, fromDirective: true };
    if (directive.lightLoad) found.light = loadOfSpec(directive.lightLoad, directive.vminV);
    if (names.length) {
      found.fixed = { elements: names };
      if (resistors.length) found.fixed.ohm = resistors.length === 1 ? resistors[0]!.value : 1 / conductanceS;
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
