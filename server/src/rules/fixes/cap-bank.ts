/**
 * The ripple fix (DESIGN.md §6, "resize a capacitor for a ripple target"): make the capacitor a
 * bank of N identical parts in parallel. Our model: N identical capacitors in parallel share the
 * ripple current equally (same impedance at every frequency, D), so the bank's ripple rating is
 * N times one part's and its capacitance N times; its ESR is one part's over N. A larger total
 * capacitance narrows the conduction angle and raises the total ripple current a little (REFERENCES
 * §2: I_C,rms = √(I_rect,rms² − Idc²) grows with the peak current), so N is not the bare ratio of
 * current to rating: each N from that ratio upward is re-solved until the share per part fits.
 *
 * The edit writes the bank's capacitance into the card (N·value, or `{N*(expr)}` for an
 * expression), scales the `iripple=` (and `esr=`) entries of the part's rate line, and puts a
 * comment above the card saying the card now stands for a bank. A series ESR resistor in the
 * netlist is left as it is (conservative: the bank's would be smaller).
 *
 * Offered as a plan (the smallest count the bare ratio allows); the re-solves that fix N run when
 * it is chosen.
 */
import type { Fix, FixPlan, Place, TextEdit } from '../../findings/index';
import type { Netlist } from '../../../../grammar/src/index';
import type { RectifierAnalysis } from '../../equivalent/index';
import { solveRectifier } from '../../solve/index';
import type { SolveFn } from '../../solve/index';
import type { CapacitorView } from '../capacitor-view';
import { fmt } from '../rule-context';
import { cardAt, insertLinesBefore, spiceNumber } from './text-edits';

/** Largest bank offered. */
const MAX_PARTS = 12;

/** The bank plan for a capacitor whose ripple exceeds `allowedFraction` of its rating. */
export function capacitorBankFix(
  view: CapacitorView, allowedFraction: number, files: ReadonlyMap<string, Netlist>, solve: SolveFn = solveRectifier,
): FixPlan | undefined {
  const rated = view.ratings.iRippleA;
  const cF = view.element.value;
  const netlist = files.get(view.element.origin.uri);
  const card = cardAt(netlist, view.element.origin.span);
  if (!rated || rated.origin.kind !== 'rate-directive' || !cF || !netlist || card?.kind !== 'passive' || !card.value || !view.irmsA) return undefined;
  // In a series string every stage carries the whole current: banking one part would unbalance
  // the string's shares, so no single-part bank is offered there.
  if (view.stringShare) return undefined;
  const start = Math.max(2, Math.ceil(view.irmsA.value / (allowedFraction * rated.value)));
  if (start > MAX_PARTS) return undefined;
  const { uri, span } = view.element.origin;
  const search: BankSearch = { allowedFraction, ratedA: rated.value, ratedAt: { uri: rated.origin.uri, span: rated.origin.span }, cF, start };
  return {
    title: `Find the smallest bank of ${view.name} parts in parallel (${start} or more) that keeps each part's ripple within its rating (re-solved)`,
    key: `cap-bank|${uri}|${span.start}`,
    unverified: `no bank of up to ${MAX_PARTS} parts keeps each part's ripple within its rating`,
    verify: () => bankFix(view, search, netlist, solve),
  };
}

/** What the bank search starts from: the part's ripple rating and where it is written, its value, the smallest count the bare ratio allows. */
interface BankSearch {
  allowedFraction: number;
  ratedA: number;
  ratedAt: Place;
  cF: number;
  start: number;
}

function bankFix(view: CapacitorView, { allowedFraction, ratedA, ratedAt, cF, start }: BankSearch, netlist: Netlist, solve: SolveFn): Fix | undefined {
  const card = cardAt(netlist, view.element.origin.span);
  if (card?.kind !== 'passive' || !card.value) return undefined;
  for (let n = start; n <= MAX_PARTS; n++) {
    const perPartA = rippleShareWithBank(view.analysis, view.group, cF, n, solve);
    if (perPartA > allowedFraction * ratedA) continue;
    const v = card.value;
    const valueText = v.form === 'number' ? spiceNumber(n * cF) : `{${n}*(${v.text.replace(/^[{']|[}']$/g, '')})}`;
    const edits: TextEdit[] = [
      insertLinesBefore(view.element.origin.uri, netlist.text, card.span.start, [`* ${view.name}: a bank of ${n} identical capacitors in parallel (value and ratings are the bank's)`]),
      { uri: view.element.origin.uri, span: v.span, newText: valueText },
      { ...ratedAt, newText: `iripple=${fmt(n * ratedA)}A` },
    ];
    const esr = view.ratings.esrOhm;
    if (esr?.origin.kind === 'rate-directive') edits.push({ uri: esr.origin.uri, span: esr.origin.span, newText: `esr=${fmt(esr.value / n)}ohm` });
    return {
      title: `Make ${view.name} a bank of ${n} in parallel (${spiceNumber(n * cF)}F, ripple rating ${fmt(n * ratedA)} A): ` +
        `about ${fmt(perPartA)} A per part`,
      edits,
    };
  }
  return undefined;
}

/** Worst RMS ripple per part when the capacitor becomes a bank of `n`, over every corner. */
export function rippleShareWithBank(analysis: RectifierAnalysis, group: number, partF: number, n: number, solve: SolveFn = solveRectifier): number {
  const caps = analysis.circuit.capacitors.map((c, k) => (k === group ? { ...c, cF: c.cF + (n - 1) * partF } : c));
  const groupF = caps[group]!.cF;
  const solution = solve({ ...analysis.circuit, capacitors: caps }, analysis.corners, { waveformPoints: 0, inrush: false });
  const worst = Math.max(0, ...solution.corners.map((c) => c.capacitorIrmsA?.[group] ?? 0));
  return (worst * (n * partF)) / groupF / n;
}
