/**
 * Text that is not UTF-8. Netlists are read as UTF-8; a UTF-16 file read that way comes out as
 * its characters with a NUL between each (ASCII text), and its byte-order mark as two U+FFFD.
 * Parsing that gives a syntax error per NUL and nothing true, so the file is named once instead
 * (and so is a binary file, whose NULs fall anywhere).
 * A UTF-8 byte-order mark (U+FEFF at the start) is not an encoding problem and is skipped.
 */

export interface ForeignEncoding {
  /** What the text is, in words: "UTF-16 LE", "UTF-16 BE", or binary data. */
  name: 'UTF-16 LE' | 'UTF-16 BE' | 'binary data (NUL characters)';
  /** Whether the text starts with a byte-order mark. */
  bom: boolean;
}

/** Characters sampled from the start of the text. */
const SAMPLE_CHARS = 4096;
/** ASCII text in UTF-16 has a NUL in every other character; real netlists have none. */
const NUL_SHARE_MIN = 0.2;
/** Share of the NULs on one parity from which the text is taken as UTF-16 (a few non-ASCII characters shift it). */
const ONE_PARITY_SHARE_MIN = 0.8;

/** What text decoded as UTF-8 really is when it is UTF-16 or binary (NUL-rich); undefined for UTF-8 text. */
export function detectForeignEncoding(text: string): ForeignEncoding | undefined {
  // A UTF-16 file decoded as UTF-16 (an editor that recognised it) starts with U+FEFF and has no NULs: it is fine.
  const sample = text.slice(0, SAMPLE_CHARS);
  let even = 0;
  let odd = 0;
  for (let i = 0; i < sample.length; i++) {
    if (sample.charCodeAt(i) !== 0) continue;
    if (i % 2 === 0) even++;
    else odd++;
  }
  const nuls = even + odd;
  if (nuls < Math.max(1, sample.length * NUL_SHARE_MIN)) return undefined;
  const bom = sample.startsWith('\uFFFD\uFFFD');
  // UTF-16 puts its NULs on one parity; NULs spread over both are some other binary file.
  if (Math.max(even, odd) < nuls * ONE_PARITY_SHARE_MIN) return { name: 'binary data (NUL characters)', bom: false };
  // Low byte first (LE): 't' is 74 00, so the NUL follows each character; BE puts it before.
  // The two U+FFFD of a mark keep the parity.
  return { name: odd >= even ? 'UTF-16 LE' : 'UTF-16 BE', bom };
}

/** The text with a leading UTF-8 byte-order mark replaced by a space, so offsets stay those of the text. */
export function withoutByteOrderMark(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? ` ${text.slice(1)}` : text;
}
