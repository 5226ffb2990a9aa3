/**
 * A recognised rectifier with its resolved ratings → the solver's equivalent circuit. Diodes take
 * their `.model` parameters (IS, N, RS, EG, XTI, TNOM; SPICE3 defaults for the rest), or a forward
 * model fitted to their rated forward points when the `.model` gives no IS; MOSFETs take an
 * on-resistance from the model (`rdson`, `rds_on` or `ron`), else from the ratings (`*@ rate …
 * rdson=`), else a documented default. The controller's minimum voltage comes from its ratings
 * (`*@ rate <instance or subckt> vmin=`), else the solver's common-practice default. Every default
 * taken is said in a finding.
 */
import type { FlatModel } from '../circuit/index';
import type { Finding } from '../findings/index';
import type { RatingsOf, ResolvedRatings } from '../ratings/index';
import type { Rectifier, RectifierDeviceRef } from '../recognize/index';
import {
  DEFAULT_CONTROLLER_VMIN_V, DEFAULT_RDSON_TEMP_EXPONENT, SPICE_DIODE_DEFAULTS,
  type EquivalentCircuit, type FilterCapacitor, type Load, type RectifierDevice,
} from '../solve/index';
import { diodeParamsOfForwardModel, diodeParamsOfModel } from './diode-params';

/** The resolved ratings a rectifier's equivalent circuit is built from. */
export interface RatedParts {
  /** One per device of the rectifier, in its order. */
  devices: readonly (ResolvedRatings<'diode'> | ResolvedRatings<'mosfet'>)[];
  /** One per controller of the rectifier's active devices, in order of first appearance. */
  controllers: readonly RatingsOf<'controller'>[];
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
  const devices = rectifier.devices.map((d, k) => toDevice(d, models, rated.devices[k], say));
  const { source } = rectifier.surroundings;
  const circuit: EquivalentCircuit = {
    kind: rectifier.kind,
    source: {
      vrms: source.vrms, freqHz: source.freqHz, seriesROhm: source.seriesROhm, seriesLH: source.seriesLH,
      mainsVrms: source.mainsVrms, turnsRatio: source.turnsRatio,
    },
    devices,
    capacitors: rectifier.surroundings.capacitors.map((c): FilterCapacitor => ({ name: c.names.join('+'), cF: c.cF, esrOhm: c.esrOhm })),
    load: toLoad(rectifier),
  };
  if (rectifier.doubler) circuit.doubler = rectifier.doubler;
  if (devices.some((d) => d.kind === 'mosfet' && d.gate === 'controller')) circuit.controllerVminV = controllerVmin(rectifier, rated.controllers, say);
  return { circuit, findings };
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
  // The body diode keeps the SPICE3 diode defaults: a level-1 model's IS describes the bulk junctions, not the body diode.
  return {
    kind: 'mosfet', name: ref.name, role: ref.role, rdsOn25Ohm: rdson ?? DEFAULT_RDSON_OHM, rdsOnTempExponent: DEFAULT_RDSON_TEMP_EXPONENT,
    body: { ...SPICE_DIODE_DEFAULTS }, gate: ref.gate ?? 'undriven', ...rth,
  };
}

function controllerVmin(rectifier: Rectifier, controllers: RatedParts['controllers'], say: Say): number {
  const rated = controllers.find((c) => c.vminV)?.vminV;
  if (rated) return rated.value;
  const names = controllersOf(rectifier).map((c) => c.name).join(', ');
  say(`no vmin rated for the controller ${names}; assuming ${DEFAULT_CONTROLLER_VMIN_V} V (common practice), below which only the body diodes conduct`, 'assumed-condition');
  return DEFAULT_CONTROLLER_VMIN_V;
}
