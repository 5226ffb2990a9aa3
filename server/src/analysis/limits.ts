/**
 * Hard limits of one analysis. A language server runs on every keystroke over whatever text is in
 * the editor, so every stage has a bound; passing one gives a `limit-exceeded` finding that names
 * the limit, and the analysis goes on with what fits (a partial result, never a failure).
 *
 * Limits enforced elsewhere, listed here so that one file names them all:
 * - expression nesting: `MAX_EXPRESSION_DEPTH` (200) in grammar/src/expression.ts, an expression error;
 * - include nesting: `MAX_INCLUDE_DEPTH` (64) in circuit/includes.ts, code `include-depth`;
 * - subcircuit nesting and flattened size: `maxHierarchyDepth` and `maxElements` below, passed to
 *   `elaborate`, codes `subckt-depth` and `circuit-too-large`;
 * - solver work: the shooting method's Newton iterations (30 by default, solve/shooting.ts) and its
 *   step budgets; a steady state not reached within them gives `limit-exceeded` (solverFindings).
 */
import type { Netlist, SyntaxDiagnostic } from '../../../grammar/src/index';
import { NON_FINITE_NOTE } from '../solve/index';
import type { Finding } from './findings';
import type { RectifierAnalysis } from './rectifier-analysis';

export interface AnalysisLimits {
  /** Longest file read, in characters (UTF-16 units, i.e. bytes for ASCII netlists); the rest is cut. */
  maxFileChars: number;
  /** Most cards read from one file; the rest is cut. */
  maxCards: number;
  /** Deepest subcircuit nesting expanded. */
  maxHierarchyDepth: number;
  /** Most elements and instances in the flattened circuit. */
  maxElements: number;
  /** Most rectifiers solved in one analysis; the others are recognised but not solved. */
  maxRectifiers: number;
  /** Time for one analysis, checked between rectifiers when the adapter passes a clock. */
  timeBudgetMs: number;
  /** Newton iterations per steady state; undefined keeps the solver's own default. */
  solverIterations?: number;
}

/**
 * The defaults. Sized an order of magnitude above the largest netlists of DESIGN.md §10 (100,000
 * lines, 50 rectifiers), so they stop runaway input, not real designs.
 */
export const DEFAULT_LIMITS: Readonly<AnalysisLimits> = {
  maxFileChars: 32 * 1024 * 1024,
  maxCards: 1_000_000,
  maxHierarchyDepth: 64,
  maxElements: 200_000,
  maxRectifiers: 500,
  timeBudgetMs: 20_000,
};

export const LIMIT_CODE = 'limit-exceeded';

/**
 * Parses a file within the size and card limits: beyond either, the text is cut at a line start
 * and re-parsed, and the netlist carries a `limit-exceeded` diagnostic at the cut. The netlist's
 * own text is then the prefix that was read.
 */
export function parseWithinLimits(text: string, parse: (text: string) => Netlist, limits: AnalysisLimits): Netlist {
  if (text.length > limits.maxFileChars) {
    const cut = lineStartAtOrBefore(text, limits.maxFileChars);
    return withCut(parse(text.slice(0, cut)), text, cut, `the file is longer than ${limits.maxFileChars} characters (limit: file size); the text from here on is not analysed`);
  }
  const netlist = parse(text);
  const first = netlist.cards[limits.maxCards];
  if (!first) return netlist;
  const cut = lineStartAtOrBefore(text, first.span.start);
  return withCut(parse(text.slice(0, cut)), text, cut, `the file has more than ${limits.maxCards} cards (limit: cards per file); the cards from here on are not analysed`);
}

function withCut(netlist: Netlist, text: string, cut: number, message: string): Netlist {
  // The finding sits on the last line read, so it lies inside the analysed text and is visible.
  const start = lineStartAtOrBefore(text, Math.max(0, cut - 1));
  const diagnostic: SyntaxDiagnostic = { span: { start, end: Math.max(start, cut - 1) }, severity: 'error', code: LIMIT_CODE, message };
  return { ...netlist, diagnostics: [...netlist.diagnostics, diagnostic] };
}

function lineStartAtOrBefore(text: string, offset: number): number {
  const lf = text.lastIndexOf('\n', offset - 1);
  return lf < 0 ? 0 : lf + 1;
}

/** The finding for rectifiers left unsolved, on the first of them. */
export function unsolvedFinding(skipped: readonly { anchor: { uri: string; span: { start: number; end: number } } }[], why: string): Finding[] {
  const first = skipped[0];
  if (!first) return [];
  return [{
    uri: first.anchor.uri, span: first.anchor.span, severity: 'warning', code: LIMIT_CODE,
    message: `${why}; ${skipped.length} rectifier${skipped.length === 1 ? ' was' : 's were'} recognised but not solved, from this one on`,
  }];
}

/**
 * Findings about the solver's own bounds: a steady state not reached within its iterations or
 * step budget, and figures dropped because they were not finite. One finding of each per rectifier.
 */
export function solverFindings(analyses: readonly RectifierAnalysis[]): Finding[] {
  return analyses.flatMap(({ rectifier, solution }) => {
    const place = { uri: rectifier.anchor.uri, span: rectifier.anchor.span };
    const out: Finding[] = [];
    // A corner with output figures but no convergence ran out of iterations or steps (a corner
    // whose network could not be built has no figures and says why in its notes).
    const unsettled = solution.corners.filter((c) => !c.converged && c.vOutAvgV !== undefined);
    if (unsettled.length) {
      out.push({
        ...place, severity: 'warning', code: LIMIT_CODE,
        message: `the steady state was not reached within the solver's iteration and step limits at ${unsettled.map((c) => c.name).join(', ')}; figures there are from the last period computed`,
      });
    }
    const omitted = solution.notes.filter((n) => n.startsWith(NON_FINITE_NOTE));
    if (omitted.length) {
      out.push({ ...place, severity: 'warning', code: 'figure-omitted', message: `${omitted.join('; ')} (an input is out of range)` });
    }
    return out;
  });
}
