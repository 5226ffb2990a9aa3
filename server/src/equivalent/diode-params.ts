/** SPICE diode parameters for the solver, from a `.model` card or from a forward model fitted to ratings. */
import type { FlatModel } from '../circuit/index';
import type { ForwardModel } from '../ratings/index';
import { SPICE_DIODE_DEFAULTS, thermalVoltageV, type DiodeParams } from '../solve/index';

/** The one conversion of a fitted forward model (ratings) to the solver's diode parameters. */
export function diodeParamsOfForwardModel(fm: ForwardModel): DiodeParams {
  return { isA: fm.isA, n: fm.n, rsOhm: fm.rsOhm, egEv: fm.egEv, xti: fm.xti, tnomC: fm.tnomC };
}

/** Diode parameters from a model card, SPICE3 defaults for what it leaves out (and for a model that is not a diode). */
export function diodeParamsOfModel(model: FlatModel | undefined): DiodeParams {
  const p = model && model.type === 'd' ? model.params : {};
  const pick = (name: string, fallback: number) => (p[name] !== undefined && Number.isFinite(p[name]) ? p[name]! : fallback);
  return {
    isA: pick('is', SPICE_DIODE_DEFAULTS.isA), n: pick('n', SPICE_DIODE_DEFAULTS.n), rsOhm: pick('rs', SPICE_DIODE_DEFAULTS.rsOhm),
    egEv: pick('eg', SPICE_DIODE_DEFAULTS.egEv), xti: pick('xti', SPICE_DIODE_DEFAULTS.xti), tnomC: pick('tnom', SPICE_DIODE_DEFAULTS.tnomC),
  };
}

/**
 * Current at which a rated body-diode drop VSD is taken when the part gives no drain current
 * rating: 1 A (common practice for the small parts of low-voltage active bridges; datasheets
 * state VSD at a source current of their own, usually near the rated ID).
 */
export const VSD_DEFAULT_CURRENT_A = 1;

/** Temperature a rated VSD is read at: 25 °C, the usual rating temperature (common practice). */
const VSD_RATING_TEMP_C = 25;

/**
 * A MOSFET's body diode from its rated forward drop `vsd` at a current: the SPICE3 diode with
 * N = 1 and no series resistance (an ideal junction, common practice for a body diode described
 * by one point), IS chosen so that V(atA) = vsd at 25 °C: IS = I/(exp(V/Vt) − 1). The band gap and
 * XTI keep the SPICE3 defaults, so the drop falls with temperature as silicon's does.
 */
export function bodyDiodeParams(vsdV: number, atA: number): DiodeParams {
  const vt = thermalVoltageV(VSD_RATING_TEMP_C);
  return { ...SPICE_DIODE_DEFAULTS, isA: atA / Math.expm1(vsdV / vt), n: 1, rsOhm: 0, tnomC: VSD_RATING_TEMP_C };
}
