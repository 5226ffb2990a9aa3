/**
 * Headless Chromium (Debian's, driven by playwright-core) that shows one HTML string with the
 * network shut: the page is served from a made-up http origin by request interception, and every
 * other request is refused and recorded, so a test can assert that the page asked for nothing.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
  '--disable-component-update', '--disable-sync',
];

/** Where screenshots go: a folder under the system temp folder, kept after the run for a look. */
export const SHOT_DIR = join(tmpdir(), 'rectilens-report-shots');

/** The page's made-up address; `.invalid` can never resolve (RFC 2606). */
const PAGE_URL = 'http://rectilens.invalid/page.html';

export interface OfflineBrowser {
  /** Opens the HTML and waits for the selector; `requests` lists every URL the page asked for besides itself. */
  show: (html: string, waitFor: string) => Promise<{ page: Page; requests: string[] }>;
  close: () => Promise<void>;
}

export async function launchOfflineBrowser(): Promise<OfflineBrowser> {
  mkdirSync(SHOT_DIR, { recursive: true });
  const profile = mkdtempSync(join(tmpdir(), 'rectilens-chromium-'));
  const context: BrowserContext = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS, viewport: { width: 1100, height: 1400 },
  });
  return {
    show: async (html, waitFor) => {
      const requests: string[] = [];
      const page = await context.newPage();
      await page.route('**/*', (route) => {
        const url = route.request().url();
        if (url === PAGE_URL) return route.fulfill({ status: 200, contentType: 'text/html; charset=utf-8', body: html });
        if (!requests.includes(url)) requests.push(url);
        return route.abort();
      });
      page.on('request', (request) => {
        if (request.url() !== PAGE_URL && !requests.includes(request.url())) requests.push(request.url());
      });
      await page.goto(PAGE_URL, { waitUntil: 'load' });
      await page.waitForSelector(waitFor);
      return { page, requests };
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
