#!/usr/bin/env node
// End-to-end checks of the packaged extension in a real VS Code (code-server), driven by
// playwright-core in headless Chromium. Run by run-vscode.sh as: node driver.js <baseUrl> <workspace> <outDir>.
// Every wait is on a DOM condition; a screenshot follows each step.
'use strict';
const path = require('path');
const fs = require('fs');
const { chromium } = require('playwright-core');
const steps = require('./steps');

const [base, folder, outDir = path.join(__dirname, 'out')] = process.argv.slice(2);
if (!base || !folder) {
  console.error('usage: node driver.js <baseUrl> <workspaceFolder> [outDir]');
  process.exit(2);
}
fs.mkdirSync(outDir, { recursive: true });
const T0 = Date.now();
const log = (...a) => console.log(`[e2e +${((Date.now() - T0) / 1000).toFixed(1)}s]`, ...a);
let passes = 0;
let failures = 0;
function check(name, ok, detail) {
  if (ok) passes++;
  else failures++;
  log(ok ? 'PASS' : 'FAIL', name, detail === undefined ? '' : JSON.stringify(detail).slice(0, 300));
}

(async () => {
  const userDataDir = fs.mkdtempSync('/tmp/rl-chromium-');
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1500, height: 950 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const page = context.pages()[0] || (await context.newPage());
  page.on('pageerror', (e) => log('pageerror:', String(e).slice(0, 200)));
  const shot = async (name) => {
    await page.screenshot({ path: path.join(outDir, `${name}.png`) });
    log(`screenshot ${name}.png`);
  };
  const ctx = { page, folder, log, check, shot };
  try {
    await page.goto(`${base}/?folder=${encodeURIComponent(folder)}`, { waitUntil: 'domcontentloaded', timeout: 120000 });
    await page.waitForSelector('.monaco-workbench', { timeout: 180000 });
    for (const step of steps.ALL) {
      try {
        await step(ctx);
      } catch (error) {
        check(`${step.name} ran without error`, false, String(error && error.message).split('\n')[0]);
        await shot(`error-${step.name}`).catch(() => {});
      }
    }
  } catch (error) {
    failures++;
    log('ERROR', error && error.stack);
    await shot('error').catch(() => {});
  } finally {
    await context.close();
    fs.rmSync(userDataDir, { recursive: true, force: true });
  }
  console.log(`${passes} passed, ${failures} failed`);
  process.exit(failures ? 1 : 0);
})();
