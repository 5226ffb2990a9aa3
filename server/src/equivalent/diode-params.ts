/** SPICE diode parameters for the solver, from a `.model` card or from a forward model fitted to ratings. */
import type { FlatModel } from '../circuit/index';
import type { ForwardModel } from '../ratings/index';
import { SPICE_DIODE_DEFAULTS, type DiodeParams } from '../solve/index';

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
