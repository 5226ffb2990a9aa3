/**
 * The AC source a rectifier sees: the sine sources on its loop summed as phasors (several sources
 * in series add), windings referred through their transformer, the series R and L of the loop, and
 * the `*@ mains` directive, which overrides the amplitude and frequency of the source feeding the
 * rectifier (RMS volts; line-to-line for a three-phase directive).
 */
import { displayNumber, type MainsDirective } from '../../../grammar/src/index';
import type { FlatElement } from '../circuit/index';
import type { RecognizeContext } from './context';
import type { Match } from './match';
import type { SourceFinding, TransformerFinding } from './rectifier';
import type { Step } from './source-trace';
import { findDrive } from './transformer';

/** Used when neither a source nor a `mains` directive gives the line: IEC 60038 nominal 230 V, 50 Hz. */
export const DEFAULT_MAINS = { vrms: 230, freqHz: 50 } as const;

interface Phasor {
  re: number;
  im: number;
}

/** What one loop contributes, before the mains override. */
interface LoopReading {
  emf: Phasor;
  /** EMF of the primary (or of the direct sources) at the mains side, and the ratio to the rectifier side. */
  lineEmf: Phasor;
  ratio: number;
  freqHz?: number;
  rOhm: number;
  lH: number;
  elements: string[];
  resistors: { name: string; ohm: number; referral: number }[];
  transformer?: TransformerFinding;
  /** The transformer's magnetising inductance referred to the rectifier side. */
  magnetisingLH?: number;
  notes: string[];
}

/** Describes the source of a match; `notes` are assumptions to report. */
export function describeSource(ctx: RecognizeContext, match: Match, mains: MainsDirective | undefined): { source: SourceFinding; notes: string[] } {
  const loop = match.loops[0];
  if (!loop) return assumedSource(match, mains);
  const reading = readLoop(ctx, loop, mains);
  const notes = [...reading.notes];
  const lineScale = mains?.vrms !== undefined ? mainsPeakV(mains, match) / Math.max(magnitude(reading.lineEmf), 1e-300) : 1;
  const peakV = magnitude(reading.emf) * lineScale;
  let freqHz = mains?.freqHz ?? reading.freqHz;
  if (freqHz === undefined) {
    freqHz = DEFAULT_MAINS.freqHz;
    notes.push(`the source gives no frequency; assuming ${freqHz} Hz`);
  }
  const source: SourceFinding = {
    vrms: peakV / Math.SQRT2, freqHz, seriesROhm: reading.rOhm, seriesLH: reading.lH,
    mainsVrms: (magnitude(reading.lineEmf) * lineScale) / Math.SQRT2, turnsRatio: reading.ratio,
    elements: reading.elements, transformer: reading.transformer, mains, assumed: false, seriesResistors: reading.resistors,
  };
  if (reading.magnetisingLH !== undefined) source.magnetisingLH = reading.magnetisingLH;
  return { source, notes };
}

function mainsPeakV(mains: MainsDirective, match: Match): number {
  const vrms = mains.vrms ?? DEFAULT_MAINS.vrms;
  const perPhase = match.kind === 'three-phase-bridge' && mains.phases === 3 ? vrms / Math.sqrt(3) : vrms;
  return perPhase * Math.SQRT2;
}

function assumedSource(match: Match, mains: MainsDirective | undefined): { source: SourceFinding; notes: string[] } {
  const peak = mains?.vrms !== undefined ? mainsPeakV(mains, match) : DEFAULT_MAINS.vrms * Math.SQRT2;
  const freqHz = mains?.freqHz ?? DEFAULT_MAINS.freqHz;
  const vrms = peak / Math.SQRT2;
  const what = mains ? 'the mains of the `*@ mains` directive' : 'nominal mains (IEC 60038)';
  const note = `no AC source traced to ${match.acNodes.join('/')}; assuming ${what}, ${displayNumber(vrms)} V ${displayNumber(freqHz)} Hz, directly across them`;
  return {
    source: { vrms, freqHz, seriesROhm: 0, seriesLH: 0, mainsVrms: vrms, turnsRatio: 1, elements: [], mains, assumed: true },
    notes: [note],
  };
}

/** Sums a loop: sources, windings (through their transformer), resistors and inductors. */
function readLoop(ctx: RecognizeContext, steps: readonly Step[], mains: MainsDirective | undefined): LoopReading {
  const r: LoopReading = { emf: zero(), lineEmf: zero(), ratio: 1, rOhm: 0, lH: 0, elements: [], resistors: [], notes: [] };
  for (const step of steps) {
    const e = step.element;
    r.elements.push(e.name);
    const sign = e.terminals[0]!.node === step.from ? 1 : -1;
    if (e.kind === 'resistor') addResistor(r, e, 1);
    else if (e.kind === 'vsource') addSine(r, e, sign, 1);
    else if (e.kind === 'inductor' && ctx.couplings.has(e.key)) addWinding(ctx, r, e, sign, mains);
    else if (e.kind === 'inductor') r.lH += e.value ?? 0;
  }
  if (magnitude(r.lineEmf) === 0 && magnitude(r.emf) === 0 && !mains) r.notes.push('the source on the loop has no amplitude');
  return r;
}

function addResistor(r: LoopReading, e: FlatElement, referral: number): void {
  const ohm = e.kind === 'resistor' ? (e.value ?? 0) : 0;
  r.rOhm += ohm * referral;
  r.resistors.push({ name: e.name, ohm, referral });
}

function addSine(r: LoopReading, e: FlatElement, sign: number, ratio: number): void {
  if (e.kind !== 'vsource' || !e.sine || e.sine.amplitude === 0) return;
  const phase = (e.sine.phaseDeg * Math.PI) / 180;
  const p = { re: sign * e.sine.amplitude * Math.cos(phase), im: sign * e.sine.amplitude * Math.sin(phase) };
  r.emf = add(r.emf, scale(p, ratio));
  r.lineEmf = add(r.lineEmf, p);
  if (r.freqHz === undefined) r.freqHz = e.sine.freqHz;
  else if (e.sine.freqHz !== undefined && e.sine.freqHz !== r.freqHz) r.notes.push(`${e.name} runs at ${displayNumber(e.sine.freqHz)} Hz, not ${displayNumber(r.freqHz)} Hz; its phasor is added as if in step`);
}

/** A secondary winding: its primary loop's EMF times M/L1, the leakage, and the primary's R and L referred by (M/L1)². */
function addWinding(ctx: RecognizeContext, r: LoopReading, winding: FlatElement, sign: number, mains: MainsDirective | undefined): void {
  const drive = findDrive(ctx, winding);
  const t = drive.transformer;
  if (!t) {
    r.notes.push(`the coupling of ${winding.name} lacks a value; its winding is taken as a plain inductor`);
    r.lH += winding.kind === 'inductor' ? (winding.value ?? 0) : 0;
    return;
  }
  r.transformer ??= t;
  r.ratio = t.voltageRatio;
  r.lH += t.leakageH;
  // Cantilever model: L1 across the primary, referred to the secondary by (M/L1)²: k²·L2.
  r.magnetisingLH ??= t.voltageRatio ** 2 * t.primaryH;
  r.elements.push(t.coupling, t.primary);
  if (!drive.primaryLoop) {
    const line = mains?.vrms ?? DEFAULT_MAINS.vrms;
    if (!mains) r.notes.push(`no source drives ${t.primary}; assuming ${line} V ${DEFAULT_MAINS.freqHz} Hz mains on it (IEC 60038 nominal)`);
    const p = { re: sign * line * Math.SQRT2, im: 0 };
    r.emf = add(r.emf, scale(p, t.voltageRatio));
    r.lineEmf = add(r.lineEmf, p);
    r.freqHz ??= DEFAULT_MAINS.freqHz;
    return;
  }
  const referred = t.voltageRatio ** 2;
  for (const step of drive.primaryLoop) {
    const e = step.element;
    r.elements.push(e.name);
    if (e.kind === 'resistor') addResistor(r, e, referred);
    else if (e.kind === 'inductor' && !ctx.couplings.has(e.key)) r.lH += (e.value ?? 0) * referred;
    else if (e.kind === 'vsource') addSine(r, e, sign * (e.terminals[0]!.node === step.from ? 1 : -1), t.voltageRatio);
  }
}

function zero(): Phasor {
  return { re: 0, im: 0 };
}
function add(a: Phasor, b: Phasor): Phasor {
  return { re: a.re + b.re, im: a.im + b.im };
}
function scale(a: Phasor, k: number): Phasor {
  return { re: a.re * k, im: a.im * k };
}
function magnitude(a: Phasor): number {
  return Math.hypot(a.re, a.im);
}
