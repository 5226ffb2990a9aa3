/**
 * `analyze(input) → Snapshot`: the whole pipeline as one pure function. The caller supplies the
 * text of every file through `readText` (the editor's open documents, or the disk for the command
 * line); nothing here touches the file system, the clock or the settings store.
 */
import { parseNetlist, type Netlist } from '../../../grammar/src/index';
import { elaborate, isRefusal, type FileText, type FlatCircuit, type ReadRefusal } from '../circuit/index';
import { resolvePolicy, type DeratingPolicy, type PartsFile } from '../ratings/index';
import { recognizeRectifiers, type NearMiss } from '../recognize/index';
import { applyRules, type RuleInput } from '../rules/registry';
import { compactAfterRules } from '../rules/rule-context';
import { allowance, boundMessages, compareFindings, withoutRepeats, type Finding } from '../findings/index';
import { includedErrorFindings, withIncludingPlace } from './included-errors';
import { analyseRectifiers, type RectifierAnalysis } from '../equivalent/index';
import { memoisedSolver, type SolutionCache, type SolveFn } from '../solve/index';
import type { AnalysisSettings } from './settings';
import { DEFAULT_LIMITS, parseWithinLimits, solverFindings, unsolvedFinding, type AnalysisLimits } from './limits';

export interface AnalysisInput {
  /** The files to analyse as top-level netlists (URIs or paths, as the adapter names them). */
  roots: readonly string[];
  /**
   * Text of a file; a refusal when the adapter would not read it (untrusted, not a regular file,
   * too large…), which becomes a finding on the card that named it; undefined when it is absent.
   */
  readText: (uri: string) => FileText;
  settings?: AnalysisSettings;
  /** Validated workspace parts files. */
  partsFiles?: readonly PartsFile[];
  /**
   * The parse of a file from this root's previous analysis (same role: root or include), so
   * only its changed lines are parsed again. The result is the same without it.
   */
  previousParse?: (uri: string) => Netlist | undefined;
  /**
   * Whether the trees `previousParse` gives may be consumed: their cards after each edit are moved
   * (offsets updated in place) instead of copied. Only for an adapter that drops the previous
   * analysis once this one is made (the language server's worker), since that analysis no longer
   * describes its own text afterwards. Each tree is consumed at most once.
   */
  consumePreviousParse?: boolean;
  /** Solutions kept between analyses by the adapter (see `SolutionCache`). */
  solutionCache?: SolutionCache;
  /** Overrides of the hard limits (tests lower them); see limits.ts. */
  limits?: Partial<AnalysisLimits>;
  /**
   * For an adapter that keeps analyses (the language server): `FileAnalysis.flat` is cut down
   * after the rules to what views, fixes and hovers read (rules/rule-context.ts `compactAfterRules`).
   */
  compactFlat?: boolean;
  /**
   * Whether the rectifiers' solutions carry sampled waveforms (default true). An adapter that draws
   * them only on request (the language server's views, `check`, which draws nothing) leaves them
   * out: at 100,000 lines they were some 40 MB of the solution cache. Whoever draws then solves the
   * rectifier again with them (report/drawn-solution.ts); the figures are the same either way.
   */
  waveforms?: boolean;
}

export interface FileAnalysis {
  uri: string;
  text: string;
  netlist: Netlist;
  /** Findings of this root's analysis; those about included files carry their own uri. */
  findings: Finding[];
  /** Every other file this analysis read (includes and libraries), for re-analysis on change. */
  dependencies: string[];
  /** Every file this analysis parsed, the root first. */
  parsed: ReadonlyMap<string, Netlist>;
  flat: FlatCircuit;
  /** The file's derating policy (its `*@ derate`, then settings, then the cited defaults), resolved once. */
  policy: DeratingPolicy;
  rectifiers: RectifierAnalysis[];
  nearMisses: NearMiss[];
}

export interface Snapshot {
  files: ReadonlyMap<string, FileAnalysis>;
  /** Roots that could not be read. */
  unreadable: readonly string[];
}

export function analyze(input: AnalysisInput): Snapshot {
  const files = new Map<string, FileAnalysis>();
  const unreadable: string[] = [];
  const parsedAcrossRoots = new Map<string, Netlist | ReadRefusal | undefined>();
  const consumed = new Set<Netlist>();
  for (const uri of input.roots) {
    const file = analyzeRoot(uri, input, parsedAcrossRoots, consumed);
    if (file) files.set(uri, file);
    else unreadable.push(uri);
  }
  return { files, unreadable };
}

function analyzeRoot(uri: string, input: AnalysisInput, cache: Map<string, Netlist | ReadRefusal | undefined>, consumed: Set<Netlist>): FileAnalysis | undefined {
  const limits: AnalysisLimits = { ...DEFAULT_LIMITS, ...input.limits };
  const parsed = new Map<string, Netlist>();
  const load = (target: string): Netlist | ReadRefusal | undefined => {
    // Included files have no title line; only the root does. A file parses differently in the
    // two roles, so the cache shared between roots keys on both.
    const titleLine = target === uri;
    const key = `${titleLine ? 'root' : 'include'}:${target}`;
    if (!cache.has(key)) {
      const text = input.readText(target);
      const parse = typeof text === 'string' ? reparseOnce(input, target, titleLine, consumed) : undefined;
      cache.set(key, typeof text === 'string' ? parseWithinLimits(text, parse!, limits) : text);
    }
    const netlist = cache.get(key);
    if (netlist && !isRefusal(netlist)) parsed.set(target, netlist);
    return netlist;
  };
  const netlist = load(uri);
  if (!netlist || isRefusal(netlist)) return undefined;
  const flat = elaborate(uri, load, { maxDepth: limits.maxHierarchyDepth, maxElements: limits.maxElements, maxIncludedCards: limits.maxIncludedCards });
  const recognition = recognizeRectifiers(flat, flat.directives, limits.maxRecognitionSteps);
  const settings = input.settings ?? {};
  const { policy } = resolvePolicy(flat.directives, settings);
  const solve = withIterationLimit(memoisedSolver(input.solutionCache), limits.solverIterations);
  const toSolve = recognition.rectifiers.slice(0, limits.maxRectifiers);
  const solveRectifiers = input.waveforms === false ? withoutWaveforms(solve) : solve;
  const { analyses, findings: assumptions } = analyseRectifiers(flat, toSolve, settings, input.partsFiles ?? [], solveRectifiers, limits.maxSolverPeriods);
  const limitFindings = [
    ...unsolvedFinding(toSolve.slice(analyses.length), `the solver used its budget of ${limits.maxSolverPeriods} periods (limit: solver work per analysis)`),
    ...unsolvedFinding(recognition.rectifiers.slice(toSolve.length), `more than ${limits.maxRectifiers} rectifiers (limit: rectifiers solved per analysis)`),
    ...solverFindings(analyses),
  ];
  const syntax = [...parsed].flatMap(([fileUri, n]) => n.diagnostics.map((d) => ({ uri: fileUri, ...d })));
  const ruleInput: RuleInput = {
    rootUri: uri, netlist, flat, rectifiers: analyses, nearMisses: recognition.nearMisses, policy, partsFiles: input.partsFiles ?? [], parsed, solve,
  };
  const ruleFindings = applyRules(ruleInput);
  // The one place `*@ allow` applies: to every judgement about the design (recognition, assumed
  // defaults, limits, rules, errors behind an include). What is wrong with the text itself
  // (syntax, elaboration) is not a judgement and no allowance hides it.
  const allowed = allowance(flat.directives, parsed);
  const judged = [...recognition.diagnostics, ...assumptions, ...limitFindings, ...ruleFindings].filter((f) => !allowed(f));
  const own = withoutRepeats([...syntax, ...flat.diagnostics, ...judged]);
  const included = includedErrorFindings(uri, parsed, own).filter((f) => !allowed(f));
  const findings = boundMessages(withIncludingPlace(uri, parsed, [...own, ...included])).sort(compareFindings);
  return {
    uri, text: netlist.text, netlist, findings, dependencies: flat.dependencies.filter((d) => d !== uri), parsed,
    flat: input.compactFlat ? compactAfterRules(ruleInput) : flat, policy,
    rectifiers: analyses, nearMisses: recognition.nearMisses,
  };
}

/** The solver with a lowered Newton iteration cap, when the limits set one (tests do, to reach it). */
function withIterationLimit(solve: SolveFn, maxIterations: number | undefined): SolveFn {
  if (maxIterations === undefined) return solve;
  return (circuit, corners, options) => solve(circuit, corners, { ...options, steadyState: { ...options?.steadyState, maxIterations } });
}

/** The solver asked for no sampled waveforms (the figures come from the record either way). */
function withoutWaveforms(solve: SolveFn): SolveFn {
  return (circuit, corners, options) => solve(circuit, corners, { ...options, waveformPoints: 0 });
}

/**
 * The parse of one file from its previous tree, if there is one. Only the first call gets that
 * tree (parseWithinLimits parses a cut file a second time, from scratch), and a consumed tree is
 * never handed out again: its cards have moved.
 */
function reparseOnce(input: AnalysisInput, target: string, titleLine: boolean, consumed: Set<Netlist>): (text: string) => Netlist {
  let previous = input.previousParse?.(target);
  const consume = input.consumePreviousParse === true;
  if (previous && consume) {
    if (consumed.has(previous)) previous = undefined;
    else consumed.add(previous);
  }
  return (text) => {
    const from = previous;
    previous = undefined;
    return parseNetlist(text, { titleLine, previous: from, consumePrevious: consume && from !== undefined });
  };
}
