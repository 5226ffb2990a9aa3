/**
 * Turns one element card into a flat element inside a given scope: hierarchical name, mapped
 * nodes, evaluated values, origin.
 */
import { key, type ElementCard as AnyElementCard, type Lookup, type Name, type SourceCard } from '../../../grammar/src/index';
import type { FindingSet } from '../findings/index';
import { didYouMean } from './did-you-mean';
import { GROUND, isGroundName, type FlatElement, type InstanceStep, type Origin, type SineWave, type Terminal } from './flat-circuit';
import { evaluateIn, evaluateParams } from './scope';

/** What a card needs from the scope it sits in. */
export interface Frame {
  uri: string;
  /** Display prefix (`X1.`) and key prefix (`x1.`); empty at top level. */
  namePrefix: string;
  keyPrefix: string;
  /** Subcircuit port (lowercase) → flat node outside. */
  ports: ReadonlyMap<string, string>;
  lookup: Lookup;
  /** Lowercase model name → key in the flat model table, or undefined when not visible here. */
  modelKey: (name: string) => string | undefined;
  /** The names of the models visible here, as written, innermost scope first (for "did you mean"). */
  modelNames: () => Iterable<string>;
  chain: InstanceStep[];
}

/** The flat node a node name stands for in a frame: ground, a port, or an internal node. */
export function mapNode(name: string, frame: Frame): string {
  if (isGroundName(name)) return GROUND;
  const lower = name.toLowerCase();
  return frame.ports.get(lower) ?? frame.keyPrefix + lower;
}

/** Terminals of a card's node names. */
export function terminalsOf(names: readonly Name[], frame: Frame): Terminal[] {
  return names.map((n) => ({ node: mapNode(n.text, frame), text: n.text, uri: frame.uri, span: n.span }));
}

export function originOf(card: { span: Origin['span']; name: Name }, frame: Frame): Origin {
  return { uri: frame.uri, span: card.span, nameSpan: card.name.span, chain: frame.chain };
}

/** A card that becomes one flat element: any element card but an X instance. */
export type ElementCard = Exclude<AnyElementCard, { kind: 'instance' }>;

/**
 * Builds the flat element for a card other than an X instance. Every card of a file passes here
 * on its first analysis, and each card an edit touched on later ones (elaboration-memo.ts), so each kind is one object literal with its fields in one order (an
 * intermediate object spread into the result cost more than the rest of elaboration).
 */
export function buildElement(card: ElementCard, frame: Frame, sink: FindingSet): FlatElement {
  const name = frame.namePrefix + card.name.text;
  const elementKey = frame.keyPrefix + key(card.name);
  const origin = originOf(card, frame);
  const params = card.kind !== 'coupling' && card.kind !== 'opaque' && card.params.length > 0 ? evaluateParams(card.params, frame.lookup, frame.uri, sink) : {};
  switch (card.kind) {
    case 'passive': {
      const kind = card.letter === 'R' ? 'resistor' : card.letter === 'C' ? 'capacitor' : 'inductor';
      return { name, key: elementKey, origin, params, kind, terminals: terminalsOf(card.nodes, frame), value: evaluateIn(card.value, frame.lookup, frame.uri, sink) };
    }
    case 'diode':
    case 'mosfet':
      return { name, key: elementKey, origin, params, kind: card.kind, terminals: terminalsOf(card.nodes, frame), model: modelOf(card.model, frame, sink) };
    case 'source':
      return { name, key: elementKey, origin, params, ...sourceValues(card, frame, sink), terminals: terminalsOf(card.nodes, frame) };
    case 'coupling':
      return {
        name, key: elementKey, origin, params, kind: 'coupling', terminals: [],
        inductors: card.inductors.map((n) => frame.keyPrefix + key(n)),
        coefficient: evaluateIn(card.coefficient, frame.lookup, frame.uri, sink),
      };
    case 'opaque':
      return { name, key: elementKey, origin, params, kind: 'opaque', terminals: [] };
  }
}

function modelOf(model: Name | undefined, frame: Frame, sink: FindingSet): string | undefined {
  if (!model) return undefined;
  const found = frame.modelKey(key(model));
  if (found === undefined) {
    // An error, as in any simulator: the device's ratings and forward law come from its model, so
    // a typo would otherwise pass it with defaults and no ratings.
    const place = { uri: frame.uri, span: model.span };
    const { clause, fixes } = didYouMean(model.text, frame.modelNames(), place);
    sink.add({
      ...place, severity: 'error', code: 'unknown-model',
      message: `no .model '${model.text}' is visible here: the device is analysed with default parameters and no ratings from its model${clause}`,
      ...(fixes.length ? { fixes } : {}),
    });
  }
  return found;
}

function sourceValues(card: SourceCard, frame: Frame, sink: FindingSet) {
  const evaluate = (v: Parameters<typeof evaluateIn>[0]) => evaluateIn(v, frame.lookup, frame.uri, sink);
  const values = {
    kind: card.letter === 'V' ? ('vsource' as const) : ('isource' as const),
    dc: evaluate(card.dc) ?? 0,
    acMagnitude: evaluate(card.acMagnitude),
    sine: undefined as SineWave | undefined,
    otherWaveform: undefined as string | undefined,
  };
  const wave = card.waveform;
  if (!wave) return values;
  if (key(wave.name) !== 'sin') {
    values.otherWaveform = key(wave.name);
    return values;
  }
  const args = wave.args.map((a) => evaluate(a));
  values.sine = {
    offset: args[0] ?? 0,
    amplitude: args[1] ?? 0,
    freqHz: args[2] !== undefined && args[2] > 0 ? args[2] : undefined,
    delayS: args[3] ?? 0,
    dampingPerS: args[4] ?? 0,
    phaseDeg: args[5] ?? 0,
  };
  return values;
}
