/**
 * How numbers and netlist text are shown to a user: the one formatter behind every message,
 * hover, hint and report. It lives at the bottom of the layers so that the grammar's own
 * diagnostics, the rules and the features can all use it. It never prints NaN, Infinity or a
 * double with more digits than a reader can use, and it bounds text quoted from the netlist.
 */

/** Shown instead of a number that is not finite (the tables' sign for "no figure"). */
export const NO_NUMBER = '—';

/** From this magnitude on, numbers are shown as a mantissa and a power of ten (1.23e6). */
const EXPONENT_FROM = 1e6;

/**
 * A number with `digits` significant figures and no exponent noise: 358, 0.142, 1.05, 1200,
 * 4.87e305, 9.11e-301. Magnitudes from 1000 to a million are shown whole (at most six digits).
 */
export function displayNumber(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return NO_NUMBER;
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= EXPONENT_FROM) return exponentForm(value, digits);
  if (magnitude >= 1000) return String(Math.round(value));
  return String(Number(value.toPrecision(digits)));
}

/** A fraction as a whole percentage: 0.8 → "80 %", 4.9e303 → "4.9e305 %". */
export function displayPercent(fraction: number): string {
  const percent = fraction * 100;
  if (!Number.isFinite(percent)) return `${NO_NUMBER} %`;
  const whole = Math.round(percent);
  return `${Math.abs(percent) < EXPONENT_FROM ? String(whole === 0 ? 0 : whole) : exponentForm(percent, 3)} %`;
}

function exponentForm(value: number, digits: number): string {
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e') as [string, string];
  return `${String(Number(mantissa))}e${exponent.replace('+', '')}`;
}

/** Longest netlist text quoted in a message, hover or report line, in characters. */
export const QUOTE_MAX_CHARS = 60;

/**
 * Netlist text cut to `max` characters with an ellipsis in the middle, so that a 10 MB token
 * stays a readable line and both its start and its end (a file name) remain visible.
 */
export function clipText(text: string, max = QUOTE_MAX_CHARS): string {
  if (text.length <= max) return text;
  const head = keepPairs(text, Math.ceil((max - 1) * 0.7));
  const tailLength = Math.max(0, max - 1 - head.length);
  const tail = tailLength > 0 ? text.slice(text.length - tailLength) : '';
  return `${head}…${/^[\uDC00-\uDFFF]/.test(tail) ? tail.slice(1) : tail}`;
}

/** The first `n` characters, one fewer when the cut would split a surrogate pair. */
function keepPairs(text: string, n: number): string {
  return /[\uD800-\uDBFF]/.test(text.charAt(n - 1)) ? text.slice(0, n - 1) : text.slice(0, n);
}

/** A word longer than this in a message is netlist text quoted whole: it is clipped. */
const MESSAGE_WORD_MAX_CHARS = 120;
/** Longest message kept whole. */
export const MESSAGE_MAX_CHARS = 2000;

/**
 * A message with its control characters escaped, every overlong word (netlist text without
 * spaces: a name, a value, a path) clipped, and the whole bounded. The net under every producer of messages, including ones
 * that quote the text they complain about.
 */
export function boundMessage(message: string): string {
  const shown = escapeControlChars(message);
  if (shown.length <= MESSAGE_WORD_MAX_CHARS) return shown;
  // Most messages are already within bounds: a scan is cheaper than the split below, which every edit's findings pay.
  if (shown.length <= MESSAGE_MAX_CHARS && longestAsciiWord(shown) <= MESSAGE_WORD_MAX_CHARS) return shown;
  // Split on spaces rather than match long runs: a quantified run over a 10 MB word overflows the regex engine's stack.
  const words = shown.split(/(\s+)/).map((word) => (word.length > MESSAGE_WORD_MAX_CHARS ? clipText(word) : word)).join('');
  return words.length <= MESSAGE_MAX_CHARS ? words : `${keepPairs(words, MESSAGE_MAX_CHARS - 1)}…`;
}

/**
 * The longest run without an ASCII blank (space, tab, line break, vertical tab, form feed). Every
 * such blank is also `\s`, so no `\s`-separated word is longer: a bound on what the split would see.
 */
function longestAsciiWord(text: string): number {
  let longest = 0;
  let run = 0;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === 32 || (code >= 9 && code <= 13)) run = 0;
    else if (++run > longest) longest = run;
  }
  return longest;
}

/**
 * Characters a terminal acts on rather than shows: C0 controls other than tab and line feed,
 * DEL, C1 controls (0x9B starts an escape sequence on some terminals) and the bidirectional
 * overrides that reorder what is shown.
 */
const TERMINAL_CONTROLS = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/g;

/**
 * Text for a terminal or a message: every control character written as an escape (`\x1B`,
 * `\u202E`), so netlist text cannot drive a terminal and the reader still sees what is there.
 */
export function escapeControlChars(text: string): string {
  return text.replace(TERMINAL_CONTROLS, (ch) => {
    const code = ch.charCodeAt(0);
    return code <= 0xff ? `\\x${code.toString(16).toUpperCase().padStart(2, '0')}` : `\\u${code.toString(16).toUpperCase()}`;
  });
}
