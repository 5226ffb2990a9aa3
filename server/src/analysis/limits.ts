/**
 * Hard limits of one analysis. A language server runs on every keystroke over whatever text is in
 * the editor, so every stage has a bound; passing one gives a `limit-exceeded` finding that names
 * the limit, and the analysis goes on with what fits (a partial result, never a failure). Every
 * bound counts work (characters, cards, steps, periods), never time, so a file gives the same
 * findings on any machine.
 *
 * Limits enforced elsewhere, listed here so that one file names them all:
 * - expression nesting: `MAX_EXPRESSION_DEPTH` (200) in grammar/src/expression.ts, of the parse and of
 *   the tree (a chain 1+1+… is one level per operator), a `syntax-error` on the expression;
 * - parenthesis nesting in a card: `MAX_GROUP_DEPTH` (32) in grammar/src/card-parser.ts, a
 *   `syntax-error` on the first '(' past it;
 * - definition nesting: `MAX_BLOCK_DEPTH` (64) in grammar/src/structure.ts, code `subckt-depth` on the
 *   block past it, which is not read;
 * - include nesting: `MAX_INCLUDE_DEPTH` (64) in circuit/includes.ts, code `include-depth`;
 * - file size on disk: the adapters' safe reader (io/read-file-safely.ts) refuses a file of more
 *   than `maxFileChars` bytes by its size, before reading it; `limit-exceeded` on the card;
 * - subcircuit nesting and flattened size: `maxHierarchyDepth` and `maxElements` below, passed to
 *   `elaborate`, codes `subckt-depth` and `circuit-too-large`; an instance's size is counted on the
 *   definitions before it is built (circuit/expansion-size.ts), so a "billion laughs" is refused at
 *   its top instance; that count has a budget of its own (2 × `maxElements` cards looked at), past
 *   which the running count during expansion is the bound;
 * - cards read through includes: `maxIncludedCards` below, `limit-exceeded` on the include card;
 * - recognition: `maxRecognitionSteps` below (devices and terminals looked at by the matchers),
 *   `limit-exceeded` on the first device left unchecked;
 * - solver work: the shooting method's Newton iterations (30 by default, solve/shooting.ts) and its
 *   step budgets; a steady state not reached within them gives `limit-exceeded` (solverFindings).
 */
import type { Netlist, SyntaxDiagnostic } from '../../../grammar/src/index';
import { DEFAULT_MAX_INCLUDED_CARDS } from '../circuit/index';
import { DEFAULT_RECOGNITION_STEPS } from '../recognize/index';
import { NON_FINITE_NOTE } from '../solve/index';
import type { Finding } from '../findings/index';
import type { RectifierAnalysis } from '../equivalent/index';
import { unsolvedRectifierFindings } from './unsolved-rectifier';
import { unmodelledInductanceFindings } from './unmodelled-inductance';

export interface AnalysisLimits {
  /**
   * Longest file read, in characters (UTF-16 units, i.e. bytes for ASCII netlists); the rest is cut
   * before parsing. A parse keeps some 30 bytes of memory per character and takes about 0.2 µs per
   * character (measured on a 2-core test machine), so this also bounds what one file can cost.
   */
  maxFileChars: number;
  /** Most cards read from one file; the rest is cut. */
  maxCards: number;
  /** Deepest subcircuit nesting expanded. */
  maxHierarchyDepth: number;
  /** Most elements and instances in the flattened circuit. */
  maxElements: number;
  /** Most cards spliced in from included files, over the whole analysis of a root. */
  maxIncludedCards: number;
  /** Most steps of rectifier recognition (devices and terminals the matchers look at). */
  maxRecognitionSteps: number;
  /** Most rectifiers solved in one analysis; the others are recognised but not solved. */
  maxRectifiers: number;
  /**
   * Solver work for one analysis, in periods integrated (each corner's shooting iterations plus its
   * recorded period), checked between rectifiers: once spent, the rest are recognised, not solved.
   */
  maxSolverPeriods: number;
  /** Newton iterations per steady state; undefined keeps the solver's own default. */
  solverIterations?: number;
}

/**
 * The defaults. Sized above the largest netlists of DESIGN.md §10 (100,000 lines, 50 rectifiers),
 * so they stop runaway input, not real designs: 8 MiB is 100,000 lines of 80 characters (a 32 MiB
 * file cost 2.3 GB and 13 s to parse and analyse on a 2-core test machine; 8 MiB costs about a
 * quarter). A rectifier takes 12 to 40 solver periods (6 corners); 10,000 periods took about 20 s
 * on that machine, the wall time the period budget replaces.
 */
export const DEFAULT_LIMITS: Readonly<AnalysisLimits> = {
  maxFileChars: 8 * 1024 * 1024,
  maxCards: 1_000_000,
  maxHierarchyDepth: 64,
  maxElements: 200_000,
  maxIncludedCards: DEFAULT_MAX_INCLUDED_CARDS,
  maxRecognitionSteps: DEFAULT_RECOGNITION_STEPS,
  maxRectifiers: 500,
  maxSolverPeriods: 10_000,
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
 * step budget, and figures dropped because they were not finite. One finding of each per rectifier,
 * and `unsolved-rectifier` for corners not solved at all (unsolved-rectifier.ts).
 */
export function solverFindings(analyses: readonly RectifierAnalysis[]): Finding[] {
  return analyses.flatMap((analysis) => [...solverBoundFindings(analysis), ...unsolvedRectifierFindings(analysis), ...unmodelledInductanceFindings(analysis)]);
}

function solverBoundFindings({ rectifier, solution }: RectifierAnalysis): Finding[] {
  const place = { uri: rectifier.anchor.uri, span: rectifier.anchor.span };
  const out: Finding[] = [];
  // A corner with output figures but no convergence ran out of iterations or steps (a corner
  // whose network could not be built has no figures: unsolved-rectifier.ts reports it).
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
}
