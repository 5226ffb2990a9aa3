// Renders an HTML page from disk in headless Chromium with every network request refused and
// saves a PNG: the README's picture of the report is made with it.
//   node scripts/report-screenshot.mjs report.html docs/report.png [widthPx] [heightPx|full] [css selector]
// With a selector, only the first element it matches is captured.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';

const [input, output, width = '1100', height = '1500', selector] = process.argv.slice(2);
if (!input || !output) {
  console.error('usage: node scripts/report-screenshot.mjs <page.html> <out.png> [widthPx] [heightPx|full]');
  process.exit(2);
}
const pageUrl = pathToFileURL(resolve(input)).href;
const profile = mkdtempSync(join(tmpdir(), 'rectilens-shot-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  headless: true,
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
    '--disable-component-update', '--disable-sync'],
  viewport: { width: Number(width), height: height === 'full' ? 900 : Number(height) },
});
try {
  const blocked = [];
  await context.route('**/*', (route) => {
    if (route.request().url() === pageUrl) return route.continue();
    blocked.push(route.request().url());
    return route.abort();
  });
  const page = await context.newPage();
  await page.goto(pageUrl);
  await page.waitForSelector('svg [data-series]');
  if (selector) await page.locator(selector).first().screenshot({ path: output });
  else await page.screenshot({ path: output, fullPage: height === 'full' });
  if (blocked.length) console.error(`blocked ${blocked.length} request(s): ${blocked.join(', ')}`);
} finally {
  await context.close();
  rmSync(profile, { recursive: true, force: true });
}
