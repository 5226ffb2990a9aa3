/**
 * The comparison view's load-sweep charts in headless Chromium (the browser the other view tests
 * use): every chart drawn with every construction's trace at a readable size, nothing requested
 * from outside, and a screenshot in SHOT_DIR for a human to look at.
 */
import { statSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderComparisonView } from '../../server/src/report/view-content';
import { memoisedSolver } from '../../server/src/solve/index';
import { BENCH_12V, analyseText } from '../compare/bench-12v';
import { launchOfflineBrowser, SHOT_DIR, type OfflineBrowser } from './offline-browser';

let browser: OfflineBrowser;
beforeAll(async () => { browser = await launchOfflineBrowser(); });
afterAll(async () => { await browser?.close(); });

describe('the load sweep in Chromium', () => {
  it('draws five charts, each with five traces spanning the plot, offline', async () => {
    const view = renderComparisonView(analyseText(BENCH_12V), undefined, memoisedSolver(new Map()));
    const html = `<!DOCTYPE html><html><head><meta charset="utf-8"><title>${view.title}</title></head><body>${view.body}</body></html>`;
    const { page, requests } = await browser.show(html, 'svg[data-chart="sweep-ripple"]');
    await page.setViewportSize({ width: 1300, height: 900 });
    for (const chart of ['sweep-efficiency', 'sweep-loss', 'sweep-tj', 'sweep-vout', 'sweep-ripple']) {
      const traces = page.locator(`svg[data-chart="${chart}"] path.sw-trace`);
      expect(await traces.count(), chart).toBe(5);
      // Each trace runs across most of the 524 px plot (600 − 60 − 16): the whole load range is drawn.
      for (let k = 0; k < 5; k++) expect((await traces.nth(k).boundingBox())!.width, `${chart} ${k}`).toBeGreaterThan(400);
      // Legible: the tick labels are drawn at 11 px, as in the other charts.
      // (The callback runs in the page, where the window's getComputedStyle exists; tests type-check without the DOM library.)
      const size = await page.locator(`svg[data-chart="${chart}"] .sw-tick`).first()
        .evaluate((n) => (globalThis as unknown as { getComputedStyle: (e: unknown) => { fontSize: string } }).getComputedStyle(n).fontSize);
      expect(size).toBe('11px');
    }
    const path = join(SHOT_DIR, 'view-comparison-sweep-12v.png');
    await page.screenshot({ path, fullPage: true });
    expect(statSync(path).size).toBeGreaterThan(10_000);
    expect(requests).toEqual([]);
    await page.close();
  });
});
