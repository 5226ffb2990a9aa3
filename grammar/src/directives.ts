/**
 * Reads one `*@` directive line into a typed record. Each problem is a diagnostic on the exact
 * word at fault, in words of our own; an unknown keyword is a warning, not an error, so a file
 * written for a newer version still analyses.
 */
import {
  DERATE_KEYS, DIRECTIVE_KEYWORDS, PROFILE_KEYS, RATING_KEYS, type ProfileDirective,
  type AllowDirective, type AmbientDirective, type DerateDirective, type DerateKey, type Directive,
  type ForwardPoint, type LoadDirective, type LoadSpec, type MainsDirective, type RateDirective, type RatingEntry, type RatingKey,
} from './directive-records';
import type { Span, SyntaxDiagnostic } from './syntax-tree';
import { loadProblem, lowLineProblem, surgeDurationProblem } from './directive-checks';
import { readNumber } from './values';

interface Word {
  text: string;
  start: number;
  end: number;
}

type Report = (word: Span, message: string) => void;

export interface DirectiveParse {
  directive?: Directive;
  diagnostics: SyntaxDiagnostic[];
}

/** Parses the text of a directive line (starting with `*@`) found at `offset` in the document. */
export function parseDirective(line: string, offset: number): DirectiveParse {
  const diagnostics: SyntaxDiagnostic[] = [];
  const span: Span = { start: offset, end: offset + line.length };
  const report: Report = (at, message) => diagnostics.push({ span: at, severity: 'error', code: 'directive-error', message });
  const words = splitWords(line.slice(2), offset + 2);
  const head = words.shift();
  if (!head) {
    report(span, `empty directive; expected one of ${DIRECTIVE_KEYWORDS.join(', ')}`);
    return { diagnostics };
  }
  const keyword = head.text.toLowerCase();
  const readers: Record<string, (ws: Word[], s: Span, r: Report) => Directive> = {
    mains: readMains, ambient: readAmbient, load: readLoad, rate: readRate, derate: readDerate, allow: readAllow, profile: readProfile,
  };
  const reader = readers[keyword];
  if (!reader) {
    diagnostics.push({
      span: head, severity: 'warning', code: 'directive-error',
      message: `unknown directive '${head.text}'; expected one of ${DIRECTIVE_KEYWORDS.join(', ')}`,
    });
    return { diagnostics };
  }
  return { directive: reader(words, span, report), diagnostics };
}

function splitWords(text: string, base: number): Word[] {
  const words: Word[] = [];
  for (const m of text.matchAll(/\S+/g)) words.push({ text: m[0], start: base + m.index, end: base + m.index + m[0].length });
  return words;
}

/** Splits `key=value` keeping the value's offset. */
function splitKeyValue(word: Word): { key: string; value?: Word } {
  const at = word.text.indexOf('=');
  if (at < 0) return { key: word.text.toLowerCase() };
  return { key: word.text.slice(0, at).toLowerCase(), value: { text: word.text.slice(at + 1), start: word.start + at + 1, end: word.end } };
}

const UNIT_NAMES: Readonly<Record<string, string>> = {
  V: 'a voltage such as 230V', Hz: 'a frequency such as 50Hz', C: 'a temperature such as 60C', '%': 'a percentage such as 80%',
  A: 'a current such as 1A', W: 'a power such as 45W', ohm: 'a resistance such as 33ohm', s: 'a time such as 10ms',
  'K/W': 'a thermal resistance such as 60 (K/W)', h: 'a time in hours such as 5000h', '': 'a number',
};

const UNIT_SPELLINGS: Readonly<Record<string, readonly string[]>> = {
  V: ['v', 'volt', 'volts'], Hz: ['hz'], C: ['c', '°c', '°'], '%': ['%'], A: ['a', 'amp', 'amps'], W: ['w', 'watt', 'watts'],
  ohm: ['ohm', 'ohms', 'Ω', 'r'], s: ['s', 'sec'], 'K/W': ['k/w', 'c/w', '°c/w'], h: ['h', 'hr', 'hrs', 'hour', 'hours'], '': [],
};

/** Reads a number in the expected unit (written or omitted); reports and returns undefined otherwise. */
function readQuantity(word: Word | undefined, unit: string, report: Report, at: Span): number | undefined {
  if (!word || word.text === '') {
    report(word ?? at, `expected ${UNIT_NAMES[unit]}`);
    return undefined;
  }
  let text = word.text;
  if (unit === 'K/W') text = text.replace(/(k|°?c)\/w$/i, '');
  const reading = readNumber(text);
  const spellings = UNIT_SPELLINGS[unit]!;
  if (!reading || !Number.isFinite(reading.value) || (reading.unit !== '' && !spellings.includes(reading.unit))) {
    report(word, `expected ${UNIT_NAMES[unit]}, got '${word.text}'`);
    return undefined;
  }
  return unit === '%' ? reading.value / 100 : reading.value;
}

/** Tells which unit a written quantity carries, for directives that accept several. */
function unitOf(word: Word): string | undefined {
  const reading = readNumber(word.text);
  if (!reading) return undefined;
  for (const [unit, spellings] of Object.entries(UNIT_SPELLINGS)) if (spellings.includes(reading.unit)) return unit;
  return undefined;
}

function readMains(words: Word[], span: Span, report: Report): MainsDirective {
  const record: MainsDirective = { keyword: 'mains', span };
  let tolerance: Word | undefined;
  let voltage: Word | undefined;
  for (const word of words) {
    const { key, value } = splitKeyValue(word);
    if (value && key === 'tol') {
      tolerance = value;
      readTolerance(value, record, report);
    } else if (value && key === 'phases') {
      const phases = readQuantity(value, '', report, word);
      if (phases === 1 || phases === 3) record.phases = phases;
      else if (phases !== undefined) report(value, `phases must be 1 or 3, got '${value.text}'`);
    } else if (value) report(word, `unknown mains key '${key}'; expected tol or phases`);
    else if (pieces(word, ',').every((w) => unitOf(w) === 'Hz')) readFrequencies(word, record, report);
    else if (!voltage) {
      voltage = word;
      readMainsVoltage(word, record, report);
    } else report(word, `unexpected '${word.text}'; mains takes a voltage (or a range such as 100V..240V), frequencies, tol= and phases=`);
  }
  if (!voltage) report(span, 'mains needs a voltage such as 230V');
  if (tolerance) checkLowLine(tolerance, record, report);
  return record;
}

/** The pieces of a word between separators, each keeping its offset. */
function pieces(word: Word, separator: string): Word[] {
  const out: Word[] = [];
  let start = word.start;
  for (const text of word.text.split(separator)) {
    out.push({ text, start, end: start + text.length });
    start += text.length + separator.length;
  }
  return out;
}

/** `230V`, or a universal input `100V..240V` (lowest first): `vrms` is then the highest. */
function readMainsVoltage(word: Word, record: MainsDirective, report: Report): void {
  const ends = pieces(word, '..');
  if (ends.length === 1) {
    record.vrms = readPositive(word, 'V', 'a mains voltage', report);
    return;
  }
  if (ends.length !== 2) {
    report(word, `a mains range is written lowest..highest, e.g. 100V..240V; got '${word.text}'`);
    return;
  }
  const low = readPositive(ends[0]!, 'V', 'a mains voltage', report);
  const high = readPositive(ends[1]!, 'V', 'a mains voltage', report);
  if (low === undefined || high === undefined) return;
  if (low > high) report(word, 'a mains range is written lowest..highest, e.g. 100V..240V');
  else {
    record.vrms = high;
    if (low < high) record.vrmsRange = [low, high];
  }
}

/** `50Hz` or several, `50Hz,60Hz`: `freqHz` is the first written, `freqsHz` all of them ascending. */
function readFrequencies(word: Word, record: MainsDirective, report: Report): void {
  const read = pieces(word, ',').map((w) => readPositive(w, 'Hz', 'a mains frequency', report));
  const freqs = read.filter((f): f is number => f !== undefined);
  if (freqs.length === 0) return;
  record.freqHz = freqs[0];
  const distinct = [...new Set(freqs)].sort((a, b) => a - b);
  if (distinct.length > 1) record.freqsHz = distinct;
}

/** A quantity that must be above zero (a line of 0 Hz has no period, one of 0 V no figures). */
function readPositive(word: Word, unit: string, what: string, report: Report): number | undefined {
  const value = readQuantity(word, unit, report, word);
  if (value === undefined || value > 0) return value;
  report(word, `${what} must be above zero, got '${word.text}'; it is ignored`);
  return undefined;
}

function checkLowLine(value: Word, record: MainsDirective, report: Report): void {
  const problem = lowLineProblem(value.text, record);
  if (!problem) return;
  report(value, problem);
  delete record.tolLow;
  delete record.tolHigh;
}

function readTolerance(value: Word, record: MainsDirective, report: Report): void {
  const parts = value.text.split(',');
  const comma = value.text.indexOf(',');
  const first: Word = { text: parts[0]!, start: value.start, end: value.start + parts[0]!.length };
  const low = readQuantity(first, '%', report, value);
  if (parts.length === 1) {
    if (low !== undefined) [record.tolLow, record.tolHigh] = [-Math.abs(low), Math.abs(low)];
    return;
  }
  const second: Word = { text: parts[1]!, start: value.start + comma + 1, end: value.end };
  const high = readQuantity(second, '%', report, value);
  if (low !== undefined && high !== undefined) {
    if (low > 0 || high < 0) report(value, 'tol is written low,high: e.g. tol=-15%,+10%');
    else [record.tolLow, record.tolHigh] = [low, high];
  }
}

const ABSOLUTE_ZERO_C = -273.15;

function readAmbient(words: Word[], span: Span, report: Report): AmbientDirective {
  const record: AmbientDirective = { keyword: 'ambient', span };
  const word = words[0];
  if (!word) {
    report(span, 'ambient needs a temperature such as 25C..60C');
    return record;
  }
  const range = word.text.split('..');
  if (range.length === 2) {
    const dots = word.text.indexOf('..');
    record.nominalC = readQuantity({ text: range[0]!, start: word.start, end: word.start + dots }, 'C', report, word);
    record.maxC = readQuantity({ text: range[1]!, start: word.start + dots + 2, end: word.end }, 'C', report, word);
    if (record.nominalC !== undefined && record.maxC !== undefined && record.maxC < record.nominalC) {
      report(word, 'ambient is written nominal..maximum, lowest first');
    }
  } else {
    record.nominalC = record.maxC = readQuantity(word, 'C', report, span);
  }
  // Below absolute zero the device models' kelvin temperatures turn negative and the solver's figures NaN.
  if ((record.nominalC ?? 0) < ABSOLUTE_ZERO_C || (record.maxC ?? 0) < ABSOLUTE_ZERO_C) {
    report(word, `ambient below absolute zero (${ABSOLUTE_ZERO_C} °C)`);
    delete record.nominalC;
    delete record.maxC;
  }
  for (const extra of words.slice(1)) report(extra, `unexpected '${extra.text}'; ambient takes one range such as 25C..60C`);
  return record;
}

function readLoad(words: Word[], span: Span, report: Report): LoadDirective {
  const record: LoadDirective = { keyword: 'load', span };
  for (const word of words) {
    const { key, value } = splitKeyValue(word);
    if (value && key === 'vmin') {
      const vminV = readQuantity(value, 'V', report, word);
      if (vminV !== undefined && vminV < 0) report(value, `vmin must not be negative, got '${value.text}'; it is ignored`);
      else record.vminV = vminV;
    } else if (value) report(word, `unknown load key '${key}'; expected vmin`);
    else if (record.load) report(word, `unexpected '${word.text}'; load takes one of W, A or ohm, or a range such as 0.2W..12W`);
    else readLoadAmounts(word, record, report, span);
  }
  if (!record.load && words.length === 0) report(span, 'load needs a value such as 45W, 0.8A or 33ohm');
  return record;
}

/** One load (`12W`) or a range of one unit (`0.2W..12W`, `5mA..150mA`, `1kohm..100ohm`), either order. */
function readLoadAmounts(word: Word, record: LoadDirective, report: Report, span: Span): void {
  const ends = pieces(word, '..');
  if (ends.length > 2) {
    report(word, `a load range has two ends, e.g. 0.2W..12W; got '${word.text}'`);
    return;
  }
  const specs: LoadSpec[] = [];
  for (const end of ends) {
    const unit = unitOf(end);
    const kind = unit === 'W' ? 'power' : unit === 'A' ? 'current' : unit === 'ohm' ? 'resistance' : undefined;
    if (!kind) {
      report(end, `load needs a unit: 45W (constant power), 0.8A (constant current) or 33ohm, got '${end.text}'`);
      return;
    }
    const amount = readQuantity(end, unit!, report, span);
    const problem = amount === undefined ? undefined : loadProblem(kind, amount);
    if (problem) report(end, problem);
    if (problem || amount === undefined) return;
    specs.push(kind === 'power' ? { kind, w: amount } : kind === 'current' ? { kind, a: amount } : { kind, ohm: amount });
  }
  if (specs.length === 2 && specs[0]!.kind !== specs[1]!.kind) {
    report(word, `both ends of a load range take one unit (W, A or ohm), e.g. 0.2W..12W; got '${word.text}'`);
    return;
  }
  // The full end draws the most: the larger power or current, the smaller resistance.
  let [full, light] = [specs[0]!, specs[1]];
  if (light && (full.kind === 'resistance' ? loadAmount(light) < loadAmount(full) : loadAmount(light) > loadAmount(full))) [full, light] = [light, full];
  record.load = full;
  if (light && loadAmount(light) !== loadAmount(full)) record.lightLoad = light;
}

function loadAmount(spec: LoadSpec): number {
  return spec.kind === 'power' ? spec.w : spec.kind === 'current' ? spec.a : spec.ohm;
}

const RATING_UNITS: Readonly<Record<RatingKey, string>> = {
  vrrm: 'V', ifav: 'A', ifsm: 'A', tjmax: 'C', rthja: 'K/W', vf: 'V', vds: 'V', id: 'A', rdson: 'ohm', vsd: 'V',
  vrated: 'V', iripple: 'A', esr: 'ohm', vmin: 'V', iq: 'A', cost: '', vmax: 'V',
  tol: '%', life: '%', esrlife: '', vfspread: 'V',
  hot: 'ohm', endurance: 'h', rth: 'K/W',
};

/** Keys whose value is a spread `low,high` (or one magnitude for ±). */
const RANGE_RATINGS: ReadonlySet<RatingKey> = new Set(['tol', 'vfspread']);

function readRate(words: Word[], span: Span, report: Report): RateDirective {
  const target = words.shift();
  const record: RateDirective = { keyword: 'rate', span, entries: [] };
  if (!target || target.text.includes('=')) {
    report(target ?? span, 'rate needs a model or instance name first, e.g. *@ rate DMAIN vrrm=600V');
    if (target) words.unshift(target);
  } else {
    record.target = { text: target.text, span: { start: target.start, end: target.end } };
  }
  for (const word of words) {
    const entry = readRatingEntry(word, report);
    if (entry) record.entries.push(entry);
  }
  return record;
}

function readRatingEntry(word: Word, report: Report): RatingEntry | undefined {
  const { key, value } = splitKeyValue(word);
  if (!(RATING_KEYS as readonly string[]).includes(key)) {
    report(word, `unknown rating '${key}'; expected one of ${RATING_KEYS.join(', ')}`);
    return undefined;
  }
  const span = { start: word.start, end: word.end };
  if (!value) {
    report(word, `rating '${key}' needs a value, e.g. ${key}=…`);
    return undefined;
  }
  const ratingKey = key as RatingKey;
  if (ratingKey === 'vf') {
    const points = readForwardPoints(value, report);
    return points ? { key: ratingKey, span, points } : undefined;
  }
  if (ratingKey === 'iq' && value.text.includes('@')) {
    const points = readQuiescentPoints(value, report);
    return points ? { key: ratingKey, span, points } : undefined;
  }
  if (RANGE_RATINGS.has(ratingKey)) {
    const range = readSpread(value, RATING_UNITS[ratingKey], key, report);
    return range ? { key: ratingKey, span, range } : undefined;
  }
  const [amount, duration] = splitAt(value);
  const entry: RatingEntry = { key: ratingKey, span, value: readQuantity(amount, RATING_UNITS[ratingKey], report, word) };
  if (!duration && ratingKey === 'endurance') {
    report(word, `endurance is the rated life at a temperature, hours@temperature, e.g. endurance=5000h@105C`);
    return undefined;
  }
  if (duration && ratingKey === 'endurance') {
    const atC = readQuantity(duration, 'C', report, duration);
    if (atC === undefined) return undefined;
    entry.atC = atC;
  } else if (duration) {
    if (ratingKey !== 'ifsm') report(duration, `only ifsm takes a duration after '@' (and endurance a temperature)`);
    else {
      const durationS = readSurgeDuration(duration, report);
      if (durationS === undefined) return undefined;
      entry.durationS = durationS;
    }
  }
  // Stresses are reported as a fraction of these ratings: a zero or negative one has no meaning.
  if (entry.value !== undefined && POSITIVE_RATINGS.has(ratingKey) && !(entry.value > 0)) {
    report(word, `rating '${key}' must be above zero`);
    return undefined;
  }
  // Ageing only loses capacitance and only raises ESR.
  if (entry.value !== undefined && ratingKey === 'life' && !(entry.value <= 0 && entry.value > -1)) {
    report(word, `life is the capacitance lost over life, from 0 % down to above −100 %, e.g. life=-20%`);
    return undefined;
  }
  if (entry.value !== undefined && ratingKey === 'esrlife' && !(entry.value >= 1)) {
    report(word, `esrlife is the factor ESR rises by at end of life, 1 or more, e.g. esrlife=2`);
    return undefined;
  }
  return entry.value === undefined ? undefined : entry;
}

/** `low,high` with low ≤ 0 ≤ high, or one magnitude read as ±; percentages as fractions (a tolerance stays above −100 %). */
function readSpread(value: Word, unit: string, key: string, report: Report): [number, number] | undefined {
  const parts = pieces(value, ',');
  if (parts.length > 2) {
    report(value, `${key} is written low,high, e.g. ${key}=${unit === '%' ? '-20%,+20%' : '-0.05V,+0.1V'}`);
    return undefined;
  }
  const read = parts.map((p) => readQuantity(p, unit, report, value));
  if (read.some((v) => v === undefined)) return undefined;
  const range: [number, number] = read.length === 1 ? [-Math.abs(read[0]!), Math.abs(read[0]!)] : [read[0]!, read[1]!];
  if (range[0] > 0 || range[1] < 0 || (unit === '%' && range[0] <= -1)) {
    report(value, `${key} is written low,high around zero, e.g. ${key}=${unit === '%' ? '-20%,+20%' : '-0.05V,+0.1V'}${unit === '%' ? ', the low side above −100 %' : ''}`);
    return undefined;
  }
  return range;
}

function readSurgeDuration(duration: Word, report: Report): number | undefined {
  const durationS = readQuantity(duration, 's', report, duration);
  const problem = durationS === undefined ? undefined : surgeDurationProblem(duration.text, durationS);
  if (problem) report(duration, problem);
  return problem ? undefined : durationS;
}

const POSITIVE_RATINGS: ReadonlySet<RatingKey> = new Set(['vrrm', 'ifav', 'ifsm', 'vds', 'id', 'vrated', 'iripple', 'hot', 'endurance', 'rth', 'vmax']);

/** `iq=40uA@8V,300uA@60V`: two quiescent currents at two different supply voltages, amps@volts. */
function readQuiescentPoints(value: Word, report: Report): ForwardPoint[] | undefined {
  const points: ForwardPoint[] = [];
  let start = value.start;
  for (const part of value.text.split(',')) {
    const piece: Word = { text: part, start, end: start + part.length };
    start += part.length + 1;
    const [amps, volts] = splitAt(piece);
    const iA = volts ? readQuantity(amps, 'A', report, piece) : undefined;
    const vV = volts ? readQuantity(volts, 'V', report, piece) : undefined;
    if (iA === undefined || vV === undefined) {
      if (!volts) report(piece, `a quiescent point is written amps@volts, e.g. 40uA@8V; got '${part}'`);
      return undefined;
    }
    points.push({ vV, iA });
  }
  if (points.length !== 2 || points[0]!.vV === points[1]!.vV || points.some((p) => !(p.iA >= 0) || !(p.vV > 0))) {
    report(value, 'iq takes one current, or two currents at two different supply voltages, e.g. iq=40uA@8V,300uA@60V');
    return undefined;
  }
  return points;
}

function splitAt(word: Word): [Word, Word | undefined] {
  const at = word.text.indexOf('@');
  if (at < 0) return [word, undefined];
  return [
    { text: word.text.slice(0, at), start: word.start, end: word.start + at },
    { text: word.text.slice(at + 1), start: word.start + at + 1, end: word.end },
  ];
}

function readForwardPoints(value: Word, report: Report): ForwardPoint[] | undefined {
  const points: ForwardPoint[] = [];
  let start = value.start;
  for (const part of value.text.split(',')) {
    const piece: Word = { text: part, start, end: start + part.length };
    start += part.length + 1;
    const [volts, amps] = splitAt(piece);
    if (!amps) {
      report(piece, `a forward point is written volts@amps, e.g. 0.93V@1A; got '${part}'`);
      return undefined;
    }
    const vV = readQuantity(volts, 'V', report, piece);
    const iA = readQuantity(amps, 'A', report, piece);
    if (vV === undefined || iA === undefined) return undefined;
    points.push({ vV, iA });
  }
  return points;
}

function readDerate(words: Word[], span: Span, report: Report): DerateDirective {
  const record: DerateDirective = { keyword: 'derate', span, entries: [] };
  if (words.length === 0) report(span, `derate needs at least one of ${DERATE_KEYS.join(', ')}, e.g. vr=80%`);
  for (const word of words) {
    const { key, value } = splitKeyValue(word);
    if (!(DERATE_KEYS as readonly string[]).includes(key) || !value) {
      report(word, `expected key=value with a key among ${DERATE_KEYS.join(', ')}, got '${word.text}'`);
      continue;
    }
    const amount = readQuantity(value, key === 'tj' ? 'C' : key === 'life' ? 'h' : '%', report, word);
    if (amount === undefined) continue;
    if (key === 'life' && !(amount > 0)) report(value, `life is the capacitor life asked for, in hours above zero, e.g. life=50000h; got '${value.text}'`);
    else if (key !== 'tj' && key !== 'life' && (amount <= 0 || amount > 1)) report(value, `a derating fraction lies between 0 and 100 %, got '${value.text}'`);
    else record.entries.push({ key: key as DerateKey, span: { start: word.start, end: word.end }, value: amount });
  }
  return record;
}

function readProfile(words: Word[], span: Span, report: Report): ProfileDirective {
  const record: ProfileDirective = { keyword: 'profile', span };
  if (words.length === 0) report(span, 'profile needs hours, years and price, e.g. *@ profile hours=4000h years=10 price=0.25');
  const units: Readonly<Record<(typeof PROFILE_KEYS)[number], string>> = { hours: 'h', years: '', price: '' };
  for (const word of words) {
    const { key, value } = splitKeyValue(word);
    if (!(PROFILE_KEYS as readonly string[]).includes(key) || !value) {
      report(word, `expected key=value with a key among ${PROFILE_KEYS.join(', ')}, got '${word.text}'`);
      continue;
    }
    const k = key as (typeof PROFILE_KEYS)[number];
    const amount = readQuantity(value, units[k], report, word);
    if (amount === undefined) continue;
    if (!(amount > 0) || (k === 'hours' && amount > 8784)) {
      report(value, k === 'hours' ? `hours are the operating hours per year, above zero and at most 8784; got '${value.text}'` : `${k} must be above zero; got '${value.text}'`);
      continue;
    }
    if (k === 'hours') record.hoursPerYear = amount;
    else if (k === 'years') record.years = amount;
    else record.pricePerKwh = amount;
  }
  return record;
}

function readAllow(words: Word[], span: Span, report: Report): AllowDirective {
  if (words.length === 0) report(span, 'allow needs a finding code, e.g. *@ allow piv-margin');
  return { keyword: 'allow', span, codes: words.map((w) => ({ text: w.text.toLowerCase(), span: { start: w.start, end: w.end } })) };
}
