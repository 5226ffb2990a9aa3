/**
 * The HTML report and the two editor views rendered in headless Chromium (Debian's, driven by
 * playwright-core): a screenshot of each, the SVG series in the DOM, and no request leaving the
 * page. Screenshots go to SHOT_DIR for a human to look at.
 */
import { statSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderHtmlReport } from '../../server/src/report/report-html';
import { renderComparisonView, renderWaveformView, type ViewContent } from '../../server/src/report/view-content';
import { analyseExample } from './fixtures';
import { launchOfflineBrowser, SHOT_DIR, type OfflineBrowser } from './offline-browser';

let browser: OfflineBrowser;
beforeAll(async () => { browser = await launchOfflineBrowser(); });
afterAll(async () => { await browser?.close(); });

/** A view fragment inside the bare page a webview gives it. */
const asPage = (view: ViewContent) => `<!DOCTYPE html><html><head><meta charset="utf-8"><title>${view.title}</title></head><body>${view.body}</body></html>`;

const shot = async (page: import('playwright-core').Page, name: string) => {
  const path = join(SHOT_DIR, name);
  await page.screenshot({ path, fullPage: true });
  expect(statSync(path).size).toBeGreaterThan(10_000);
};

describe('HTML report in Chromium', () => {
  it('the request trap works: a page that asks for something is caught (control)', async () => {
    const { page, requests } = await browser.show('<!DOCTYPE html><p id="x">x</p><img src="http://elsewhere.invalid/a.png">', '#x');
    await page.waitForFunction('document.images.length > 0 && document.images[0].complete');
    expect(requests, JSON.stringify(requests)).toEqual(['http://elsewhere.invalid/a.png']);
    await page.close();
  });

  it('renders the LED driver report offline with every series, table and the caution', async () => {
    const file = analyseExample('led-driver-230v.cir');
    const html = renderHtmlReport([{ file, displayPath: 'examples/led-driver-230v.cir' }], { generator: 'Rectilens test' });
    const { page, requests } = await browser.show(html, 'svg[data-chart="inrush"] [data-series="inrush-current"]');
    const series = await page.$$eval('[data-series]', (nodes) => nodes.map((n) => n.getAttribute('data-series')));
    expect(series).toEqual(expect.arrayContaining([
      'source-voltage', 'output-voltage', 'source-current', 'device-current:D1', 'device-current:D4', 'inrush-current', 'inrush-device-current:D1',
    ]));
    expect(await page.$$eval('[data-variant]', (nodes) => [...new Set(nodes.map((n) => n.getAttribute('data-variant')))]))
      .toEqual(['as-drawn', 'silicon', 'schottky', 'hybrid', 'synchronous']);
    // The worst corner of each figure is shaded: at least one cell per row of the figure table.
    expect(await page.locator('td.rl-worst').count()).toBeGreaterThanOrEqual(10);
    expect(await page.locator('[data-caution="mains"]').first().textContent()).toContain('not a safety or compliance test');
    expect(await page.locator('[data-annotation]').count()).toBe(4);
    // A trace really is drawn: its box has width and height on the page.
    const box = await page.locator('[data-series="output-voltage"]').boundingBox();
    expect(box!.width).toBeGreaterThan(300);
    await shot(page, 'report-led-driver.png');
    expect(requests).toEqual([]);
    await page.close();
  });

  it('renders the report with a deliberate mistake: findings listed, no rectifier on the reversed bridge', async () => {
    const file = analyseExample('mistakes-demo.cir');
    const html = renderHtmlReport([{ file, displayPath: 'examples/mistakes-demo.cir' }], { generator: 'Rectilens test' });
    const { page, requests } = await browser.show(html, '[data-findings]');
    const codes = await page.$$eval('[data-findings] li', (items) => items.map((li) => li.getAttribute('data-code')));
    expect(codes).toEqual(expect.arrayContaining(['reversed-device', 'piv-margin', 'cap-voltage']));
    await shot(page, 'report-mistakes.png');
    expect(requests).toEqual([]);
    await page.close();
  });
});

describe('editor views in Chromium', () => {
  it('waveform view: both charts with their series, legends and axis titles', async () => {
    const view = renderWaveformView(analyseExample('irrigation-valve-24vac.cir'));
    const { page, requests } = await browser.show(asPage(view), 'svg[data-chart="period"]');
    for (const id of ['source-voltage', 'output-voltage', 'device-current:D2', 'inrush-current']) {
      expect(await page.locator(`[data-series="${id}"]`).count(), id).toBe(1);
      if (!id.startsWith('inrush')) expect(await page.locator(`[data-legend="${id}"]`).count(), id).toBe(1);
    }
    const axes = await page.$$eval('.rl-axis-title', (nodes) => nodes.map((n) => n.textContent));
    expect(axes).toEqual(expect.arrayContaining(['Voltage (V)', 'Current (A)', 'Time (ms)', 'Time (ms after switch-on)']));
    await shot(page, 'view-waveforms-irrigation.png');
    expect(requests).toEqual([]);
    await page.close();
  });

  it('comparison view: one bar per applicable construction and the table', async () => {
    const view = renderComparisonView(analyseExample('irrigation-valve-24vac.cir'));
    const { page, requests } = await browser.show(asPage(view), 'svg[data-chart="comparison"]');
    expect(await page.locator('svg [data-variant] rect.rc-bar').count()).toBe(5);
    expect(await page.locator('table tr[data-variant]').count()).toBe(5);
    await shot(page, 'view-comparison-irrigation.png');
    expect(requests).toEqual([]);
    await page.close();
  });
});
