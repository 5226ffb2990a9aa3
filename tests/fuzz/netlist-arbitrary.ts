/**
 * Grammar-aware random netlists: every rectifier topology Rectilens recognises (bridges, half-wave,
 * centre tap, doublers, three-phase, hybrid), with random values (ordinary most of the time,
 * pathological sometimes), models, parameters, directives, subcircuit packaging, continuation
 * lines and the odd corrupted card. Node and element names carry the block's index, so blocks
 * never collide; none of the vocabulary contains "NaN" or "Infinity".
 */
import fc from 'fast-check';

/** A value: an ordinary engineering number most of the time, an edge case sometimes. */
function value(ordinary: fc.Arbitrary<string>, edges: readonly string[]): fc.Arbitrary<string> {
  return fc.oneof({ weight: 9, arbitrary: ordinary }, { weight: 1, arbitrary: fc.constantFrom(...edges) });
}

const engineering = (minMantissa: number, maxMantissa: number, suffixes: readonly string[]) =>
  fc.tuple(fc.integer({ min: minMantissa, max: maxMantissa }), fc.constantFrom(...suffixes)).map(([m, s]) => `${m}${s}`);

const EDGE_VALUES = ['0', '-1k', '1e400', '1e-30', '1e30', '{1/0}', '{rl}', '{undefined_p}', '{sqrt(-1)}', '-0', '1e-300'];
const resistance = value(engineering(1, 999, ['', 'k']), EDGE_VALUES);
const capacitance = value(engineering(1, 999, ['u', 'n']), EDGE_VALUES);
const amplitude = value(fc.integer({ min: 3, max: 400 }).map(String), ['0', '-325', '1e400', '1e30', '1e-12']);
const frequency = value(fc.constantFrom('50', '60', '400', '16.7'), ['0', '-50', '1e9', '1e-9', '1e400']);

export interface BlockParts {
  amp: string;
  freq: string;
  cap: string;
  load: string;
  series: string | undefined;
  model: string;
  packaged: boolean;
  reversed: boolean;
  noLoad: boolean;
}

const blockParts: fc.Arbitrary<BlockParts> = fc.record({
  amp: amplitude,
  freq: frequency,
  cap: capacitance,
  load: resistance,
  series: fc.option(resistance, { nil: undefined }),
  model: fc.constantFrom('DM', 'DS', 'DM', 'DNONE'),
  packaged: fc.boolean(),
  reversed: fc.integer({ min: 0, max: 11 }).map((n) => n === 0),
  noLoad: fc.integer({ min: 0, max: 9 }).map((n) => n === 0),
});

type Kind = 'bridge' | 'half-wave' | 'centre-tap' | 'doubler-full' | 'doubler-half' | 'three-phase' | 'hybrid';
const KINDS: readonly Kind[] = ['bridge', 'half-wave', 'centre-tap', 'doubler-full', 'doubler-half', 'three-phase', 'hybrid'];

/** The cards of one rectifier block (index `i`), before continuation splitting and corruption. */
export function blockCards(kind: Kind, i: number, p: BlockParts): string[] {
  const n = (name: string) => `n${i}${name}`;
  const sin = (phase = 0) => `SIN(0 ${p.amp} ${p.freq}${phase ? ` 0 0 ${phase}` : ''})`;
  const src = (name: string, a: string, b: string, phase = 0) => {
    if (!p.series) return [`V${i}${name} ${a} ${b} ${sin(phase)}`];
    return [`V${i}${name} ${a}s ${b} ${sin(phase)}`, `RS${i}${name} ${a}s ${a} ${p.series}`];
  };
  const filter = (pos: string, neg: string) => [`C${i} ${pos} ${neg} ${p.cap}`, ...(p.noLoad ? [] : [`RL${i} ${pos} ${neg} ${p.load}`])];
  const d = (name: string, anode: string, cathode: string) => `D${i}${name} ${anode} ${cathode} ${p.model}`;
  switch (kind) {
    case 'bridge': {
      const devices = [d('1', n('a'), n('p')), d('2', n('b'), n('p')), p.reversed ? d('3', n('a'), '0') : d('3', '0', n('a')), d('4', '0', n('b'))];
      const body = p.packaged
        ? [`.subckt BR${i} a b p n`, 'D1 a p DM', 'D2 b p DM', 'D3 n a DM', 'D4 n b DM', `.ends BR${i}`, `X${i} ${n('a')} ${n('b')} ${n('p')} 0 BR${i}`]
        : devices;
      return [...src('', n('a'), n('b')), ...body, ...filter(n('p'), '0')];
    }
    case 'hybrid':
      return [...src('', n('a'), n('b')), d('1', n('a'), n('p')), d('2', n('b'), n('p')), `M${i}3 ${n('a')} ${n('b')} 0 0 NM`, `M${i}4 ${n('b')} ${n('a')} 0 0 NM`, ...filter(n('p'), '0')];
    case 'half-wave':
      return [...src('', n('in'), '0'), d('1', n('in'), n('o')), ...filter(n('o'), '0')];
    case 'centre-tap':
      return [...src('a', n('a'), '0'), ...src('b', '0', n('b')), d('1', n('a'), n('o')), d('2', n('b'), n('o')), ...filter(n('o'), '0')];
    case 'doubler-full':
      return [...src('', n('ac'), n('m')), `CA${i} ${n('o')} ${n('m')} ${p.cap}`, `CB${i} ${n('m')} 0 ${p.cap}`, d('1', '0', n('ac')), d('2', n('ac'), n('o')), ...(p.noLoad ? [] : [`RL${i} ${n('o')} 0 ${p.load}`])];
    case 'doubler-half':
      return [...src('', n('in'), '0'), `CA${i} ${n('in')} ${n('a')} ${p.cap}`, d('1', '0', n('a')), d('2', n('a'), n('o')), ...filter(n('o'), '0')];
    case 'three-phase':
      return [
        ...src('a', n('a'), '0'), ...src('b', n('b'), '0', -120), ...src('c', n('c'), '0', 120),
        d('1', n('a'), n('p')), d('2', n('b'), n('p')), d('3', n('c'), n('p')), d('4', n('m'), n('a')), d('5', n('m'), n('b')), d('6', n('m'), n('c')),
        ...filter(n('p'), n('m')),
      ];
  }
}

const MODELS = ['.model DM D(IS=2n N=1.8 RS=0.04)', '.model DS D(IS=1u N=1.05 RS=0.01 BV=45)', '.model NM NMOS(rdson=20m)'];

const directive = fc.oneof(
  fc.tuple(fc.constantFrom('230', '120', '24', '400', '0', '-5', '1e400'), fc.constantFrom('50', '60', '0'), fc.constantFrom('', ' phases=3', ' tol=-10%,+10%', ' tol=-90%,+200%'))
    .map(([v, f, extra]) => `*@ mains ${v}V ${f}Hz${extra}`),
  fc.constantFrom('*@ ambient 25C..60C', '*@ ambient 60C..25C', '*@ ambient -300C..9999C'),
  fc.constantFrom('*@ load 10W vmin=5V', '*@ load 0.8A', '*@ load 33ohm', '*@ load 0W', '*@ load -10W'),
  fc.constantFrom('*@ rate DM vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=60', '*@ rate DS vrrm=45V ifav=3A ifsm=80A tjmax=125C rthja=0', '*@ rate C0 vrated=0V iripple=0A'),
  fc.constantFrom('*@ derate vr=80% if=70% tj=125C cap=80%', '*@ derate vr=0%', '*@ allow piv-margin', '*@ allow missing-rating', '*@ nonsense 1 2 3'),
);

const paramCard = fc.constantFrom('.param rl=1k', '.param rl={2*rl}', '.param rl={1k*2} big=1e30', '.param rl=-5');

/** Breaks a card across continuation lines at one of its blanks. */
function splitCard(card: string, at: number): string {
  const blanks = [...card.matchAll(/ /g)].map((m) => m.index);
  if (blanks.length === 0) return card;
  const b = blanks[at % blanks.length]!;
  return `${card.slice(0, b)}\n+${card.slice(b)}`;
}

/** Deletes or inserts a character somewhere in a card, to mix broken cards in. */
function corrupt(card: string, at: number, insert: string): string {
  const k = at % (card.length + 1);
  return insert === '' ? card.slice(0, k) + card.slice(k + 1) : card.slice(0, k) + insert + card.slice(k);
}

const blockArb = fc.tuple(fc.constantFrom(...KINDS), blockParts);

/** A whole netlist with one to three rectifier blocks. */
export const netlistText: fc.Arbitrary<string> = fc
  .record({
    blocks: fc.array(blockArb, { minLength: 1, maxLength: 3 }),
    directives: fc.array(directive, { maxLength: 4 }),
    params: fc.array(paramCard, { maxLength: 2 }),
    splits: fc.array(fc.nat(200), { maxLength: 3 }),
    corruptions: fc.array(fc.tuple(fc.nat(400), fc.constantFrom('', '(', ')', '=', '{', '"', ' ', 'x', '\n', '\n+')), { maxLength: 2 }),
    endCard: fc.boolean(),
    eol: fc.constantFrom('\n', '\n', '\r\n'),
  })
  .map(({ blocks, directives, params, splits, corruptions, endCard, eol }) => {
    const cards = [...directives, ...params, ...blocks.flatMap(([kind, parts], i) => blockCards(kind, i, parts)), ...MODELS];
    for (const s of splits) {
      const k = s % cards.length;
      cards[k] = splitCard(cards[k]!, s);
    }
    for (const [at, insert] of corruptions) {
      const k = at % cards.length;
      cards[k] = corrupt(cards[k]!, at, insert);
    }
    return ['Fuzzed rectifiers (generated)', ...cards, ...(endCard ? ['.end'] : [])].join(eol) + eol;
  });
