/**
 * The solution a chart draws. An analysis made without waveforms (the language server's, whose
 * solution cache would otherwise hold them for every rectifier) is solved again with them through
 * the adapter's memoised solver: the same circuit and corners, so the same figures, solved once
 * while the cache keeps it.
 */
import type { RectifierAnalysis } from '../equivalent/index';
import type { CornerSolution, RectifierSolution, SolveFn } from '../solve/index';
import { defaultInrushCorner, defaultPeriodCorner } from './waveform-svg';

function drawnSolution(analysis: RectifierAnalysis, solve: SolveFn): RectifierSolution {
  const drawn = analysis.solution.corners.some((c) => c.waveform !== undefined || c.inrushWaveform !== undefined);
  return drawn ? analysis.solution : solve(analysis.circuit, analysis.corners);
}

/** The corners a rectifier's charts show: the period's and the inrush's, from the drawn solution. */
export function drawnCorners(analysis: RectifierAnalysis, solve: SolveFn): { period?: CornerSolution; inrush?: CornerSolution } {
  const { corners } = drawnSolution(analysis, solve);
  return { period: defaultPeriodCorner(corners), inrush: defaultInrushCorner(corners) };
}
