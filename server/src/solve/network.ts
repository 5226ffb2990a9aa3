/**
 * The solver's view of one rectifier at one corner: AC lines, two rails, capacitor ports, and
 * the conduction paths between them. Every supported topology is a "rail network": each device
 * joins a line to a rail (upper: line → DC+, lower: DC− → line). Bridges have floating rails and
 * conduct through an upper/lower pair; half-wave, centre tap and doublers have rails fixed to the
 * source's return and conduct through one device. In every topology at most one path conducts
 * at a time while a capacitor holds the output above zero, which keeps each implicit step scalar.
 */
import type { ControllerSupply, EquivalentCircuit, FixedLoad, Load, RectifierDevice } from './equivalent-circuit';
import { scaleDiodeToTemp, type DiodeAtTemp } from './diode-model';
import { DEFAULT_CONTROLLER_VMIN_V, DEFAULT_GATE_ON_V, rdsOnOhm, type ConductingDevice } from './mosfet-model';
import { buildGates, type GateRule } from './gates';

/** An AC line: EMF a·sin ωt + b·cos ωt plus port terms, series R and L. */
export interface NetLine {
  a: number;
  b: number;
  rOhm: number;
  lH: number;
  /** How this line's current appears in the mains current (per unit of turns ratio). */
  mainsCoeff: number;
  /** EMF contribution per port voltage (the series capacitor of a half-wave doubler). */
  portCoeff: number[];
}

/** A conduction path: one upper and/or one lower device, with its drive EMF and port signs. */
export interface NetPath {
  upLine: number;
  lowLine: number;
  devices: number[];
  a: number;
  b: number;
  rOhm: number;
  lH: number;
  /** Drive = EMF − Σ s_j·u_j; port j receives s_j·i. */
  s: Float64Array;
  /** Sign of the path current in the mains-referred source current. */
  srcSign: number;
}

export interface NetPort {
  name: string;
  cF: number;
  esrOhm: number;
  /** 1 when the load voltage includes this port. */
  l: number;
  /** A port with no capacitor: the load resistance itself (resistive load without filter). */
  bare: boolean;
}

export interface LoadModel {
  kind: Load['kind'];
  rOhm: number;
  iA: number;
  pW: number;
  /** Below this voltage current and power loads fall linearly to zero, keeping voltages ≥ 0. */
  vFloorV: number;
  /**
   * More than one kind at once (a directive's load with a bleeder or current sink beside it):
   * the load draws v/rOhm + iA + pW/v, the current and power parts fading below vFloorV.
   */
  mixed: boolean;
}

export interface NetDevice extends ConductingDevice {
  name: string;
  line: number;
  upper: boolean;
  gate: GateRule | undefined;
  source: RectifierDevice;
}

export interface Network {
  omega: number;
  periodS: number;
  /** Largest path EMF amplitude: the voltage scale for tolerances. */
  vScaleV: number;
  lines: NetLine[];
  paths: NetPath[];
  ports: NetPort[];
  /** Number of capacitor states (ports that are not bare). */
  nCap: number;
  hasL: boolean;
  /**
   * The inductance is a DC choke shared by every path (no line inductance): its current passes
   * from one path to the next without falling to zero (continuous conduction), the bridge
   * commutating instantly. Otherwise a path's inductor current must reach zero before another
   * path conducts (at most one path at a time).
   */
  sharedL: boolean;
  /**
   * A transformer's magnetising current in the mains-referred source current (before the turns
   * ratio): i = magA·sin ωt + magB·cos ωt, the integral of line a's EMF over the referred
   * magnetising inductance. Zero without a transformer.
   */
  magA: number;
  magB: number;
  /** States: capacitor voltages, then the path inductor current when hasL. */
  n: number;
  floatingRails: boolean;
  railPlus: number[];
  railMinus: number[];
  devices: NetDevice[];
  load: LoadModel;
  /**
   * Instants within one period, ascending, in [0, T), where a step must end and the next restart:
   * gate switching instants, and with a shared choke its natural commutations (`commutationTimes`).
   */
  breakpointsS: number[];
  /**
   * Crest and trough instants of every path's EMF in [0, T). Steps stop there so that a short
   * conduction window at the crest (a light load) cannot fall between two stage points unseen,
   * and so that the peak reverse voltages are sampled at their tops.
   */
  crestsS: number[];
  /** Number of AC phases (3 for the three-phase bridge) for power-factor figures. */
  phases: number;
  /** RMS of the reference line EMF at this corner. */
  lineVrms: number;
}

interface Layout {
  lines: NetLine[];
  floating: boolean;
  railPlus: number[];
  railMinus: number[];
  loadShare: number[];
  place: (role: string) => { line: number; upper: boolean } | undefined;
}

const LINE_INDEX: Record<string, number> = { a: 0, b: 1, c: 2 };

/** Places the circuit's lines, rails and roles for its topology (see DeviceRole). */
function layoutFor(c: EquivalentCircuit, vm: number, nPorts: number): Layout {
  const r = c.source.seriesROhm;
  const l = c.source.seriesLH;
  const line = (amp: number, phase: number, rr: number, ll: number, mains: number, pc?: number[]): NetLine => ({
    a: amp * Math.cos(phase), b: amp * Math.sin(phase), rOhm: rr, lH: ll, mainsCoeff: mains,
    portCoeff: pc ?? new Array<number>(nPorts).fill(0),
  });
  const bridgeRole = (role: string) => {
    const m = /^(upper|lower)-([abc])$/.exec(role);
    return m ? { line: LINE_INDEX[m[2]!]!, upper: m[1] === 'upper' } : undefined;
  };
  switch (c.kind) {
    case 'three-phase-bridge':
      return {
        lines: [0, -1, 1].map((k, i) => line(vm, (k * 2 * Math.PI) / 3, r, 0, i === 0 ? 1 : 0)),
        floating: true, railPlus: [1], railMinus: [0], loadShare: [1], place: bridgeRole,
      };
    case 'half-wave':
      return {
        lines: [line(vm, 0, r, l, 1)], floating: false, railPlus: [1], railMinus: [0], loadShare: [1],
        place: (role) => (role === 'series' || role === 'upper-a' ? { line: 0, upper: true } : undefined),
      };
    case 'centre-tap':
      return {
        lines: [line(vm, 0, r, l, 1), line(vm, Math.PI, r, l, -1)], floating: false,
        railPlus: [1], railMinus: [0], loadShare: [1],
        place: (role) => (role === 'winding-a' ? { line: 0, upper: true } : role === 'winding-b' ? { line: 1, upper: true } : undefined),
      };
    case 'doubler': {
      const half = c.doubler === 'half-wave';
      const place = (role: string) => (role === 'd1' ? { line: 0, upper: false } : role === 'd2' ? { line: 0, upper: true } : undefined);
      return half
        ? { lines: [line(vm, 0, r, l, 1, [1, 0])], floating: false, railPlus: [0, 1], railMinus: [0, 0], loadShare: [0, 1], place }
        : { lines: [line(vm, 0, r, l, 1)], floating: false, railPlus: [0, 1], railMinus: [-1, 0], loadShare: [1, 1], place };
    }
    default:
      return {
        lines: [line(vm, 0, r, l, 1), line(0, 0, 0, 0, 0)], floating: true,
        railPlus: [1], railMinus: [0], loadShare: [1], place: bridgeRole,
      };
  }
}

/** Options that shape the network; all have defaults. */
export interface NetworkOptions {
  /** Minimum operating voltage of an active-bridge controller when the circuit gives none. */
  controllerVminV?: number;
}

/**
 * Builds the network for one corner. Problems (anything assumed or not modelled) are appended
 * to `problems`; undefined means the circuit cannot be solved at all.
 */
export function buildNetwork(
  c: EquivalentCircuit, lineScale: number, tjC: readonly number[], problems: string[], opts: NetworkOptions = {},
): Network | undefined {
  const { freqHz } = c.source;
  const vm = Math.SQRT2 * c.source.vrms * lineScale;
  if (!(freqHz > 0) || !Number.isFinite(freqHz)) return fail(problems, 'source frequency is not positive');
  if (!(vm > 0) || !Number.isFinite(vm)) return fail(problems, 'source voltage is zero (shorted or missing source): nothing conducts');
  const ports = buildPorts(c, problems);
  if (!ports) return undefined;
  const lay = layoutFor(c, vm, ports.length);
  if (c.kind === 'three-phase-bridge' && c.source.seriesLH > 0) problems.push(THREE_PHASE_LINE_L_NOTE);
  const choke = chokeOf(c, problems);
  const devices = placeDevices(c, lay, tjC, problems);
  if (!devices) return undefined;
  const paths = buildPaths(lay, devices, ports.length);
  for (const p of paths) { p.lH += choke.lH; p.rOhm += choke.rOhm; }
  if (paths.length === 0) return fail(problems, 'no conduction path: device roles do not fit the topology');
  const omega = 2 * Math.PI * freqHz;
  const vmin = c.controllerVminV ?? opts.controllerVminV ?? DEFAULT_CONTROLLER_VMIN_V;
  const gates = buildGates(devices, lay.lines, vmin, omega);
  const hasL = paths.some((p) => p.lH > 0);
  const nCap = ports.filter((p) => !p.bare).length;
  const vScaleV = Math.max(...paths.map((p) => Math.hypot(p.a, p.b)));
  const sharedL = choke.lH > 0 && lay.lines.every((l) => l.lH === 0);
  // ∫(a·sin ωt + b·cos ωt)dt / Lm = (b·sin ωt − a·cos ωt)/(ω·Lm), line a's EMF (the primary's, referred).
  const lm = c.source.magnetisingLH;
  const l0 = lay.lines[0]!;
  const magA = lm !== undefined && lm > 0 ? l0.b / (omega * lm) : 0;
  const magB = lm !== undefined && lm > 0 ? -l0.a / (omega * lm) : 0;
  return {
    omega, periodS: 1 / freqHz, vScaleV, lines: lay.lines, paths, ports, nCap, hasL, sharedL, magA, magB, n: nCap + (hasL ? 1 : 0),
    floatingRails: lay.floating, railPlus: lay.railPlus, railMinus: lay.railMinus, devices,
    load: buildLoad(c.load, withControllerSupply(c.fixedLoad, c.controllerSupply), vScaleV), breakpointsS: sharedL ? [...gates, ...commutationTimes(paths, omega)].sort((x, y) => x - y) : gates, crestsS: crestTimes(paths, omega), phases: c.kind === 'three-phase-bridge' ? 3 : 1,
    lineVrms: c.source.vrms * lineScale,
  };
}

/**
 * Said when a three-phase bridge has line inductance and reaches this network (a MOSFET bridge, or
 * one with a DC choke too; a diode bridge with line inductance alone goes to overlap-corner.ts):
 * during commutation three devices conduct at once, which the one-path-at-a-time network cannot
 * hold, so the corner is solved with L = 0.
 * The analysis turns this note into a finding naming what it leaves unchecked.
 */
export const THREE_PHASE_LINE_L_NOTE = 'three-phase bridge: line inductance not modelled (commutation overlap, three devices conducting at once); solved with L = 0';

/**
 * Said when a bridge has both line inductance and a DC choke: in continuous conduction the
 * bridge then commutates with an overlap (all its devices conducting for a while), which the
 * network cannot hold; the line inductance must reach zero current before the next pair conducts.
 */
export const CHOKE_AND_LINE_L_NOTE = 'bridge with both line inductance and a DC choke: commutation overlap not modelled; the choke current must fall to zero before the next pair conducts';

/** Said when a doubler has a DC choke: its two capacitors have no single DC path for it. */
export const DOUBLER_CHOKE_NOTE = 'doubler: a DC choke is not modelled for this topology; solved without it';

/** Every note saying an inductance drawn in the loop was left out of (or simplified in) the solve. */
export const UNMODELLED_INDUCTANCE_NOTES: readonly string[] = [THREE_PHASE_LINE_L_NOTE, CHOKE_AND_LINE_L_NOTE, DOUBLER_CHOKE_NOTE];

/** The DC choke in every path's loop (zero when none); the kinds that have no DC path of their own say so. */
function chokeOf(c: EquivalentCircuit, problems: string[]): { lH: number; rOhm: number } {
  const ch = c.choke;
  if (!ch || !(ch.lH > 0)) return { lH: 0, rOhm: 0 };
  if (c.kind === 'doubler') {
    problems.push(DOUBLER_CHOKE_NOTE);
    return { lH: 0, rOhm: 0 };
  }
  // One path (half-wave) never commutates; the three-phase bridge says so through its own note.
  if (c.source.seriesLH > 0 && c.kind !== 'three-phase-bridge' && c.kind !== 'half-wave') problems.push(CHOKE_AND_LINE_L_NOTE);
  return { lH: ch.lH, rOhm: Math.max(ch.rOhm, 0) };
}

function fail(problems: string[], why: string): undefined {
  problems.push(why);
  return undefined;
}

function buildPorts(c: EquivalentCircuit, problems: string[]): NetPort[] | undefined {
  const caps = c.capacitors.filter((cap) => {
    const ok = cap.cF > 0 && Number.isFinite(cap.cF);
    if (!ok) problems.push(`capacitor ${cap.name} has no positive capacitance; ignored`);
    return ok;
  });
  if (c.kind === 'doubler') {
    if (caps.length < 2) return fail(problems, 'voltage doubler needs two capacitors');
    const half = c.doubler === 'half-wave';
    return caps.slice(0, 2).map((cap, i) => ({ name: cap.name, cF: cap.cF, esrOhm: Math.max(cap.esrOhm, 0), l: half && i === 0 ? 0 : 1, bare: false }));
  }
  if (caps.length === 0) {
    if (c.load.kind !== 'resistance' || !(c.load.ohm > 0) || (c.fixedLoad?.a ?? 0) !== 0) {
      return fail(problems, 'no filter capacitor and no load resistance: a current, power or absent load cannot be solved without a capacitor');
    }
    return [{ name: 'load', cF: 0, esrOhm: 0, l: 0, bare: true }];
  }
  // Parallel capacitors merge: capacitances add, ESRs combine in parallel.
  const cF = caps.reduce((s, cap) => s + cap.cF, 0);
  const g = caps.reduce((s, cap) => s + (cap.esrOhm > 0 ? 1 / cap.esrOhm : Infinity), 0);
  return [{ name: caps.map((cap) => cap.name).join('+'), cF, esrOhm: Number.isFinite(g) ? 1 / g : 0, l: 1, bare: false }];
}

function placeDevices(c: EquivalentCircuit, lay: Layout, tjC: readonly number[], problems: string[]): NetDevice[] | undefined {
  const out: NetDevice[] = [];
  for (const [k, d] of c.devices.entries()) {
    const at = lay.place(d.role);
    if (!at || at.line >= lay.lines.length) return fail(problems, `device ${d.name}: role ${d.role} does not fit a ${c.kind}`);
    out.push(makeDevice(d, at.line, at.upper, tjC[k] ?? 25));
  }
  return out;
}

/** A device at a junction temperature (gate off until the integrator sets it). */
export function makeDevice(d: RectifierDevice, line: number, upper: boolean, tjC: number): NetDevice {
  const p = paramsAtTemp(d, tjC);
  // One literal shape for every device, so the stage solver's reads of it stay monomorphic.
  return { isA: p.isA, nVtV: p.nVtV, rsOhm: p.rsOhm, rdsOhm: p.rdsOhm, channelOn: false, name: d.name, line, upper, gate: undefined, source: d };
}

/** The temperature-dependent parameters of a device: its diode (or body diode) and its channel. */
function paramsAtTemp(d: RectifierDevice, tjC: number): DiodeAtTemp & { rdsOhm: number } {
  const body = scaleDiodeToTemp(d.kind === 'diode' ? d.params : d.body, tjC);
  const rdsOhm = d.kind === 'mosfet' ? rdsOnOhm(d.rdsOn25Ohm, d.rdsOnTempExponent, tjC) : Infinity;
  return { isA: body.isA, nVtV: body.nVtV, rsOhm: body.rsOhm, rdsOhm };
}

/** Re-scales every device to new junction temperatures (the electro-thermal loop). */
export function setDeviceTemperatures(net: Network, tjC: readonly number[]): void {
  net.devices.forEach((d, k) => {
    const p = paramsAtTemp(d.source, tjC[k] ?? 25);
    d.isA = p.isA;
    d.nVtV = p.nVtV;
    d.rsOhm = p.rsOhm;
    d.rdsOhm = p.rdsOhm;
  });
}

function buildPaths(lay: Layout, devices: NetDevice[], nPorts: number): NetPath[] {
  const paths: NetPath[] = [];
  const ups = devices.map((d, k) => [d, k] as const).filter(([d]) => d.upper);
  const lows = devices.map((d, k) => [d, k] as const).filter(([d]) => !d.upper);
  const mk = (up: number, low: number, devs: number[], s: number[]): NetPath => {
    const lu = up >= 0 ? lay.lines[up]! : undefined;
    const ll = low >= 0 ? lay.lines[low]! : undefined;
    return {
      upLine: up, lowLine: low, devices: devs, s: Float64Array.from(s),
      a: (lu?.a ?? 0) - (ll?.a ?? 0), b: (lu?.b ?? 0) - (ll?.b ?? 0),
      rOhm: (lu?.rOhm ?? 0) + (ll?.rOhm ?? 0), lH: (lu?.lH ?? 0) + (ll?.lH ?? 0),
      srcSign: (lu?.mainsCoeff ?? 0) - (ll?.mainsCoeff ?? 0),
    };
  };
  if (lay.floating) {
    for (const [u, ku] of ups) for (const [w, kw] of lows) if (u.line !== w.line) paths.push(mk(u.line, w.line, [ku, kw], [1]));
    return paths;
  }
  for (const [u, ku] of ups) {
    const pc = lay.lines[u.line]!.portCoeff;
    paths.push(mk(u.line, -1, [ku], range(nPorts).map((j) => lay.railPlus[j]! - pc[j]!)));
  }
  for (const [w, kw] of lows) {
    const pc = lay.lines[w.line]!.portCoeff;
    paths.push(mk(-1, w.line, [kw], range(nPorts).map((j) => pc[j]! - lay.railMinus[j]!)));
  }
  return paths;
}

/**
 * Instants in [0, T) where a·sin ωt + b·cos ωt has its crest or trough, for every path (the
 * troughs are where the reverse voltages peak).
 */
function crestTimes(paths: NetPath[], omega: number): number[] {
  const T = (2 * Math.PI) / omega;
  const wrap = (x: number) => ((x % T) + T) % T;
  const out = paths.flatMap((p) => {
    const phi = Math.atan2(p.b, p.a);
    return [wrap((Math.PI / 2 - phi) / omega), wrap(((3 * Math.PI) / 2 - phi) / omega)];
  });
  return [...new Set(out)].sort((x, y) => x - y);
}

/**
 * A shared choke's current passes to whichever path has the largest EMF (stage.ts), so it
 * commutes where the two leading EMFs are equal. Each instant is moved 1e-9·T earlier: the step
 * before ends in the old path and the short restart step carries the change, so the device
 * currents' quadrature does not smear the jump over a whole step. Only where every path feeds
 * the ports alike (else the port terms, not the EMFs alone, decide the path).
 */
function commutationTimes(paths: NetPath[], omega: number): number[] {
  const T = (2 * Math.PI) / omega;
  if (paths.some((p) => p.s.some((x, j) => x !== paths[0]!.s[j]))) return [];
  const wrap = (x: number) => ((x % T) + T) % T;
  const emf = (p: NetPath, t: number) => p.a * Math.sin(omega * t) + p.b * Math.cos(omega * t);
  const scale = Math.max(...paths.map((p) => Math.hypot(p.a, p.b)));
  const out: number[] = [];
  for (let p = 0; p < paths.length; p++) {
    for (let q = p + 1; q < paths.length; q++) {
      const da = paths[p]!.a - paths[q]!.a;
      const db = paths[p]!.b - paths[q]!.b;
      if (Math.hypot(da, db) <= 1e-12 * scale) continue;
      // da·sin ωt + db·cos ωt = 0 at ωt = atan2(−db, da) + kπ.
      for (const k of [0, 1]) {
        const t = wrap((Math.atan2(-db, da) + k * Math.PI) / omega);
        const top = emf(paths[p]!, t);
        if (paths.every((r) => emf(r, t) <= top + 1e-9 * scale)) out.push(wrap(t - 1e-9 * T));
      }
    }
  }
  return [...new Set(out)];
}

function range(n: number): number[] {
  return Array.from({ length: n }, (_, i) => i);
}

/** The controller's quiescent draw joins the fixed load: a current and a conductance across the output. */
function withControllerSupply(fixed: FixedLoad | undefined, supply: ControllerSupply | undefined): FixedLoad | undefined {
  if (!supply) return fixed;
  const g = (fixed?.ohm !== undefined && fixed.ohm > 0 ? 1 / fixed.ohm : 0) + (supply.ohm !== undefined && supply.ohm > 0 ? 1 / supply.ohm : 0);
  return { ...(g > 0 ? { ohm: 1 / g } : {}), a: (fixed?.a ?? 0) + Math.max(supply.iA, 0) };
}

function buildLoad(load: Load, fixed: FixedLoad | undefined, vScaleV: number): LoadModel {
  const own = ownLoad(load, vScaleV);
  const fixedG = fixed?.ohm !== undefined && fixed.ohm > 0 ? 1 / fixed.ohm : 0;
  const fixedA = fixed?.a ?? 0;
  if (fixedG === 0 && fixedA === 0) return own;
  // Conductances add; the fixed current adds to the load's own (a current sink drawn beside it).
  const g = (Number.isFinite(own.rOhm) ? 1 / own.rOhm : 0) + fixedG;
  const merged: LoadModel = { ...own, rOhm: g > 0 ? 1 / g : Infinity, iA: own.iA + fixedA };
  if (merged.kind === 'none') merged.kind = fixedA !== 0 ? 'current' : 'resistance';
  merged.mixed = !(merged.kind === 'resistance' && merged.iA === 0);
  return merged;
}

function ownLoad(load: Load, vScaleV: number): LoadModel {
  // Current and power loads fade out below 5 % of the source peak (or a power load's vmin):
  // a real converter stops at its undervoltage lockout; the fade keeps the model bounded.
  const floor = 0.05 * vScaleV;
  switch (load.kind) {
    case 'resistance': return { kind: 'resistance', rOhm: load.ohm > 0 ? load.ohm : Infinity, iA: 0, pW: 0, vFloorV: floor, mixed: false };
    case 'current': return { kind: 'current', rOhm: Infinity, iA: Math.max(load.a, 0), pW: 0, vFloorV: floor, mixed: false };
    case 'power': return { kind: 'power', rOhm: Infinity, iA: 0, pW: Math.max(load.w, 0), vFloorV: load.vminV && load.vminV > 0 ? load.vminV : floor, mixed: false };
    default: return { kind: 'none', rOhm: Infinity, iA: 0, pW: 0, vFloorV: floor, mixed: false };
  }
}

/** The default gate-on threshold for a MOSFET. */
export function gateOnVoltage(d: RectifierDevice): number {
  return d.kind === 'mosfet' && d.gateOnV !== undefined ? d.gateOnV : DEFAULT_GATE_ON_V;
}
