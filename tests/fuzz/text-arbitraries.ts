/**
 * Unstructured inputs: arbitrary bytes decoded as UTF-8 (with replacement characters), arbitrary
 * strings, and streams of the language's own tokens glued in random order, which reach far more
 * parser states than random characters do.
 */
import fc from 'fast-check';

/** Random bytes read as UTF-8, as an editor would show a binary or mis-encoded file. */
export const randomBytesText = fc.uint8Array({ maxLength: 600 }).map((bytes) => new TextDecoder().decode(bytes));

/** Random full-Unicode strings, lone surrogates included. */
export const randomUnicodeText = fc.oneof(fc.string({ unit: 'binary', maxLength: 400 }), fc.string({ unit: 'grapheme', maxLength: 200 }));

/** Pieces of the language: every token kind, keywords, directives, values with suffixes, separators. */
const TOKENS = [
  '\n', '\r\n', '\r', '\n+', '\n +', ' ', '\t', '  ',
  '*', '* comment', '*@', '*@ mains 230V 50Hz', '*@ mains 400V 50Hz phases=3', '*@ rate DM vrrm=600V ifav=1A', '*@ load 10W vmin=5V',
  '*@ ambient 25C..60C', '*@ derate vr=80%', '*@ allow piv-margin', ';', '; tail', '$ tail',
  '.subckt', '.ends', '.lib', '.endl', '.end', '.model', '.param', '.include', '.inc', '.option', '.tran',
  'R1', 'C1', 'L1', 'D1', 'D2', 'M1', 'V1', 'I1', 'X1', 'K1', 'E1', 'Q1', 'RL', 'CB',
  'a', 'b', 'out', 'in', '0', 'gnd', 'ac1', 'ac2', 'DM', 'NM', 'BR', 'D', 'NMOS', 'PMOS', 'SIN', 'PULSE', 'DC', 'AC',
  '1', '0.5', '4k7', '100u', '1meg', '1e400', '-1', '1e-30', '2.2n', '10MEG', '325.3', '50',
  '(', ')', '=', ',', '{', '}', "'", '"', '"parts.cir"', '"../x.cir"', '{rl*2}', '{sqrt(2)*230}', "'1+'", '{', '{((((1))))}',
  'IS=1n', 'N=1.8', 'RS=0.04', 'rdson=20m', 'rl=1k', 'params:', '+', '-', '/', '^', '**', 'µ', 'Ω', '\u0000', '\uFEFF',
];

/** A random sequence of language tokens, sometimes separated by blanks. */
export const tokenStreamText = fc
  .array(fc.tuple(fc.constantFrom(...TOKENS), fc.constantFrom('', ' ', ' ', '\t')), { maxLength: 120 })
  .map((parts) => parts.map(([token, gap]) => token + gap).join(''));

/** Fractions of the text length at which position features are probed. */
export const probeFractions = fc.array(fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true }), { minLength: 1, maxLength: 4 });
