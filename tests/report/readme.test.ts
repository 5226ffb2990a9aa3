/** The README's promises that can drift: the two quick-start commands, its pictures, the rules table. */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { allCodes } from '../../server/src/rules/code-catalog';

const ROOT = join(__dirname, '..', '..');
const README = readFileSync(join(ROOT, 'README.md'), 'utf8');

describe('README', () => {
  it('has exactly two quick-start commands: the report on a demo netlist, then the tests', () => {
    const section = README.slice(README.indexOf('## Quick start'), README.indexOf('## Command line'));
    const block = /```sh\n([\s\S]*?)```/.exec(section)![1]!.trim().split('\n');
    expect(block).toEqual(['npm ci && npm run --silent rectilens -- report examples/led-driver-230v.cir --html report.html', 'npm test']);
    expect(existsSync(join(ROOT, 'examples', 'led-driver-230v.cir'))).toBe(true);
  });

  it('shows pictures that exist in the repository', () => {
    const images = [...README.matchAll(/!\[[^\]]+\]\(([^)]+)\)/g)].map((m) => m[1]!);
    expect(images).toEqual(['docs/report.png', 'docs/report-waveforms.png', 'docs/editor-hover.png']);
    for (const image of images) expect(existsSync(join(ROOT, image)), image).toBe(true);
  });

  it('lists every finding code, and only those', () => {
    const section = README.slice(README.indexOf('## Rules'), README.indexOf('## Safety'));
    const listed = new Set([...section.matchAll(/`([a-z]+(?:-[a-z0-9]+)+|[a-z]+-[a-z]+)`/g)].map((m) => m[1]!));
    listed.delete('internal-error');
    expect([...listed].sort()).toEqual(allCodes().map((c) => c.code).sort());
  });

  it('keeps the usage lines of every command and the caution', () => {
    for (const usage of ['rectilens report <file> [--html out.html]', 'rectilens compare <file> [--format text|json]', 'rectilens lsp --stdio']) {
      expect(README).toContain(usage);
    }
    expect(README).toMatch(/not a safety or compliance test/);
  });
});
