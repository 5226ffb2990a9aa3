/**
 * One recognised rectifier taken through ratings and the solver: its parts' ratings (with their
 * origins), its equivalent circuit, its corners and the solution (through the memoised solver).
 */
import type { FlatCircuit, FlatModel } from '../circuit/index';
import type { Finding } from './findings';
import type { AnalysisSettings } from './settings';
import { createRatingResolver, type PartsFile, type RatingsOf, type ResolvedRatings } from '../ratings/index';
import { toEquivalentCircuit, type DeviceRatingHints, type Rectifier, type RectifierDeviceRef } from '../recognize/index';
import { defaultCorners, deviceFiguresOf, type Corner, type DeviceFigures, type EquivalentCircuit, type RectifierSolution } from '../solve/index';
import type { SolveFn } from './solver-memo';

export interface DeviceAnalysis {
  ref: RectifierDeviceRef;
  model?: FlatModel;
  ratings: ResolvedRatings<'diode'> | ResolvedRatings<'mosfet'>;
  /** Its worst-case figures, per-corner figures and surge, taken from the solution once (solve/device-figures.ts). */
  figures: DeviceFigures;
}

export interface CapacitorAnalysis {
  name: string;
  ratings: RatingsOf<'capacitor'>;
}

export interface RectifierAnalysis {
  rectifier: Rectifier;
  circuit: EquivalentCircuit;
  corners: Corner[];
  solution: RectifierSolution;
  devices: DeviceAnalysis[];
  capacitors: CapacitorAnalysis[];
  /** The controller's ratings (active bridges), when one is rated. */
  controller?: RatingsOf<'controller'>;
}

export type { SolutionCache } from './solver-memo';

/**
 * Analyses the rectifiers in order while the solver budget lasts: before each one the periods
 * integrated so far (`solverPeriods`) are compared with `maxPeriods`; once it is spent the rest are
 * left out (the caller reports them). The count comes from the solutions, so a cached solution
 * counts the same as a fresh one and the cut falls in the same place on every run and machine.
 */
export function analyseRectifiers(
  flat: FlatCircuit, rectifiers: readonly Rectifier[], settings: AnalysisSettings, partsFiles: readonly PartsFile[], solve: SolveFn,
  maxPeriods = Infinity,
): { analyses: RectifierAnalysis[]; findings: Finding[] } {
  const resolve = createRatingResolver({ directives: flat.directives, partsFiles });
  const findings: Finding[] = [];
  const analyses: RectifierAnalysis[] = [];
  let periods = 0;
  for (const rectifier of rectifiers) {
    if (periods >= maxPeriods) break;
    const rated = rectifier.devices.map((ref) => resolveDevice(ref, flat, resolve));
    const hints = ratingHints(rated, resolve);
    const { circuit, diagnostics } = toEquivalentCircuit(rectifier, flat.models, hints);
    findings.push(...diagnostics);
    const corners = cornersFor(rectifier, flat, settings);
    const solution = solve(circuit, corners);
    periods += solverPeriods(solution);
    const devices = rated.map((d, k): DeviceAnalysis => ({ ...d, figures: deviceFiguresOf(circuit, solution, k) }));
    const capacitors = rectifier.surroundings.capacitors.flatMap((c) => c.names).map((name) => ({
      name, ratings: resolve({ kind: 'capacitor', instanceName: name }).ratings,
    }));
    const controllerRef = rectifier.devices.flatMap((d) => d.controllers ?? [])[0];
    const analysis: RectifierAnalysis = { rectifier, circuit, corners, solution, devices, capacitors };
    if (controllerRef) analysis.controller = resolve({ kind: 'controller', instanceName: controllerRef.name, modelName: controllerRef.subckt }).ratings;
    analyses.push(analysis);
  }
  return { analyses, findings };
}

/** The solver's work for one rectifier: periods integrated, each corner's shooting iterations and its recorded period. */
export function solverPeriods(solution: RectifierSolution): number {
  return solution.corners.reduce((sum, c) => sum + c.shootingIterations + 1, 0);
}

type Resolver = ReturnType<typeof createRatingResolver>;

function resolveDevice(ref: RectifierDeviceRef, flat: FlatCircuit, resolve: Resolver): Omit<DeviceAnalysis, 'figures'> {
  const model = ref.model ? flat.models.get(ref.model) : undefined;
  const query = { instanceName: ref.name, modelName: model?.name, model: model ? { name: model.name, params: model.params, uri: model.uri, span: model.span } : undefined };
  const ratings = ref.type === 'diode' ? resolve({ kind: 'diode', ...query }) : resolve({ kind: 'mosfet', ...query });
  return model ? { ref, model, ratings } : { ref, ratings };
}

/** What the equivalent circuit needs from the ratings, looked up by instance name. */
function ratingHints(devices: readonly Omit<DeviceAnalysis, 'figures'>[], resolve: Resolver) {
  const byName = new Map(devices.map((d) => [d.ref.name.toLowerCase(), d]));
  return ({ instance, model }: { instance: string; model?: string }): DeviceRatingHints | undefined => {
    const device = byName.get(instance.toLowerCase());
    if (!device) {
      const controller = resolve({ kind: 'controller', instanceName: instance, modelName: model }).ratings;
      return controller.vminV ? { vminV: controller.vminV.value } : undefined;
    }
    const r = device.ratings.ratings;
    const hints: DeviceRatingHints = {};
    if (r.rthjaKPerW) hints.rthjaKPerW = r.rthjaKPerW.value;
    if (r.kind === 'mosfet' && r.rdsonOhm) hints.rdsonOhm = r.rdsonOhm.value;
    const fitted = device.ratings.forwardModel;
    if (fitted) hints.forwardModel = { isA: fitted.isA, n: fitted.n, rsOhm: fitted.rsOhm, egEv: fitted.egEv, xti: fitted.xti, tnomC: fitted.tnomC };
    return hints;
  };
}

/** Line tolerance from the mains directive, then settings, then the solver's defaults; ambient likewise. */
function cornersFor(rectifier: Rectifier, flat: FlatCircuit, settings: AnalysisSettings): Corner[] {
  const mains = rectifier.surroundings.source.mains;
  const ambient = flat.directives.find((d) => d.directive.keyword === 'ambient')?.directive;
  const fromAmbient = ambient && ambient.keyword === 'ambient' ? ambient : undefined;
  return defaultCorners({
    lineTolLow: mains?.tolLow ?? settings.corners?.lineLow,
    lineTolHigh: mains?.tolHigh ?? settings.corners?.lineHigh,
    ambientNominalC: fromAmbient?.nominalC ?? settings.corners?.ambientNominalC,
    ambientMaxC: fromAmbient?.maxC ?? settings.corners?.ambientMaxC,
  });
}
