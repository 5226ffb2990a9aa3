/**
 * Which element terminals meet at each node of a flat circuit. Recognition walks this graph;
 * terminals keep their source ranges, so whatever is found can be pointed at.
 */
import type { FlatCircuit, FlatElement } from './flat-circuit';
import { NextCircuitMemo } from './next-circuit-memo';

/** One terminal of one element at a node. */
export interface Incidence {
  element: FlatElement;
  terminal: number;
}

export interface NodeGraph {
  /** Every node that some element terminal touches (shared with the next circuit's graph when its terminals are the same). */
  nodes: readonly string[];
  /** The same nodes by their index in `nodes`: a set of the names that holds nothing else of the circuit. */
  nodeIds: ReadonlyMap<string, number>;
  /** Terminals at a node (empty for an unknown node). */
  at(node: string): readonly Incidence[];
  /** An element by its lowercase hierarchical key. */
  element(key: string): FlatElement | undefined;
  /** Instance ports (resolved or black-box X cards) at a node. */
  instancesAt(node: string): readonly FlatCircuit['instances'][number][];
}

const NONE: readonly never[] = [];

const graphs = new WeakMap<FlatCircuit, NodeGraph>();

/** The node graph of a flat circuit, built once for it (recognition and the rules' look-ups share it). */
export function nodeGraphOf(flat: FlatCircuit): NodeGraph {
  let graph = graphs.get(flat);
  if (!graph) graphs.set(flat, (graph = graphOver(flat, reusedTerminals(flat.elements))));
  return graph;
}

/** A graph of its own for a flat circuit, made afresh and kept by no one (a cut-down circuit's, say). */
export function buildNodeGraph(flat: FlatCircuit): NodeGraph {
  return graphOver(flat, indexTerminals(flat.elements));
}

/**
 * Which node each element terminal touches, grouped by node: all a graph holds besides the
 * elements themselves. A terminal is a slot, numbered in element then terminal order.
 */
interface TerminalIndex {
  nodes: string[];
  ids: Map<string, number>;
  /** The slots of node n are `slots[start[n]]` up to `slots[start[n + 1]]`. */
  start: Int32Array;
  slots: Int32Array;
  elementOf: Int32Array;
  terminalOf: Int32Array;
}

/**
 * The last terminal index made for a root's flat circuit. A comment line or a value typed changes
 * no element's nodes, so the next circuit's terminals are those of the last one and their index
 * stands: it is used only when the terminals are the same, node for node, which costs a pass of
 * mostly pointer compares where making the index looks up every terminal's node by name (about
 * 10 ms at 50,000 lines). The price is the last index kept, some 5 MB at 100,000 lines.
 */
const lastIndex = new NextCircuitMemo<{ elements: readonly FlatElement[]; index: TerminalIndex }>();

function reusedTerminals(elements: readonly FlatElement[]): TerminalIndex {
  const last = lastIndex.get(elements);
  const index = last && sameTerminals(last.elements, elements) ? last.index : indexTerminals(elements);
  lastIndex.set(elements, { elements, index });
  return index;
}

/** Whether two element lists touch the same nodes, terminal for terminal. */
function sameTerminals(a: readonly FlatElement[], b: readonly FlatElement[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (x === y) continue;
    const tx = x.terminals;
    const ty = y.terminals;
    if (tx.length !== ty.length) return false;
    for (let t = 0; t < tx.length; t++) if (tx[t]!.node !== ty[t]!.node) return false;
  }
  return true;
}

function indexTerminals(elements: readonly FlatElement[]): TerminalIndex {
  const ids = new Map<string, number>();
  const nodes: string[] = [];
  let terminalCount = 0;
  for (const e of elements) terminalCount += e.terminals.length;
  const nodeOf = new Int32Array(terminalCount);
  const elementOf = new Int32Array(terminalCount);
  const terminalOf = new Int32Array(terminalCount);
  let k = 0;
  for (let i = 0; i < elements.length; i++) {
    const terminals = elements[i]!.terminals;
    for (let t = 0; t < terminals.length; t++, k++) {
      const node = terminals[t]!.node;
      let id = ids.get(node);
      if (id === undefined) { id = nodes.length; ids.set(node, id); nodes.push(node); }
      nodeOf[k] = id; elementOf[k] = i; terminalOf[k] = t;
    }
  }
  // Terminal slots grouped by node, each group in element then terminal order.
  const start = new Int32Array(nodes.length + 1);
  for (let j = 0; j < terminalCount; j++) start[nodeOf[j]! + 1]!++;
  for (let n = 0; n < nodes.length; n++) start[n + 1]! += start[n]!;
  const fill = start.slice(0, nodes.length);
  const slots = new Int32Array(terminalCount);
  for (let j = 0; j < terminalCount; j++) slots[fill[nodeOf[j]!]!++] = j;
  return { nodes, ids, start, slots, elementOf, terminalOf };
}

/**
 * The graph of a flat circuit over its terminal index. Recognition visits only the nodes around
 * its devices, so a node's list of incidences is made when first asked for, and the key and
 * instance maps on first use. A graph of one object per terminal cost more than the elaboration
 * it indexes on a large file, most of it in the collector moving those objects.
 */
function graphOver(flat: FlatCircuit, { nodes, ids, start, slots, elementOf, terminalOf }: TerminalIndex): NodeGraph {
  const elements = flat.elements;
  const lists: (readonly Incidence[] | undefined)[] = new Array(nodes.length);
  let byKey: Map<string, FlatElement> | undefined;
  let instancesByNode: Map<string, FlatCircuit['instances'][number][]> | undefined;
  return {
    nodes,
    nodeIds: ids,
    at(node) {
      const id = ids.get(node);
      if (id === undefined) return NONE;
      let list = lists[id];
      if (!list) {
        const made: Incidence[] = [];
        for (let s = start[id]!; s < start[id + 1]!; s++) made.push({ element: elements[elementOf[slots[s]!]!]!, terminal: terminalOf[slots[s]!]! });
        lists[id] = list = made;
      }
      return list;
    },
    element(key) {
      if (!byKey) {
        byKey = new Map();
        for (const e of elements) byKey.set(e.key, e);
      }
      return byKey.get(key);
    },
    instancesAt(node) {
      instancesByNode ??= instancesByNodeOf(flat.instances);
      return instancesByNode.get(node) ?? NONE;
    },
  };
}

function instancesByNodeOf(instances: FlatCircuit['instances']): Map<string, FlatCircuit['instances'][number][]> {
  const byNode = new Map<string, FlatCircuit['instances'][number][]>();
  for (const instance of instances) {
    for (const node of new Set(instance.terminals.map((t) => t.node))) {
      let list = byNode.get(node);
      if (!list) byNode.set(node, (list = []));
      list.push(instance);
    }
  }
  return byNode;
}

/** The node at the other end of a two-terminal element. */
export function otherEnd(element: FlatElement, node: string): string | undefined {
  const [a, b] = element.terminals;
  if (!a || !b) return undefined;
  if (a.node === node) return b.node;
  if (b.node === node) return a.node;
  return undefined;
}
