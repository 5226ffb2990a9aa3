/**
 * The design-review record: `rectilens report <file> --parts-table out.csv` writes one row per
 * rectifier part with every column filled (a value, or "not rated", "not applicable", "not
 * computed"), parsed here by csv-parse from the registry (RFC 4180); the figures and verdicts are
 * the rules' own. The HTML report carries the same table and prints on A4 and Letter through
 * Chromium's print engine, each rectifier on a page of its own; the pages are rendered to PNG
 * (pdftoppm from Debian's poppler-utils) in the screenshot folder for a reviewer to look at.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';
import { renderHtmlReport } from '../../server/src/report/report-html';
import { REVIEW_CSV_HEADER } from '../../server/src/report/review-table';
import { analyseExample, EXAMPLES_DIR } from './fixtures';
import { launchOfflineBrowser, SHOT_DIR, type OfflineBrowser } from './offline-browser';

function csvOf(example: string): Record<string, string>[] {
  const written = new Map<string, string>();
  const path = example.includes('/') ? example : join(EXAMPLES_DIR, example);
  const code = runCommandLine(['report', path, '--parts-table', 'out.csv'], {
    stdout: () => {}, stderr: () => {}, stderrIsTty: false, writeFile: (p, t) => void written.set(p, t),
  });
  expect(code).toBe(0);
  return parse(written.get('out.csv')!, { columns: true, skip_empty_lines: true }) as Record<string, string>[];
}

describe('the parts table (CSV)', () => {
  it('has a row per rectifier part of the LED driver, every column filled, figures as the rules judge them', () => {
    const rows = csvOf('led-driver-230v.cir');
    const file = analyseExample('led-driver-230v.cir');
    const parts = file.rectifiers.flatMap((r) => [...r.devices.map((d) => d.ref.name), ...r.rectifier.surroundings.capacitors.flatMap((c) => c.names)]);
    expect(rows.map((r) => r.reference).sort()).toEqual(parts.sort());
    for (const row of rows) {
      expect(Object.keys(row)).toEqual([...REVIEW_CSV_HEADER]);
      for (const [column, value] of Object.entries(row)) expect(value.trim(), `${row.reference} ${column}`).not.toBe('');
    }
    const d1 = rows.find((r) => r.reference === 'D1')!;
    const worstPiv = file.rectifiers[0]!.devices[0]!.figures.worst!.pivV!;
    // The PIV of the record is the solver's worst (≈ 230·1.1·√2 = 358 V less a diode drop, D) at its corner.
    expect(Number(d1['voltage figure'])).toBeCloseTo(worstPiv.value, 0);
    expect(d1['voltage worst corner']).toBe(worstPiv.corner);
    expect(Number(d1['voltage rating'])).toBe(600);
    expect(Number(d1['voltage used %'])).toBeCloseTo((worstPiv.value / 600) * 100, 0);
    expect(d1['voltage verdict']).toBe('pass');
    expect(d1['temperature what']).toBe('junction temperature (Tj)');
    const capacitor = rows.find((r) => r.kind === 'capacitor')!;
    expect(capacitor['surge verdict']).toBe('not applicable');
  });

  it('says "not rated" for a part the file does not rate, never a blank', () => {
    // A 12 V bridge of our own with no rate line at all.
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-review-'));
    writeFileSync(join(dir, 'bare.cir'), 'Unrated bridge (our own)\n*@ mains 12V 50Hz\nV1 a b SIN(0 17 50)\nD1 a p DX\nD2 b p DX\nD3 n a DX\nD4 n b DX\nC1 p n 1000u\nR1 p n 47\n.model DX D(IS=2.5n N=1.75 RS=0.04)\n');
    const rows = csvOf(join(dir, 'bare.cir'));
    expect(rows.map((r) => r.verdict)).toEqual(['not rated', 'not rated', 'not rated', 'not rated', 'not rated']);
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.some((r) => Object.values(r).includes('not rated'))).toBe(true);
    for (const row of rows) for (const value of Object.values(row)) expect(value.trim()).not.toBe('');
  });
});

describe('the HTML report printed', () => {
  let browser: OfflineBrowser;
  beforeAll(async () => { browser = await launchOfflineBrowser(); });
  afterAll(async () => { await browser?.close(); });

  it.each(['A4', 'Letter'] as const)('prints on %s, one rectifier per page, the review record on its own page', async (format) => {
    const file = analyseExample('motor-drive-3ph-400v.cir');
    const html = renderHtmlReport([{ file, displayPath: 'examples/motor-drive-3ph-400v.cir' }], { generator: 'Rectilens test' });
    const { page } = await browser.show(html, '.rl-review');
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-print-'));
    const pdf = join(dir, `report-${format}.pdf`);
    await page.pdf({ path: pdf, format, printBackground: true });
    await page.close();
    expect(readFileSync(pdf).subarray(0, 5).toString()).toBe('%PDF-');
    const prefix = join(SHOT_DIR, `print-${format}`);
    execFileSync('pdftoppm', ['-png', '-r', '50', pdf, prefix]);
    const pages = readdirSync(SHOT_DIR).filter((f) => f.startsWith(`print-${format}-`) && f.endsWith('.png'));
    // Title and netlist, then the rectifier on a page of its own, then the review record.
    expect(pages.length).toBeGreaterThanOrEqual(3);
    // Every page has something on it (a page break never leaves an empty sheet).
    for (const p of pages) expect(statSync(join(SHOT_DIR, p)).size).toBeGreaterThan(1500);
    const text = execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' }).split('\f');
    const reviewPage = text.findIndex((t) => t.includes('Design review record'));
    expect(reviewPage).toBeGreaterThan(0);
    // The record starts its page: nothing of the sections before it shares the page.
    expect(text[reviewPage]!.trimStart().startsWith('Design review record')).toBe(true);
    // …and its table starts under its heading, on that page (a long table breaks between rows, its head repeated).
    expect(text[reviewPage]).toMatch(/\bD1\b/);
  });
});
