/**
 * Numbers as SPICE writes them: a mantissa, an optional scale suffix, and letters after it that
 * carry no meaning (`10uF`, `4.7kohm`, `50Hz`). Scale factors follow the table of the Berkeley
 * SPICE3 user's manual ("General structure and conventions"): M is milli, MEG is mega, MIL is
 * 25.4e-6, F is femto.
 */

export interface ReadNumber {
  value: number;
  /** Letters after the scale suffix (the unit as written, e.g. `F`, `ohm`, `Hz`), lowercased. */
  unit: string;
  /** Set when the reading is a guess the user should confirm. */
  warning?: string;
}

/** Powers of ten of the scale letters. */
const SCALE_EXPONENT: Readonly<Record<string, number>> = {
  t: 12,
  g: 9,
  k: 3,
  m: -3,
  u: -6,
  'µ': -6,
  'μ': -6,
  n: -9,
  p: -12,
  f: -15,
};

/** Letters of the RKM code (IEC 60062) that stand in for the decimal point. */
const RKM_SCALE: Readonly<Record<string, number>> = {
  r: 1,
  k: 1e3,
  m: 1e6,
  g: 1e9,
  t: 1e12,
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
};

const NUMBER_PATTERN = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)([^\d.+-]*)$/;
const RKM_PATTERN = /^(\d+)([rkmgtpnu])(\d+)([a-zΩ]*)$/i;

/** Reads one SPICE number; `undefined` when the text is not a number at all. */
export function readNumber(text: string): ReadNumber | undefined {
  const match = NUMBER_PATTERN.exec(text);
  if (match) return readScaled(match[1]!, match[2]!);
  return readRkm(text);
}

function readScaled(mantissa: string, tail: string): ReadNumber {
  const lower = tail.toLowerCase();
  if (lower.startsWith('meg')) return { value: scaleDecimal(mantissa, 6), unit: lower.slice(3) };
  if (lower.startsWith('mil')) return { value: Number(mantissa) * 25.4e-6, unit: lower.slice(3) };
  const first = lower.charAt(0);
  const exponent = SCALE_EXPONENT[first];
  if (exponent === undefined) return { value: Number(mantissa), unit: lower };
  const result: ReadNumber = { value: scaleDecimal(mantissa, exponent), unit: lower.slice(1) };
  if (first === 'µ' || first === 'μ') {
    result.warning = `'${tail.charAt(0)}' read as micro; SPICE readers expect 'u'`;
  }
  return result;
}

/** mantissa × 10^exponent, shifted in decimal so that 100u is exactly the double nearest 1e-4. */
function scaleDecimal(mantissa: string, exponent: number): number {
  const at = mantissa.search(/e/i);
  const base = at < 0 ? mantissa : mantissa.slice(0, at);
  const own = at < 0 ? 0 : Number(mantissa.slice(at + 1));
  return Number(`${base}e${own + exponent}`);
}

function readRkm(text: string): ReadNumber | undefined {
  const match = RKM_PATTERN.exec(text);
  if (!match) return undefined;
  const letter = match[2]!.toLowerCase();
  const value = Number(`${match[1]}.${match[3]}`) * RKM_SCALE[letter]!;
  return {
    value,
    unit: match[4]!.toLowerCase(),
    warning:
      `'${text}' is RKM notation (IEC 60062); read as ${formatPlain(value)}. ` +
      `SPICE readers take it differently (often as ${match[1]}${letter}), so write ${spiceSpelling(value)} instead`,
  };
}

function formatPlain(value: number): string {
  return Number(value.toPrecision(6)).toString();
}

/** The unambiguous SPICE spelling of a value, for messages and quick fixes. */
export function spiceSpelling(value: number): string {
  const steps: [number, string][] = [
    [1e12, 'T'], [1e9, 'G'], [1e6, 'MEG'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'u'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f'],
  ];
  const magnitude = Math.abs(value);
  if (magnitude === 0) return '0';
  for (const [factor, suffix] of steps) {
    if (magnitude >= factor * 0.999999) return `${formatPlain(value / factor)}${suffix}`;
  }
  return value.toExponential(3);
}
