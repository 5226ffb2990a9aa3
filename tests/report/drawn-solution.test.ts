/**
 * An analysis made without waveforms (the language server's and `check`'s) says the same as one
 * made with them, and its charts, solved again when drawn, are the same charts. The reference is
 * the analysis with waveforms, as `report` makes it.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import type { RectifierSolution } from '../../server/src/solve/index';
import { memoisedSolver, type SolutionCache } from '../../server/src/solve/index';
import { renderHtmlReport } from '../../server/src/report/report-html';
import { renderWaveformView } from '../../server/src/report/view-content';
import { EXAMPLES_DIR } from './fixtures';

function analysed(name: string, waveforms: boolean): FileAnalysis {
  const path = join(EXAMPLES_DIR, name);
  return analyze({ roots: [path], readText: (p) => readFileSync(p, 'utf8'), waveforms }).files.get(path)!;
}

/** The figures of a solution, its waveforms taken out. */
function figures(solution: RectifierSolution) {
  return { ...solution, corners: solution.corners.map(({ waveform: _w, inrushWaveform: _i, ...rest }) => rest) };
}

describe('an analysis without waveforms', () => {
  for (const name of ['led-driver-230v.cir', 'universal-adapter-90-264v.cir', 'motor-drive-3ph-400v.cir']) {
    it(`${name}: the same findings and figures, and the same charts once drawn`, () => {
      const withWaves = analysed(name, true);
      const without = analysed(name, false);
      expect(without.rectifiers.length).toBeGreaterThan(0);
      expect(without.findings.map((f) => [f.code, f.span, f.message])).toEqual(withWaves.findings.map((f) => [f.code, f.span, f.message]));
      for (const [k, analysis] of without.rectifiers.entries()) {
        expect(analysis.solution.corners.some((c) => c.waveform || c.inrushWaveform)).toBe(false);
        expect(figures(analysis.solution)).toEqual(figures(withWaves.rectifiers[k]!.solution));
        expect(withWaves.rectifiers[k]!.solution.corners.some((c) => c.waveform)).toBe(true);
      }
      const cache: SolutionCache = new Map();
      const solve = memoisedSolver(cache);
      expect(renderWaveformView(without, undefined, solve).body).toBe(renderWaveformView(withWaves).body);
      // Drawn once per rectifier: a second view takes the solutions from the cache.
      const solved = cache.size;
      renderWaveformView(without, undefined, solve);
      expect(cache.size).toBe(solved);
      const report = (file: FileAnalysis) => renderHtmlReport([{ file, displayPath: name }], { generator: 'test', solve: memoisedSolver(new Map()) });
      expect(report(without)).toBe(report(withWaves));
    });
  }
});
