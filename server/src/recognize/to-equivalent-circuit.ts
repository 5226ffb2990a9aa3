/**
 * A recognised rectifier → the solver's equivalent circuit. Diodes take their `.model` parameters
 * (IS, N, RS, EG, XTI, TNOM; SPICE3 defaults for the rest); MOSFETs take an on-resistance from the
 * model (`rdson`, `rds_on` or `ron`), else from the ratings hook (`*@ rate … rdson=`), else a
 * documented default. The controller's minimum voltage comes from the ratings hook (`*@ rate
 * <instance or subckt> vmin=`), else a common-practice default. Defaults are said in findings.
 */
import { key, type RateDirective } from '../../../grammar/src/index';
import type { CoreDiagnostic, FlatModel, PlacedDirective } from '../circuit/index';
import {
  SPICE_DIODE_DEFAULTS,
  type DiodeParams, type EquivalentCircuit, type FilterCapacitor, type Load, type RectifierDevice,
} from '../solve/equivalent-circuit';
import type { Rectifier, RectifierDeviceRef } from './rectifier';

/** Ratings the rest of the app knows for a part; every field optional. */
export interface DeviceRatingHints {
  /** A forward model from the part's ratings (vf points, catalog), used when the `.model` gives no IS. */
  forwardModel?: DiodeParams;
  rdsonOhm?: number;
  rthjaKPerW?: number;
  vminV?: number;
}

/**
 * Looks up ratings for an instance (hierarchical name as written) or a model / subcircuit name.
 * The ratings module (directives, parts file, catalog) plugs in here; `ratingsFromDirectives` is a
 * minimal stand-in that reads `*@ rate` directives only.
 */
export type RatingsHook = (target: { instance: string; model?: string }) => DeviceRatingHints | undefined;

/**
 * On-resistance assumed for a MOSFET with none given: 50 mΩ at 25 °C. A placeholder of common
 * practice for the low-voltage parts used in active bridges, not a datasheet value.
 */
export const DEFAULT_RDSON_OHM = 0.05;

/** Minimum supply of an active-bridge controller when none is rated: about 9 V, common practice. */
export const DEFAULT_CONTROLLER_VMIN_V = 9;

/** rdson(T) = rdson(25 °C)·(T/298.15 K)^2.3: the default exponent of DESIGN.md §5. */
const RDSON_TEMP_EXPONENT = 2.3;

const RDSON_KEYS = ['rdson', 'rds_on', 'ron'];

/** Reads `*@ rate` directives: the target is an instance name (hierarchical or leaf) or a model / subckt name. */
export function ratingsFromDirectives(directives: readonly PlacedDirective[]): RatingsHook {
  const byTarget = new Map<string, DeviceRatingHints>();
  for (const { directive } of directives) {
    if (directive.keyword !== 'rate' || !directive.target) continue;
    byTarget.set(key(directive.target), { ...byTarget.get(key(directive.target)), ...hintsOf(directive) });
  }
  return ({ instance, model }) => {
    const found = [key(instance), model ? key(model) : ''].map((k) => byTarget.get(k)).filter((h) => h);
    return found.length ? Object.assign({}, ...found.reverse()) : undefined;
  };
}

function hintsOf(directive: RateDirective): DeviceRatingHints {
  const hints: DeviceRatingHints = {};
  for (const entry of directive.entries) {
    if (entry.value === undefined) continue;
    if (entry.key === 'rdson') hints.rdsonOhm = entry.value;
    if (entry.key === 'rthja') hints.rthjaKPerW = entry.value;
    if (entry.key === 'vmin') hints.vminV = entry.value;
  }
  return hints;
}

/** The equivalent circuit of a rectifier, and findings for every default it had to take. */
export function toEquivalentCircuit(
  rectifier: Rectifier, models: ReadonlyMap<string, FlatModel>, ratings: RatingsHook = () => undefined,
): { circuit: EquivalentCircuit; diagnostics: CoreDiagnostic[] } {
  const diagnostics: CoreDiagnostic[] = [];
  const say = (message: string, code = 'default-model') => diagnostics.push({ ...rectifier.anchor, severity: 'info', code, message });
  const devices = rectifier.devices.map((d) => toDevice(d, models, ratings, say));
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
  if (devices.some((d) => d.kind === 'mosfet' && d.gate === 'controller')) circuit.controllerVminV = controllerVmin(rectifier, ratings, say);
  return { circuit, diagnostics };
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

function toDevice(ref: RectifierDeviceRef, models: ReadonlyMap<string, FlatModel>, ratings: RatingsHook, say: Say): RectifierDevice {
  const model = ref.model ? models.get(ref.model) : undefined;
  const hints = ratings({ instance: ref.name, model: model?.name }) ?? {};
  const rth = hints.rthjaKPerW !== undefined ? { rthjaKPerW: hints.rthjaKPerW } : {};
  if (ref.type === 'diode') {
    const modelHasForwardLaw = model?.type === 'd' && model.params.is !== undefined;
    if (!modelHasForwardLaw && hints.forwardModel) return { kind: 'diode', name: ref.name, role: ref.role, params: { ...hints.forwardModel }, ...rth };
    if (!model) say(`${ref.name} has no .model; using the SPICE3 diode defaults (IS 1e-14 A, N 1, RS 0, EG 1.11 eV, XTI 3)`);
    return { kind: 'diode', name: ref.name, role: ref.role, params: diodeParams(model), ...rth };
  }
  const fromModel = RDSON_KEYS.map((k) => model?.params[k]).find((v) => v !== undefined && v > 0);
  const rdson = fromModel ?? hints.rdsonOhm;
  if (rdson === undefined) say(`${ref.name} has no on-resistance (model rdson= or *@ rate ${ref.name} rdson=); assuming ${DEFAULT_RDSON_OHM * 1000} mΩ at 25 °C`);
  // The body diode keeps the SPICE3 diode defaults: a level-1 model's IS describes the bulk junctions, not the body diode.
  return {
    kind: 'mosfet', name: ref.name, role: ref.role, rdsOn25Ohm: rdson ?? DEFAULT_RDSON_OHM, rdsOnTempExponent: RDSON_TEMP_EXPONENT,
    body: { ...SPICE_DIODE_DEFAULTS }, gate: ref.gate ?? 'undriven', ...rth,
  };
}

/** Diode parameters from a model card, SPICE3 defaults for what it leaves out (and for a model that is not a diode). */
export function diodeParams(model: FlatModel | undefined): DiodeParams {
  const p = model && model.type === 'd' ? model.params : {};
  const pick = (name: string, fallback: number) => (p[name] !== undefined && Number.isFinite(p[name]) ? p[name]! : fallback);
  return {
    isA: pick('is', SPICE_DIODE_DEFAULTS.isA), n: pick('n', SPICE_DIODE_DEFAULTS.n), rsOhm: pick('rs', SPICE_DIODE_DEFAULTS.rsOhm),
    egEv: pick('eg', SPICE_DIODE_DEFAULTS.egEv), xti: pick('xti', SPICE_DIODE_DEFAULTS.xti), tnomC: pick('tnom', SPICE_DIODE_DEFAULTS.tnomC),
  };
}

function controllerVmin(rectifier: Rectifier, ratings: RatingsHook, say: Say): number {
  const controllers = rectifier.devices.flatMap((d) => d.controllers ?? []);
  for (const c of controllers) {
    const vmin = ratings({ instance: c.name, model: c.subckt })?.vminV;
    if (vmin !== undefined) return vmin;
  }
  const names = [...new Set(controllers.map((c) => c.name))].join(', ');
  say(`no vmin rated for the controller ${names}; assuming ${DEFAULT_CONTROLLER_VMIN_V} V (common practice), below which only the body diodes conduct`, 'assumed-condition');
  return DEFAULT_CONTROLLER_VMIN_V;
}
