/**
 * Test helpers for the rules: analyse an inline fixture, compare its findings of some codes with
 * the caret annotations written in it, and apply a quick fix to the text.
 *
 * `checkAnnotated` is the lenient form: an annotation matches a finding whose span contains its
 * first column (`*^` starts in column 0, so it points at `D1`). The strict form, the findings'
 * spans exactly the carets, is tests/rules/annotated/check.ts `expectAnnotated`.
 */
import { expect } from 'vitest';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import type { Finding, Fix } from '../../server/src/findings/index';
import type { AnalysisSettings } from '../../server/src/analysis/settings';
import type { PartsFile } from '../../server/src/ratings/index';
import { applyEdits } from '../../server/src/rules/fixes/text-edits';
import { isAnnotationLine, readAnnotations } from '../helpers/annotations';

export const URI = 'file:///t.cir';

/** Analyses `text` as the root file `URI` (plus any extra files). */
export function analyseText(text: string, options: { settings?: AnalysisSettings; partsFiles?: PartsFile[]; extra?: Record<string, string> } = {}): FileAnalysis {
  const texts: Record<string, string> = { [URI]: text, ...options.extra };
  const snapshot = analyze({ roots: [URI], readText: (u) => texts[u], settings: options.settings, partsFiles: options.partsFiles });
  return snapshot.files.get(URI)!;
}

/** The findings of one code. */
export function findingsOf(file: FileAnalysis, code: string): Finding[] {
  return file.findings.filter((f) => f.code === code);
}

/**
 * Compares the findings of `codes` with the fixture's annotations of those codes: same count,
 * and each annotation matched by a finding on its line whose span holds the caret, with the same
 * severity and a message containing the annotation's fragment. Returns the analysis.
 */
export function checkAnnotated(fixture: string, codes: readonly string[], options: Parameters<typeof analyseText>[1] = {}): FileAnalysis {
  const file = analyseText(fixture, options);
  const actual = file.findings.filter((f) => codes.includes(f.code) && !isAnnotationLine(fixture, f.span.start));
  const expected = readAnnotations(fixture).filter((e) => codes.includes(e.code));
  const show = actual.map((f) => `${f.severity} ${f.code} @${f.span.start}: ${f.message}`).join('\n');
  expect(actual.length, show).toBe(expected.length);
  for (const e of expected) {
    const hit = actual.find((f) => f.span.start <= e.start && e.start < Math.max(f.span.end, f.span.start + 1) && f.code === e.code);
    expect(hit, `no ${e.code} at ${e.start}\n${show}`).toBeDefined();
    expect(hit!.severity).toBe(e.severity);
    expect(hit!.message).toContain(e.fragment);
  }
  return file;
}

/** The text after applying a fix's edits (all in the root file). */
export function applyFix(text: string, fix: Fix): string {
  expect(fix.edits.every((e) => e.uri === URI)).toBe(true);
  return applyEdits(text, fix.edits);
}

/** Errors of a file, as short strings, for "no new error" checks. */
export function errorsOf(file: FileAnalysis): string[] {
  return file.findings.filter((f) => f.severity === 'error').map((f) => `${f.code}: ${f.message}`);
}

/** A fix whose title starts with `prefix` among a finding's fixes. */
export function fixTitled(finding: Finding | undefined, prefix: string): Fix {
  const fix = finding?.fixes?.find((f) => f.title.startsWith(prefix));
  expect(fix, `fixes: ${finding?.fixes?.map((f) => f.title).join(' | ')}`).toBeDefined();
  return fix!;
}
