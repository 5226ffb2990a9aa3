/**
 * Which element terminals meet at each node of a flat circuit. Recognition walks this graph;
 * terminals keep their source ranges, so whatever is found can be pointed at.
 */
import type { FlatCircuit, FlatElement } from './flat-circuit';

/** One terminal of one element at a node. */
export interface Incidence {
  element: FlatElement;
  terminal: number;
}

export interface NodeGraph {
  /** Every node that some element terminal touches. */
  nodes: string[];
  /** Terminals at a node (empty for an unknown node). */
  at(node: string): readonly Incidence[];
  /** An element by its lowercase hierarchical key. */
  element(key: string): FlatElement | undefined;
  /** Instance ports (resolved or black-box X cards) at a node. */
  instancesAt(node: string): readonly FlatCircuit['instances'][number][];
}

const NONE: readonly never[] = [];

/** Builds the node graph of a flat circuit. */
export function buildNodeGraph(flat: FlatCircuit): NodeGraph {
  const byNode = new Map<string, Incidence[]>();
  const byKey = new Map<string, FlatElement>();
  for (const element of flat.elements) {
    byKey.set(element.key, element);
    const terminals = element.terminals;
    for (let terminal = 0; terminal < terminals.length; terminal++) {
      const node = terminals[terminal]!.node;
      const list = byNode.get(node);
      if (list) list.push({ element, terminal });
      else byNode.set(node, [{ element, terminal }]);
    }
  }
  const instancesByNode = new Map<string, FlatCircuit['instances'][number][]>();
  for (const instance of flat.instances) {
    for (const node of new Set(instance.terminals.map((t) => t.node))) {
      let list = instancesByNode.get(node);
      if (!list) instancesByNode.set(node, (list = []));
      list.push(instance);
    }
  }
  return {
    nodes: [...byNode.keys()],
    at: (node) => byNode.get(node) ?? NONE,
    element: (k) => byKey.get(k),
    instancesAt: (node) => instancesByNode.get(node) ?? NONE,
  };
}

/** The node at the other end of a two-terminal element. */
export function otherEnd(element: FlatElement, node: string): string | undefined {
  const [a, b] = element.terminals;
  if (!a || !b) return undefined;
  if (a.node === node) return b.node;
  if (b.node === node) return a.node;
  return undefined;
}
