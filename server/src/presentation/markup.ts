/**
 * Small helpers for the HTML, SVG and Markdown we write by hand: escaping, number formatting
 * for coordinates, and the "nice" axis steps of our charts. No I/O.
 */
import { clipText, escapeControlChars, QUOTE_MAX_CHARS } from '../../../grammar/src/index';

/**
 * The punctuation Markdown reads as markup inside a line: emphasis, code spans, links and images
 * (which need `[`), HTML and autolinks, entities, table cells, strikethrough, escapes. A
 * backslash escapes each (CommonMark §2.4). Netlist text never starts a line in our hovers, so
 * line-start markers (`#`, `-`, `1.`) need nothing.
 */
const MARKDOWN_PUNCTUATION = /[\\`*_[\]<>|~&]/g;

/**
 * Netlist text for Markdown prose (hovers), escaped so that a name such as `*[x](y)*` shows as
 * written and makes no link, emphasis or HTML, with control characters written as escapes;
 * clipped to `max` characters (names by default; pass Infinity for whole messages).
 */
export function escapeMarkdown(text: string, max = QUOTE_MAX_CHARS): string {
  return escapeControlChars(clipText(text, max).replace(/[\r\n]+/g, ' ')).replace(MARKDOWN_PUNCTUATION, (ch) => `\\${ch}`);
}

/**
 * Netlist text as a Markdown code span. Backslashes do not escape inside code spans, so the
 * fence is one backtick longer than any run of backticks in the text, padded with a space when
 * the text starts or ends with a backtick (CommonMark §6.1).
 */
export function markdownCode(text: string, max = QUOTE_MAX_CHARS): string {
  const clipped = escapeControlChars(clipText(text, max).replace(/[\r\n]+/g, ' '));
  const longest = Math.max(0, ...[...clipped.matchAll(/`+/g)].map((m) => m[0].length));
  const fence = '`'.repeat(longest + 1);
  const pad = clipped.startsWith('`') || clipped.endsWith('`') ? ' ' : '';
  return `${fence}${pad}${clipped}${pad}${fence}`;
}

const ESCAPES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for an HTML or SVG text node or a double-quoted attribute. */
export function escapeMarkup(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => ESCAPES[ch]!);
}

/** A coordinate with two decimals at most, so the markup stays short and stable. */
export function coord(value: number): string {
  return Number.isFinite(value) ? String(Math.round(value * 100) / 100) : '0';
}

/**
 * Evenly spaced axis ticks covering [lo, hi] with a step of 1, 2 or 5 times a power of ten,
 * aiming at about `target` intervals; the returned range is widened to whole steps.
 */
export function niceTicks(lo: number, hi: number, target = 5): { ticks: number[]; lo: number; hi: number } {
  let min = Math.min(lo, hi);
  let max = Math.max(lo, hi);
  if (!Number.isFinite(min) || !Number.isFinite(max)) { min = 0; max = 1; }
  if (max - min < 1e-12) {
    const pad = Math.abs(max) > 1e-9 ? Math.abs(max) * 0.1 : 1;
    min -= pad; max += pad;
  }
  const raw = (max - min) / target;
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw * 0.999) ?? 10 * power;
  const firstIndex = Math.floor(min / step + 1e-9);
  const lastIndex = Math.ceil(max / step - 1e-9);
  const ticks: number[] = [];
  // Whole multiples of the step, rounded so that 3 × 0.2 prints as 0.6.
  for (let k = firstIndex; k <= lastIndex; k++) ticks.push(k === 0 ? 0 : Number((k * step).toPrecision(12)));
  return { ticks, lo: ticks[0]!, hi: ticks[ticks.length - 1]! };
}

/** A tick label: no more decimals than the step needs. */
export function tickLabel(value: number, ticks: readonly number[]): string {
  const step = ticks.length > 1 ? Math.abs(ticks[1]! - ticks[0]!) : 1;
  const decimals = Math.max(0, Math.min(6, -Math.floor(Math.log10(step) + 1e-9)));
  return value.toFixed(decimals).replace('-', '−');
}

/**
 * A hover written in Markdown as plain text, for an editor that asks for plaintext only: emphasis
 * and code marks dropped, backslash escapes undone; tables keep their pipes, which read as columns.
 */
export function markdownToPlainText(markdown: string): string {
  return markdown.replace(/\*\*|__|`/g, '').replace(/\\([\\`*_[\]<>|~&])/g, '$1');
}
