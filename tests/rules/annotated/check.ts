/**
 * The strict form of an annotated rule fixture: the findings of the given codes in the root file
 * are exactly the caret annotations written under the offending text (tests/helpers/annotations.ts)
 * — same spans to the character, severities and codes, each message holding its annotation's
 * fragment, and nothing more. A fixture without annotations of a code expects none of it.
 */
import { expect } from 'vitest';
import type { Finding } from '../../../server/src/findings/index';
import { isAnnotationLine, readAnnotations, type ExpectedFinding } from '../../helpers/annotations';

export { withoutAnnotations } from '../../helpers/annotations';
import { analyseText, URI } from '../check';

const place = (x: { start: number; end: number; severity: string; code: string }) => `${x.start}-${x.end} ${x.severity} ${x.code}`;

/**
 * Analyses `fixture` and compares its findings of `codes` with its annotations of those codes.
 * Returns the findings, in source order, for any further check on their numbers.
 */
export function expectAnnotated(fixture: string, codes: string | readonly string[], options: Parameters<typeof analyseText>[1] = {}): Finding[] {
  const wanted: readonly string[] = typeof codes === 'string' ? [codes] : codes;
  const file = analyseText(fixture, options);
  const actual = file.findings.filter((f) => f.uri === URI && wanted.includes(f.code) && !isAnnotationLine(fixture, f.span.start));
  const expected = readAnnotations(fixture).filter((e) => wanted.includes(e.code));
  const shown = actual.map((f) => `${place({ ...f.span, severity: f.severity, code: f.code })} '${fixture.slice(f.span.start, f.span.end)}': ${f.message}`).join('\n');
  expect(actual.map((f) => place({ ...f.span, severity: f.severity, code: f.code })).sort(), shown)
    .toEqual(expected.map(place).sort());
  // Pair findings with annotations at the same place by fragment, so two findings on one name
  // (Class A and Class D on a rectifier) each need their own annotation.
  const unmatched = [...actual];
  for (const e of expected) {
    const i = unmatched.findIndex((f) => samePlace(f, e) && f.message.includes(e.fragment));
    expect(i, `no ${e.code} at ${e.start}-${e.end} whose message holds '${e.fragment}'\n${shown}`).toBeGreaterThanOrEqual(0);
    unmatched.splice(i, 1);
  }
  return actual.sort((a, b) => a.span.start - b.span.start);
}

function samePlace(f: Finding, e: ExpectedFinding): boolean {
  return f.span.start === e.start && f.span.end === e.end && f.severity === e.severity && f.code === e.code;
}

