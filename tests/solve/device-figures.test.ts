/**
 * Each analysed device carries its own figures (solve/device-figures.ts, computed once in
 * equivalent/rectifier-analysis.ts): its worst case, its figures at every corner, its surge and
 * the RθJA it was solved with — the same numbers as the solution, under the device's own name.
 */
import { describe, expect, it } from 'vitest';
import { analyseExample, examplePaths } from '../report/fixtures';
import { basename } from 'node:path';

describe('device figures', () => {
  for (const name of examplePaths().map((p) => basename(p))) {
    it(`${name}: every device's figures are its own`, () => {
      for (const analysis of analyseExample(name).rectifiers) {
        analysis.devices.forEach((device, k) => {
          const { worst, corners, rthjaKPerW } = device.figures;
          expect(worst?.name).toBe(device.ref.name);
          expect(worst).toBe(analysis.solution.devices[k]);
          expect(corners.map((c) => c.corner)).toEqual(analysis.solution.corners.map((c) => c.name));
          for (const c of corners) expect(c.figures?.name).toBe(device.ref.name);
          expect(rthjaKPerW).toBe(analysis.circuit.devices[k]?.rthjaKPerW);
        });
      }
    });
  }

  it('gives each device the surge it carries or blocks, at most the rectifier\'s inrush peak', () => {
    // A bridge conducts in pairs: at switch-on two devices carry the inrush, the other two block
    // with a far smaller I²t, so their surge figure is the half-sine peak of that I²t (common practice).
    const analysis = analyseExample('led-driver-230v.cir').rectifiers[0]!;
    const surges = analysis.devices.map((d) => d.figures.surge!);
    const peak = Math.max(...analysis.solution.corners.map((c) => c.inrushPeakA ?? 0));
    for (const s of surges) {
      expect(s.durationS).toBeCloseTo(0.01, 12); // 1/(2·50 Hz) (D)
      expect(s.figureA).toBeCloseTo(Math.max(s.peakA, Math.sqrt((2 * s.i2tA2s) / s.durationS)), 12);
      expect(s.peakA).toBeLessThanOrEqual(peak);
    }
    expect(surges.filter((s) => s.peakA === peak).length).toBeGreaterThanOrEqual(2);
  });
});
