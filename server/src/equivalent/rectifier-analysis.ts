/**
 * One recognised rectifier taken through ratings and the solver: its parts' ratings (with their
 * origins), its equivalent circuit, its corners and the solution (through the memoised solver).
 */
import type { FlatCircuit, FlatModel } from '../circuit/index';
import type { Finding } from '../findings/index';
import { createRatingResolver, limiterHotResistances, resistorTolerances, type AnalysisSettings, type PartsFile, type RatingsOf, type ResolvedRatings } from '../ratings/index';
import type { Rectifier, RectifierDeviceRef } from '../recognize/index';
import { defaultCorners, deviceFiguresOf, hasPartSpread, type Corner, type DeviceFigures, type EquivalentCircuit, type RectifierSolution, type SolveFn } from '../solve/index';
import { controllersOf, toEquivalentCircuit, type RatedParts } from './to-equivalent-circuit';
import { capacitorStressOf, type CapacitorStress } from './capacitor-stress';
import { stringSharesOf, type StageShare } from './string-share';

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
  /** Ripple loss, core temperature and life estimate over the corners (capacitor-stress.ts). */
  stress?: CapacitorStress;
  /** Its stage's share of a series string's voltage, when it sits in one (string-share.ts). */
  share?: StageShare;
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
  const resistors = resistorTolerances(flat.directives);
  let periods = 0;
  for (const rectifier of rectifiers) {
    if (periods >= maxPeriods) break;
    const { rated, parts } = rateRectifier(rectifier, flat, resolve);
    const { controllers } = parts;
    const { circuit, findings: assumed } = toEquivalentCircuit(rectifier, flat.models, parts);
    findings.push(...assumed);
    const corners = cornersFor(rectifier, circuit, flat, settings);
    const solution = solve(circuit, corners);
    periods += solverPeriods(solution);
    const devices = rated.map((d, k): DeviceAnalysis => ({ ...d, figures: figuresOf(circuit, solution, k) }));
    const shares = new Map(rectifier.surroundings.capacitors.flatMap((g) => [...stringSharesOf(g, parts.capacitors, resistors)]));
    const capacitors = [...(parts.capacitors ?? [])].map(([name, ratings]): CapacitorAnalysis => {
      const stress = capacitorStressOf(rectifier, flat, solution, name, ratings);
      const share = shares.get(name.toLowerCase());
      return { name, ratings, ...(stress ? { stress } : {}), ...(share ? { share } : {}) };
    });
    const analysis: RectifierAnalysis = { rectifier, circuit, corners, solution, devices, capacitors };
    // The controller whose vmin the circuit took, else the first.
    const controller = controllers.find((c) => c.vminV) ?? controllers[0];
    if (controller) analysis.controller = controller;
    analyses.push(analysis);
  }
  return { analyses, findings };
}

/**
 * Each device's figures, once per solution object: a cached solution is the one for exactly this
 * circuit and these corners (its key is their JSON), and the figures are a function of those, so
 * an edit that leaves a rectifier's inputs alone gets the very same figures objects back. The
 * language server relies on that sameness to post only what changed (lsp/posted-analysis.ts).
 */
const figuresBySolution = new WeakMap<RectifierSolution, DeviceFigures[]>();

function figuresOf(circuit: EquivalentCircuit, solution: RectifierSolution, k: number): DeviceFigures {
  let known = figuresBySolution.get(solution);
  if (!known) figuresBySolution.set(solution, (known = []));
  return (known[k] ??= deviceFiguresOf(circuit, solution, k));
}

/** The solver's work for one rectifier: periods integrated, each corner's shooting iterations and its recorded period. */
export function solverPeriods(solution: RectifierSolution): number {
  return solution.corners.reduce((sum, c) => sum + c.shootingIterations + 1, 0);
}

type Resolver = ReturnType<typeof createRatingResolver>;

/** A rectifier's devices and controllers with their resolved ratings: what its equivalent circuit is built from. */
export function rateRectifier(rectifier: Rectifier, flat: FlatCircuit, resolve: Resolver): { rated: Omit<DeviceAnalysis, 'figures'>[]; parts: RatedParts } {
  const rated = rectifier.devices.map((ref) => resolveDevice(ref, flat, resolve));
  const controllers = controllersOf(rectifier).map((c) => resolve({ kind: 'controller', instanceName: c.name, modelName: c.subckt }).ratings);
  const capacitors = new Map(rectifier.surroundings.capacitors.flatMap((c) => c.names).map((name) => [name, resolve({ kind: 'capacitor', instanceName: name }).ratings] as const));
  return { rated, parts: { devices: rated.map((d) => d.ratings), controllers, limiterHotOhm: limiterHotResistances(flat.directives), capacitors } };
}

function resolveDevice(ref: RectifierDeviceRef, flat: FlatCircuit, resolve: Resolver): Omit<DeviceAnalysis, 'figures'> {
  const model = ref.model ? flat.models.get(ref.model) : undefined;
  const query = { instanceName: ref.name, modelName: model?.name, model: model ? { name: model.name, params: model.params, uri: model.uri, span: model.span } : undefined };
  const ratings = ref.type === 'diode' ? resolve({ kind: 'diode', ...query }) : resolve({ kind: 'mosfet', ...query });
  return model ? { ref, model, ratings } : { ref, ratings };
}

/**
 * Line tolerance from the mains directive, then settings, then the solver's defaults; ambient
 * likewise. A universal input's range and frequencies from the mains directive, a load range's
 * light end from the load directive, and the part vertices when any part carries a spread.
 */
function cornersFor(rectifier: Rectifier, circuit: EquivalentCircuit, flat: FlatCircuit, settings: AnalysisSettings): Corner[] {
  const mains = rectifier.surroundings.source.mains;
  const ambient = flat.directives.find((d) => d.directive.keyword === 'ambient')?.directive;
  const fromAmbient = ambient && ambient.keyword === 'ambient' ? ambient : undefined;
  return defaultCorners({
    lineTolLow: mains?.tolLow ?? settings.corners?.lineLow,
    lineTolHigh: mains?.tolHigh ?? settings.corners?.lineHigh,
    ambientNominalC: fromAmbient?.nominalC ?? settings.corners?.ambientNominalC,
    ambientMaxC: fromAmbient?.maxC ?? settings.corners?.ambientMaxC,
    ...(mains?.vrmsRange && mains.vrms ? { lineRange: [mains.vrmsRange[0] / mains.vrms, mains.vrmsRange[1] / mains.vrms] as [number, number] } : {}),
    ...(mains?.freqsHz ? { freqsHz: mains.freqsHz } : {}),
    ...(rectifier.surroundings.load.light ? { lightLoad: rectifier.surroundings.load.light } : {}),
    partSpread: hasPartSpread(circuit),
  });
}
