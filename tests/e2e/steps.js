// The steps of the end-to-end run, in order. Each takes { page, folder, log, check, shot }.
'use strict';
const fs = require('fs');
const path = require('path');

const DEMO = 'led-driver-230v.cir';
const MISTAKES = 'mistakes-demo.cir';
/** The card of the reversed diode in the mistakes example, as rendered. */
const REVERSED = 'D3 l1 0 D400';
const EDITOR = '.editor-instance .monaco-editor';

/** Opens a workspace file from the Explorer (Quick Open when the row is not visible). */
async function openFile(page, name) {
  await page.keyboard.press('Escape');
  const row = page.locator('.explorer-folders-view .monaco-list-row', { hasText: name }).first();
  if (await row.waitFor({ timeout: 60000 }).then(() => true, () => false)) await row.click();
  else {
    await page.keyboard.press('Control+P');
    const input = page.locator('.quick-input-widget input');
    await input.waitFor({ timeout: 30000 });
    await input.fill(name);
    await page.waitForSelector(`.quick-input-list .monaco-list-row[aria-label*="${name}"]`, { timeout: 30000 });
    await page.keyboard.press('Enter');
  }
  await page.waitForFunction((n) => {
    const tab = document.querySelector('.tabs-container .tab.active');
    return tab && tab.textContent.includes(n);
  }, name, { timeout: 30000 });
}

function viewText(page) {
  return page.evaluate((sel) => (document.querySelector(`${sel} .view-lines`)?.textContent || '').replace(/\u00a0/g, ' '), EDITOR);
}

/**
 * Centre of the first occurrence of `word` on the rendered line that starts with `lineStart`.
 * Decorations split a word across text nodes, so the range is mapped through cumulative offsets.
 */
function wordPoint(page, lineStart, word) {
  return page.evaluate(([sel, start, w]) => {
    for (const line of document.querySelectorAll(`${sel} .view-line`)) {
      const text = line.textContent.replace(/\u00a0/g, ' ');
      if (!text.startsWith(start)) continue;
      const at = text.indexOf(w);
      const nodes = [];
      const walker = document.createTreeWalker(line, NodeFilter.SHOW_TEXT);
      for (let n = walker.nextNode(), offset = 0; n; offset += n.data.length, n = walker.nextNode()) nodes.push({ n, offset });
      const locate = (pos) => {
        const hit = nodes.filter((x) => x.offset <= pos).pop();
        return [hit.n, pos - hit.offset];
      };
      const r = document.createRange();
      r.setStart(...locate(at));
      r.setEnd(...locate(at + w.length - 1));
      const b = r.getBoundingClientRect();
      return { x: b.x + Math.max(b.width, 4) / 2, y: b.y + b.height / 2 };
    }
    return null;
  }, [EDITOR, lineStart, word]);
}

async function runCommand(page, title) {
  // A webview keeps the keyboard; give it back to the netlist editor first.
  await page.locator(`${EDITOR} .view-lines`).first().click({ position: { x: 5, y: 5 } }).catch(() => {});
  await page.keyboard.press('Escape');
  await page.keyboard.press('F1');
  await page.waitForSelector('.quick-input-widget input', { timeout: 30000 });
  await page.keyboard.type(title);
  await page.waitForSelector(`.quick-input-list .monaco-list-row[aria-label*="${title}"]`, { timeout: 30000 });
  await page.keyboard.press('Enter');
}

/** The text of the first webview frame whose document holds `selector`. */
async function webviewWith(page, selector, timeoutMs = 60000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    for (const frame of page.frames()) {
      const found = await frame.evaluate((s) => {
        const el = document.querySelector(s);
        return el ? document.body.innerHTML : null;
      }, selector).catch(() => null);
      if (found) return found;
    }
    await page.waitForEvent('frameattached', { timeout: 1000 }).catch(() => {});
  }
  return null;
}

async function languageMode({ page, check, shot }) {
  await openFile(page, DEMO);
  await page.waitForFunction(() => /SPICE netlist/.test(document.querySelector('#status\\.editor\\.mode')?.textContent || ''), null, { timeout: 60000 });
  check('language mode is SPICE netlist', true);
  await shot('01-language-mode');
}

async function inlayHints({ page, check, shot }) {
  await page.waitForFunction((sel) => /PIV \d+\/\d+ V/.test(document.querySelector(`${sel} .view-lines`)?.textContent.replace(/\u00a0/g, ' ') || ''), EDITOR, { timeout: 90000 });
  const text = await viewText(page);
  check('inlay hints carry PIV against the rating and the loss on the bridge diodes', /D1 l1 bus DGEN\s*PIV \d+\/600 V · [\d.]+ m?W/.test(text), text.match(/D1 .{0,60}/)?.[0]);
  await shot('02-inlay-hints');
}

async function codeLens({ page, check, shot }) {
  await page.waitForFunction(() => [...document.querySelectorAll('.codelens-decoration')].some((e) => /diode bridge · η/.test(e.textContent)), null, { timeout: 60000 });
  const lens = await page.evaluate(() => [...document.querySelectorAll('.codelens-decoration')].map((e) => e.textContent).join(' | '));
  check('code lens above the rectifier with kind, efficiency, ripple, power factor and the view commands', /diode bridge · η [\d.]+ % · ripple .* PF/.test(lens) && /Waveforms/.test(lens) && /Compare topologies/.test(lens), lens);
  await shot('03-code-lens');
}

async function hover({ page, check, shot }) {
  const pt = await wordPoint(page, 'D1 l1 bus', 'D1');
  let text = '';
  for (let attempt = 0; pt && attempt < 5 && !/VRRM/.test(text); attempt++) {
    await page.mouse.move(pt.x - 2 + attempt, pt.y);
    await page.waitForSelector('.monaco-hover:not(.hidden)', { timeout: 5000 }).catch(() => {});
    await page.waitForFunction(() => /VRRM/.test([...document.querySelectorAll('.monaco-hover')].map((e) => e.textContent).join(' ')), null, { timeout: 5000 }).catch(() => {});
    text = (await page.locator('.monaco-hover').allTextContents()).join(' | ');
  }
  // The hover fades in; the screenshot waits until it is fully opaque.
  await page.waitForFunction(() => [...document.querySelectorAll('.monaco-hover')].some((el) => {
    for (let e = el; e; e = e.parentElement) if (Number(getComputedStyle(e).opacity) < 1) return false;
    return /VRRM/.test(el.textContent);
  }), null, { timeout: 10000 }).catch(() => {});
  check('hover on a bridge diode shows its stress table with the corner and the rating', /PIV/.test(text) && /high-line/.test(text) && /VRRM 600 V/.test(text), text.slice(0, 200));
  await shot('04-hover');
  await page.mouse.move(5, 5);
  await page.keyboard.press('Escape');
}

async function squiggles({ page, check, shot }) {
  await openFile(page, MISTAKES);
  await page.waitForSelector(`${EDITOR} .squiggly-error`, { timeout: 60000 }).catch(() => {});
  await page.waitForSelector(`${EDITOR} .squiggly-warning`, { timeout: 30000 }).catch(() => {});
  const errors = await page.locator(`${EDITOR} .squiggly-error`).count();
  const warnings = await page.locator(`${EDITOR} .squiggly-warning`).count();
  check('error and warning squiggles on the example with mistakes', errors > 0 && warnings > 0, { errors, warnings });
  await shot('05-squiggles');
}

async function quickFix({ page, check, shot, log }) {
  const before = await page.locator(`${EDITOR} .squiggly-error`).count();
  const pt = await wordPoint(page, REVERSED, 'D3');
  await page.mouse.click(pt.x, pt.y);
  await page.keyboard.press('Control+.');
  await page.waitForSelector('.action-widget .monaco-list-row', { timeout: 30000 });
  const items = await page.locator('.action-widget .monaco-list-row').allTextContents();
  log('quick-fix menu:', items.join(' | '));
  await shot('06-quick-fix-menu');
  // The menu has the keyboard: move to the swap entry and accept it.
  const index = items.findIndex((t) => /swap/i.test(t));
  for (let i = 0; i < index - 1; i++) await page.keyboard.press('ArrowDown');
  await page.keyboard.press('Enter');
  await page.waitForFunction((sel) => [...document.querySelectorAll(`${sel} .view-line`)].some((l) => l.textContent.replace(/\u00a0/g, ' ').startsWith('D3 0 l1 D400')), EDITOR, { timeout: 30000 });
  const line = 'D3 0 l1 D400';
  await page.waitForFunction(([sel, n]) => document.querySelectorAll(`${sel} .squiggly-error`).length < n, [EDITOR, before], { timeout: 30000 }).catch(() => {});
  const after = await page.locator(`${EDITOR} .squiggly-error`).count();
  check('quick fix from the editor menu swaps the reversed diode and its error goes', after < before, { before, after, line });
  await shot('07-quick-fix-applied');
}

async function views({ page, check, shot }) {
  await openFile(page, DEMO);
  await runCommand(page, 'Rectilens: Show Rectifier Waveforms');
  const waveforms = await webviewWith(page, 'svg [data-series="output-voltage"]');
  check('waveform view opens with its SVG series', Boolean(waveforms) && /data-series="source-voltage"/.test(waveforms), (waveforms || '').slice(0, 100));
  await shot('08-waveform-view');
  await runCommand(page, 'Rectilens: Compare Bridge Topologies');
  const comparison = await webviewWith(page, 'svg [data-variant]');
  check('comparison view opens with its SVG bars', Boolean(comparison) && /data-variant="synchronous"/.test(comparison), (comparison || '').slice(0, 100));
  await shot('09-comparison-view');
}

async function settingsChange({ page, folder, check, shot }) {
  await openFile(page, DEMO);
  await page.waitForFunction(() => /PIV \d+\/600 V/.test(document.querySelector('.editor-instance .monaco-editor .view-lines')?.textContent.replace(/\u00a0/g, ' ') || ''), null, { timeout: 60000 });
  const warningCount = () => page.evaluate(() => Number((document.querySelector('#status\\.problems')?.textContent || '').trim().split(/\s+/)[1] ?? NaN));
  const before = await warningCount();
  // PIV is about 60 % of the 600 V rating: a 50 % policy makes it a finding.
  fs.mkdirSync(path.join(folder, '.vscode'), { recursive: true });
  fs.writeFileSync(path.join(folder, '.vscode', 'settings.json'), JSON.stringify({ 'rectilens.derating.reverseVoltage': 0.5 }, null, 2));
  await page.waitForFunction((n) => Number((document.querySelector('#status\\.problems')?.textContent || '').trim().split(/\s+/)[1]) > n, before, { timeout: 60000 }).catch(() => {});
  const after = await warningCount();
  check('tightening the reverse-voltage derating in the settings adds PIV warnings', after > before, { before, after });
  await shot('10-settings-change');
}

const TWO_FILES = 'two-file-root.cir';

async function includedFinding({ page, check, shot }) {
  // One editor group again (the views opened a second one), so the netlist editor is the only one.
  await runCommand(page, 'View: Close All Editor Groups');
  await openFile(page, TWO_FILES);
  await page.waitForFunction((sel) => /PIV [\d.]+\/100 V/.test(document.querySelector(`${sel} .view-lines`)?.textContent.replace(/\u00a0/g, ' ') || ''), EDITOR, { timeout: 90000 });
  await page.keyboard.press('Control+Shift+M');
  // The include is not open: its error reaches the Problems panel because the root's analysis publishes it there.
  const found = await page.waitForFunction(() => /two-file-broken\.inc/.test(document.querySelector('.markers-panel')?.textContent || ''), null, { timeout: 60000 }).then(() => true, () => false);
  const panel = await page.evaluate(() => (document.querySelector('.markers-panel')?.textContent || '').slice(0, 300));
  check('a finding in an included file that is not open shows in the Problems panel under that file', found, panel);
  await shot('11-included-file-finding');
  await page.keyboard.press('Control+Shift+M');
}

async function renameAcrossFiles({ page, check, shot }) {
  await openFile(page, TWO_FILES);
  const pt = await wordPoint(page, 'D1 a p', 'DW');
  await page.mouse.click(pt.x, pt.y);
  await page.keyboard.press('F2');
  const input = page.locator('.rename-box input');
  await input.waitFor({ timeout: 30000 });
  await input.fill('DBRIDGE');
  await page.keyboard.press('Enter');
  await page.waitForFunction((sel) => /D1 a p DBRIDGE/.test(document.querySelector(`${sel} .view-lines`)?.textContent.replace(/\u00a0/g, ' ') || ''), EDITOR, { timeout: 30000 }).catch(() => {});
  const root = await viewText(page);
  await openFile(page, 'two-file-models.inc');
  await page.waitForFunction((sel) => /\.model DBRIDGE/.test(document.querySelector(`${sel} .view-lines`)?.textContent.replace(/\u00a0/g, ' ') || ''), EDITOR, { timeout: 30000 }).catch(() => {});
  const lib = await viewText(page);
  check('rename of a model in the root also renames its .model card in the include and its *@ rate line',
    /\.model DBRIDGE/.test(lib) && /rate DBRIDGE/.test(root) && /D4 n b DBRIDGE/.test(root), { root: root.slice(0, 160), lib: lib.slice(0, 120) });
  await shot('12-rename-across-files');
}

module.exports = { wordPoint, ALL: [languageMode, inlayHints, codeLens, hover, squiggles, quickFix, views, settingsChange, includedFinding, renameAcrossFiles] };
