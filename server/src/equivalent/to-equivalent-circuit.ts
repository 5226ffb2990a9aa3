/**
 * A recognised rectifier with its resolved ratings → the solver's equivalent circuit. Diodes take
 * their `.model` parameters (IS, N, RS, EG, XTI, TNOM; SPICE3 defaults for the rest), or a forward
 * model fitted to their rated forward points when the `.model` gives no IS; MOSFETs take an
 * on-resistance from the model (`rdson`, `rds_on` or `ron`), else from the ratings (`*@ rate …
 * rdson=`), else a documented default. The controller's minimum voltage comes from its ratings
 * (`*@ rate <instance or subckt> vmin=`), else the solver's common-practice default. Every default
 * taken is said in a finding.
 */
import { controllerSupplyOf } from './controller-supply';
import { displayNumber } from '../../../grammar/src/index';
import type { FlatModel } from '../circuit/index';
import type { Finding } from '../findings/index';
import type { Rated, RatingsOf, ResolvedRatings } from '../ratings/index';
import type { Rectifier, RectifierDeviceRef } from '../recognize/index';
import {
  DEFAULT_CONTROLLER_VMIN_V, DEFAULT_RDSON_TEMP_EXPONENT, SPICE_DIODE_DEFAULTS,
  type EquivalentCircuit, type InrushLimiter, type Load, type RectifierDevice,
} from '../solve/index';
import { bodyDiodeParams, diodeParamsOfForwardModel, diodeParamsOfModel, VSD_DEFAULT_CURRENT_A } from './diode-params';
import { filterCapacitorOf, withVfSpread } from './part-spreads';

/** The resolved ratings a rectifier's equivalent circuit is built from. */
export interface RatedParts {
  /** One per device of the rectifier, in its order. */
  devices: readonly (ResolvedRatings<'diode'> | ResolvedRatings<'mosfet'>)[];
  /** One per controller of the rectifier's active devices, in order of first appearance. */
  controllers: readonly RatingsOf<'controller'>[];
  /** Hot resistances of NTC inrush limiters by lowercase instance name (`*@ rate R… hot=`). */
  limiterHotOhm?: ReadonlyMap<string, Rated<number>>;
  /** Each filter capacitor's ratings by instance name (rated ESR, tolerance, loss over life: part-spreads.ts). */
  capacitors?: ReadonlyMap<string, RatingsOf<'capacitor'>>;
}

/**
 * On-resistance assumed for a MOSFET with none given: 50 mΩ at 25 °C. A placeholder of common
 * practice for the low-voltage parts used in active bridges, not a datasheet value.
 */
export const DEFAULT_RDSON_OHM = 0.05;

const RDSON_KEYS = ['rdson', 'rds_on', 'ron'];

/** The equivalent circuit of a rectifier, and findings for every default it had to take. */
export function toEquivalentCircuit(
  rectifier: Rectifier, models: ReadonlyMap<string, FlatModel>, rated: RatedParts,
): { circuit: EquivalentCircuit; findings: Finding[] } {
  const findings: Finding[] = [];
  const say = (message: string, code = 'default-model') => findings.push({ ...rectifier.anchor, severity: 'info', code, message });
  const devices = rectifier.devices.map((d, k) => withVfSpread(toDevice(d, models, rated.devices[k], say), rated.devices[k]));
  const { source } = rectifier.surroundings;
  const circuit: EquivalentCircuit = {
    kind: rectifier.kind,
    source: {
      vrms: source.vrms, freqHz: source.freqHz, seriesROhm: source.seriesROhm, seriesLH: source.seriesLH,
      mainsVrms: source.mainsVrms, turnsRatio: source.turnsRatio,
      ...(source.magnetisingLH !== undefined ? { magnetisingLH: source.magnetisingLH } : {}),
    },
    devices,
    capacitors: rectifier.surroundings.capacitors.map((c) => filterCapacitorOf(c, rated.capacitors)),
    load: toLoad(rectifier),
  };
  const fixed = rectifier.surroundings.load.fixed;
  if (fixed) circuit.fixedLoad = { ...(fixed.ohm !== undefined ? { ohm: fixed.ohm } : {}), ...(fixed.a !== undefined ? { a: fixed.a } : {}) };
  const limiter = inrushLimiterOf(rectifier, rated.limiterHotOhm, say);
  if (limiter) {
    circuit.inrushLimiter = limiter;
    // The steady state runs with the limiter hot.
    circuit.source.seriesROhm += limiter.hotROhm - limiter.coldROhm;
  }
  if (rectifier.doubler) circuit.doubler = rectifier.doubler;
  const choke = rectifier.surroundings.choke;
  if (choke) circuit.choke = { names: [...choke.names], lH: choke.lH, rOhm: choke.rOhm };
  if (devices.some((d) => d.kind === 'mosfet' && d.gate === 'controller')) {
    circuit.controllerVminV = controllerVmin(rectifier, rated.controllers, say);
    const supply = controllerSupplyOf(rated.controllers.find((c) => c.iqPoints || c.iqA));
    if (supply) circuit.controllerSupply = supply;
  }
  return { circuit, findings };
}

/** The NTC limiters in the source loop, cold (card) and hot values summed and referred to the rectifier side. */
function inrushLimiterOf(rectifier: Rectifier, hot: RatedParts['limiterHotOhm'], say: Say): InrushLimiter | undefined {
  const found = (rectifier.surroundings.source.seriesResistors ?? []).flatMap((r) => {
    const rated = hot?.get(r.name.toLowerCase());
    return rated ? [{ ...r, hotOhm: rated.value }] : [];
  });
  // An NTC's resistance falls as it warms; a hot value at or above the card's is likely a slip.
  for (const r of found) {
    if (r.hotOhm >= r.ohm) say(`${r.name}: its hot resistance ${displayNumber(r.hotOhm)} Ω is not below its card (cold) value ${displayNumber(r.ohm)} Ω; an NTC limiter's falls as it warms. Taken as written`, 'assumed-condition');
  }
  if (found.length === 0) return undefined;
  return {
    names: found.map((r) => r.name),
    coldROhm: found.reduce((s, r) => s + r.ohm * r.referral, 0),
    hotROhm: found.reduce((s, r) => s + r.hotOhm * r.referral, 0),
  };
}

/** The controllers of a rectifier's active devices, each once, in order of first appearance. */
export function controllersOf(rectifier: Rectifier): { name: string; subckt?: string }[] {
  const seen = new Map<string, { name: string; subckt?: string }>();
  for (const c of rectifier.devices.flatMap((d) => d.controllers ?? [])) if (!seen.has(c.name)) seen.set(c.name, c);
  return [...seen.values()];
}

function toLoad(rectifier: Rectifier): Load {
  const load = rectifier.surroundings.load;
  switch (load.kind) {
    case 'resistance': return { kind: 'resistance', ohm: load.ohm };
    case 'current': return { kind: 'current', a: load.a };
    case 'power': return load.vminV === undefined ? { kind: 'power', w: load.w } : { kind: 'power', w: load.w, vminV: load.vminV };
    default: return { kind: 'none' };
  }
}

type Say = (message: string, code?: string) => void;

function toDevice(
  ref: RectifierDeviceRef, models: ReadonlyMap<string, FlatModel>, rated: RatedParts['devices'][number] | undefined, say: Say,
): RectifierDevice {
  const model = ref.model ? models.get(ref.model) : undefined;
  const ratings = rated?.ratings;
  const rth = ratings?.rthjaKPerW ? { rthjaKPerW: ratings.rthjaKPerW.value } : {};
  if (ref.type === 'diode') {
    const modelHasForwardLaw = model?.type === 'd' && model.params.is !== undefined;
    const fitted = rated?.forwardModel;
    if (!modelHasForwardLaw && fitted) return { kind: 'diode', name: ref.name, role: ref.role, params: diodeParamsOfForwardModel(fitted), ...rth };
    if (!model) say(`${ref.name} has no .model; using the SPICE3 diode defaults (IS 1e-14 A, N 1, RS 0, EG 1.11 eV, XTI 3)`);
    return { kind: 'diode', name: ref.name, role: ref.role, params: diodeParamsOfModel(model), ...rth };
  }
  const fromModel = RDSON_KEYS.map((k) => model?.params[k]).find((v) => v !== undefined && v > 0);
  const rdson = fromModel ?? (ratings?.kind === 'mosfet' ? ratings.rdsonOhm?.value : undefined);
  if (rdson === undefined) say(`${ref.name} has no on-resistance (model rdson= or *@ rate ${ref.name} rdson=); assuming ${DEFAULT_RDSON_OHM * 1000} mΩ at 25 °C`);
  return {
    kind: 'mosfet', name: ref.name, role: ref.role, rdsOn25Ohm: rdson ?? DEFAULT_RDSON_OHM, rdsOnTempExponent: DEFAULT_RDSON_TEMP_EXPONENT,
    body: bodyDiode(ratings?.kind === 'mosfet' ? ratings : undefined), gate: ref.gate ?? 'undriven', ...rth,
  };
}

/**
 * The body diode from the rated `vsd` (at the rated `id`, else a stated current), else the SPICE3
 * diode defaults (IS 1e-14 A, N 1: about 0.83 V at 1 A). A level-1 model's IS describes the bulk
 * junctions, not the body diode, so the `.model` card is not read for it. The default is not a
 * finding of its own: the body diode carries current only while the channel is off, and the
 * rules that judge that state (controller-undervoltage) say so.
 */
function bodyDiode(ratings: RatingsOf<'mosfet'> | undefined) {
  const vsd = ratings?.vsdV?.value;
  if (vsd === undefined || !(vsd > 0)) return { ...SPICE_DIODE_DEFAULTS };
  return bodyDiodeParams(vsd, ratings?.idA?.value ?? VSD_DEFAULT_CURRENT_A);
}

function controllerVmin(rectifier: Rectifier, controllers: RatedParts['controllers'], say: Say): number {
  const rated = controllers.find((c) => c.vminV)?.vminV;
  if (rated) return rated.value;
  const names = controllersOf(rectifier).map((c) => c.name).join(', ');
  say(`no vmin rated for the controller ${names}; assuming ${DEFAULT_CONTROLLER_VMIN_V} V (common practice), below which only the body diodes conduct`, 'assumed-condition');
  return DEFAULT_CONTROLLER_VMIN_V;
}
