/**
 * Loads the registry library `odex` (Hairer & Wanner's ODEX) with the few types the tests use.
 * The package ships TypeScript source instead of declarations, and that source does not compile
 * under this project's strict settings; importing it through a non-literal specifier keeps the
 * type checker out of it while the runtime import is the ordinary one.
 */
export type Derivative = (x: number, y: number[]) => number[];
export type OutputFunction = (nr: number, xOld: number, x: number, y: number[], dense?: (c: number, x: number) => number) => boolean | void;

export interface OdexSolver {
  absoluteTolerance: number | number[];
  relativeTolerance: number | number[];
  maxSteps: number;
  /** Largest step (0: the whole interval). */
  maxStepSize?: number;
  denseOutput: boolean;
  solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): { y: number[]; nEval: number };
  grid(dt: number, out: (x: number, y: number[]) => void): OutputFunction;
}

export async function loadOdex(): Promise<new (n: number) => OdexSolver> {
  const name = 'odex';
  const mod = (await import(name)) as { Solver?: new (n: number) => OdexSolver; default?: { Solver: new (n: number) => OdexSolver } };
  return mod.Solver ?? mod.default!.Solver;
}
