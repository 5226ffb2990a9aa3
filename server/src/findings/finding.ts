/**
 * The findings contract: what the core says about a file, in offsets (adapters convert to lines and
 * columns). The ground floor of the server: every room may import it, and it imports only the
 * netlist language.
 */
import { boundMessage, type Severity, type Span } from '../../../grammar/src/index';

/** A place in a file: the URI (or path) as the adapter names it, and character offsets. */
export interface Place {
  uri: string;
  span: Span;
}

export interface TextEdit {
  uri: string;
  span: Span;
  newText: string;
}

/** A quick fix: a title and the text edits that carry it out. */
export interface Fix {
  title: string;
  edits: TextEdit[];
  /** The fix a user most likely wants for this finding. */
  preferred?: boolean;
}

export interface RelatedPlace extends Place {
  message: string;
}

export interface Finding {
  uri: string;
  span: Span;
  severity: Severity;
  /** Stable lowercase code, e.g. `piv-margin`. */
  code: string;
  message: string;
  related?: RelatedPlace[];
  fixes?: Fix[];
}

const SEVERITY_RANK: Readonly<Record<Severity, number>> = { error: 0, warning: 1, info: 2, hint: 3 };

/** Whether a finding is at least as severe as a threshold. */
export function reaches(severity: Severity, threshold: Severity): boolean {
  return SEVERITY_RANK[severity] <= SEVERITY_RANK[threshold];
}

export function compareFindings(a: Finding, b: Finding): number {
  return a.uri.localeCompare(b.uri) || a.span.start - b.span.start || SEVERITY_RANK[a.severity] - SEVERITY_RANK[b.severity];
}

/**
 * Findings with their messages bounded (grammar/src/display.ts): netlist text quoted whole is
 * clipped, whoever produced the message. In place, so that lazily computed fixes stay lazy.
 */
export function boundMessages(findings: Finding[]): Finding[] {
  for (const finding of findings) {
    finding.message = boundMessage(finding.message);
    for (const place of finding.related ?? []) place.message = boundMessage(place.message);
  }
  return findings;
}

/** Indexes of a file's own findings that overlap `[start, end]` (an editor's selection). */
export function findingsInRange(findings: readonly Finding[], uri: string, start: number, end: number): number[] {
  return findings.flatMap((f, index) => (f.uri === uri && f.span.end >= start && f.span.start <= end ? [index] : []));
}
