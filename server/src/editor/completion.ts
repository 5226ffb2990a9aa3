/** Completion of directive keywords and keys, model, subcircuit and node names, by position in the card. */
import { DERATE_KEYS, DIRECTIVE_KEYWORDS, PROFILE_KEYS, RATING_KEYS, key, type Netlist } from '../../../grammar/src/index';
import { FINDING_CODES } from '../rules/codes';
import { indexNames } from './name-index';
import { DEFAULT_ESR_LIFE_FACTOR } from '../equivalent/part-spreads';

export interface CompletionItem {
  label: string;
  kind: 'keyword' | 'property' | 'model' | 'subckt' | 'node' | 'code';
  detail?: string;
  insertText?: string;
}

const DIRECTIVE_DETAILS: Readonly<Record<string, string>> = {
  mains: 'line voltage (or a universal-input range), frequencies and tolerance: mains 230V 50Hz tol=-15%,+10% | mains 100V..240V 50Hz,60Hz tol=-10%,+10%',
  ambient: 'nominal and maximum ambient: ambient 25C..60C',
  load: 'load at the rectifier output, one value or a light..full range; parts drawn across the output add to it: load 45W | 0.8A | 33ohm | 0.2W..12W [vmin=…]',
  rate: 'ratings for a model or instance: rate NAME vrrm=600V ifsm=30A …',
  derate: 'derating policy: derate vr=80% if=70% tj=125C cap=80%',
  allow: 'accept a finding on the next card: allow CODE',
  profile: 'operating profile for the comparison\'s energy and payback: profile hours=4000h years=10 price=0.25 (per kWh, the currency of cost=)',
};

/** What the part-spread rating keys mean (the spreads the corners' part vertices pick from: solve/corners.ts). */
const RATING_DETAILS: Readonly<Partial<Record<string, string>>> = {
  tol: 'capacitor: capacitance tolerance low,high, e.g. tol=-20%,+20%',
  life: 'capacitor: capacitance lost over life, e.g. life=-20% (smallest C = nominal × (1 + tol low) × (1 + life))',
  esrlife: `capacitor: factor the rated esr= rises by at end of life or cold, e.g. esrlife=2 (default ${DEFAULT_ESR_LIFE_FACTOR}, common practice)`,
  vfspread: 'diode: forward-voltage spread low,high, e.g. vfspread=-0.05V,+0.1V',
  hot: 'resistor: an NTC inrush limiter; its hot resistance (the card value is its cold one), e.g. hot=1ohm',
  endurance: 'capacitor: rated life at a core temperature, e.g. endurance=5000h@105C (for the life estimate)',
  rth: 'capacitor: core-to-ambient thermal resistance in K/W (ripple self-heating), e.g. rth=20',
};

/** Suggestions for the cursor at `offset` of `netlist`; `models` lists every model known to the file (with includes). */
export function completeAt(netlist: Netlist, offset: number, models: { name: string; type: string }[] = []): CompletionItem[] {
  const text = netlist.text;
  const lineStart = text.lastIndexOf('\n', offset - 1) + 1;
  const before = text.slice(lineStart, offset);
  const words = before.trimStart().split(/\s+/);
  const position = words.length - 1; // index of the word being typed
  if (/^\s*\*@/.test(before)) return completeDirective(words, position);
  if (/^\s*[*;]/.test(before) || position === 0) return [];
  const letter = words[0]!.charAt(0).toUpperCase();
  const nodes = () => nodeNames(netlist, offset);
  if (letter === 'D') return position === 3 ? modelItems(models, ['d']) : position < 3 ? nodes() : [];
  if (letter === 'M') return position === 5 ? modelItems(models, ['nmos', 'pmos']) : position < 5 ? nodes() : [];
  if (letter === 'X') return [...nodes(), ...subcktItems(netlist)];
  if ('RCLVI'.includes(letter)) return position <= 2 ? nodes() : [];
  return [];
}

function completeDirective(words: string[], position: number): CompletionItem[] {
  const keyword = words[1]?.toLowerCase();
  if (position <= 1) return DIRECTIVE_KEYWORDS.map((k) => ({ label: k, kind: 'keyword', detail: DIRECTIVE_DETAILS[k] }));
  if (keyword === 'rate' && position >= 3) return RATING_KEYS.map((k) => ({ label: k, kind: 'property', insertText: `${k}=`, ...(RATING_DETAILS[k] ? { detail: RATING_DETAILS[k] } : {}) }));
  if (keyword === 'derate') return DERATE_KEYS.map((k) => ({ label: k, kind: 'property', insertText: `${k}=` }));
  if (keyword === 'allow') return Object.entries(FINDING_CODES).map(([code, detail]) => ({ label: code, kind: 'code', detail }));
  if (keyword === 'load') return [{ label: 'vmin', kind: 'property', insertText: 'vmin=' }];
  if (keyword === 'profile') return PROFILE_KEYS.map((k) => ({ label: k, kind: 'property', insertText: `${k}=` }));
  if (keyword === 'mains') return [{ label: 'tol', kind: 'property', insertText: 'tol=' }, { label: 'phases', kind: 'property', insertText: 'phases=' }];
  return [];
}

function modelItems(models: { name: string; type: string }[], types: string[]): CompletionItem[] {
  return models.filter((m) => types.includes(m.type.toLowerCase())).map((m) => ({ label: m.name, kind: 'model', detail: `model ${m.type}` }));
}

function subcktItems(netlist: Netlist): CompletionItem[] {
  const seen = new Map<string, CompletionItem>();
  for (const o of indexNames(netlist)) {
    if (o.kind === 'subckt' && o.role === 'definition') seen.set(o.key, { label: netlist.text.slice(o.span.start, o.span.end), kind: 'subckt' });
  }
  return [...seen.values()];
}

const GROUND_NAMES: ReadonlySet<string> = new Set(['0', 'gnd']);

/** Node names in the scope of the cursor (the subcircuit body it sits in, or the top level). */
function nodeNames(netlist: Netlist, offset: number): CompletionItem[] {
  const block = netlist.items.find((i) => i.kind === 'subckt-block' && i.span.start <= offset && offset <= i.span.end);
  const scope = block && block.kind === 'subckt-block' && block.header.name ? key(block.header.name) : '';
  const seen = new Map<string, CompletionItem>();
  for (const o of indexNames(netlist)) {
    // A body's nodes are local; only ground (scope '' everywhere) reaches into it from the top level.
    const inScope = o.scope === scope || (o.scope === '' && GROUND_NAMES.has(o.key));
    if (o.kind === 'node' && inScope && !(o.span.start <= offset && offset <= o.span.end)) {
      seen.set(o.key, { label: netlist.text.slice(o.span.start, o.span.end), kind: 'node' });
    }
  }
  return [...seen.values()];
}

/** Every `.model` in a netlist, for completion. */
export function modelsOf(netlist: Netlist): { name: string; type: string }[] {
  return netlist.cards.flatMap((c) => (c.kind === 'model' && c.name && c.type ? [{ name: c.name.text, type: c.type.text }] : []));
}
