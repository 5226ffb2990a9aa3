/**
 * The operating conditions in words, for the hover, the code lens and the reports: what the load
 * is made of, what each corner solved (line, frequency, ambient, load, part vertex), and the
 * span of the conditions when the file asks for more than one line, load or part value.
 */
import { clipText } from '../../../grammar/src/index';
import { formatCelsius, formatSi, trim } from './format';

// Plain shapes of the solver's and recognition's data (solve/equivalent-circuit.ts Load and
// PartVertex, recognize LoadFinding, solve CornerSolution): this room sits below them.

/** A load as the solver takes it. */
export type LoadShape =
  | { kind: 'power'; w: number }
  | { kind: 'current'; a: number }
  | { kind: 'resistance'; ohm: number }
  | { kind: 'none' };

/** A load as recognition found it: the directive's or the drawn parts', a range's light end, the parts drawn beside it. */
export type LoadFindingShape = LoadShape & {
  elements: string[];
  fromDirective: boolean;
  light?: LoadShape;
  fixed?: { ohm?: number; a?: number; elements: string[] };
};

export interface PartVertexShape {
  capacitance: 'min' | 'max';
  esr: 'nominal' | 'aged';
  vf: 'low' | 'high';
}

export interface CornerShape {
  name: string;
  lineVrms: number;
  ambientC: number;
  freqHz?: number;
  load?: LoadShape;
  parts?: PartVertexShape;
}

/** One load in short words: "12 W", "150 mA", "33 Ω", "none". */
export function loadAmountText(load: LoadShape | undefined): string {
  if (!load) return '—';
  switch (load.kind) {
    case 'power': return formatSi(load.w, 'W');
    case 'current': return formatSi(load.a, 'A');
    case 'resistance': return formatSi(load.ohm, 'Ω');
    default: return 'none';
  }
}

/** Names listed in full before "and N more". */
const NAMES_SHOWN = 3;

/** Element names for prose, each clipped, at most {@link NAMES_SHOWN} of them: "RB1, RB2 and 4 more". */
export function namesText(names: readonly string[]): string {
  const shown = names.slice(0, NAMES_SHOWN).map((n) => clipText(n)).join(', ');
  return names.length > NAMES_SHOWN ? `${shown} and ${names.length - NAMES_SHOWN} more` : shown;
}

const LOAD_KIND_WORDS: Readonly<Record<LoadShape['kind'], string>> = {
  power: 'constant power', current: 'constant current', resistance: 'resistance', none: 'no load',
};

/** What the load is made of: "0.2 W…12 W constant power (`*@ load`) + RB (4.7 kΩ) across the output". */
export function loadCompositionText(found: LoadFindingShape): string {
  const own = found.light ? `${loadAmountText(found.light)}…${loadAmountText(found)}` : loadAmountText(found);
  const parts = [`${own} ${LOAD_KIND_WORDS[found.kind]}${found.fromDirective ? ' (*@ load)' : found.elements.length ? ` (${namesText(found.elements)})` : ''}`];
  const fixed = found.fixed;
  if (fixed) {
    const amounts = [fixed.ohm !== undefined ? formatSi(fixed.ohm, 'Ω') : '', fixed.a !== undefined ? formatSi(fixed.a, 'A') : ''].filter(Boolean).join(' and ');
    parts.push(`${namesText(fixed.elements)} (${amounts}) across the output`);
  }
  return parts.join(' + ');
}

const VERTEX_WORDS = {
  capacitance: { min: 'smallest C', max: 'largest C' },
  esr: { nominal: 'nominal ESR', aged: 'end-of-life ESR' },
  vf: { low: 'lowest VF', high: 'highest VF' },
} as const;

/** A part vertex in short words for table cells: "C min · ESR aged · VF high". */
export function partVertexShort(v: PartVertexShape | undefined): string {
  return v ? `C ${v.capacitance} · ESR ${v.esr === 'aged' ? 'aged' : 'nom'} · VF ${v.vf}` : 'nominal';
}

/** A part vertex in words: "smallest C, end-of-life ESR, highest VF". */
export function partVertexText(v: PartVertexShape | undefined): string {
  if (!v) return 'nominal parts';
  return [VERTEX_WORDS.capacitance[v.capacitance], VERTEX_WORDS.esr[v.esr], VERTEX_WORDS.vf[v.vf]].join(', ');
}

/** What one corner solved: "264 V 50 Hz · 50 °C · load 0.2 W · largest C, nominal ESR, lowest VF". */
export function cornerConditionsText(c: CornerShape): string {
  const line = `${formatSi(c.lineVrms, 'V')}${c.freqHz !== undefined ? ` ${formatSi(c.freqHz, 'Hz')}` : ''}`;
  return [line, formatCelsius(c.ambientC), `load ${loadAmountText(c.load)}`, partVertexText(c.parts)].join(' · ');
}

/**
 * The span of the conditions when more than the usual line × ambient corners were solved
 * (a universal input, several frequencies, a load range, part spreads): "90–264 V · 50/60 Hz ·
 * load 0.2–12 W · part spread". Undefined for a single line, frequency, load and nominal parts.
 */
export function conditionSpanText(
  corners: readonly CornerShape[], mains: { vrmsRange?: [number, number]; freqsHz?: number[] } | undefined, load: LoadFindingShape,
): string | undefined {
  const out: string[] = [];
  if (mains?.vrmsRange) {
    const volts = corners.map((c) => c.lineVrms);
    out.push(`${trim(Math.min(...volts))}–${trim(Math.max(...volts))} V`);
  }
  if (mains?.freqsHz) out.push(`${mains.freqsHz.join('/')} Hz`);
  if (load.light) out.push(`load ${loadAmountText(load.light)}–${loadAmountText(load)}`);
  if (corners.some((c) => c.parts)) out.push('part spread');
  return out.length ? out.join(' · ') : undefined;
}
