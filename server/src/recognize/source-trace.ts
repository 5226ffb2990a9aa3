/**
 * Series chains: from a node, follow two-terminal resistors, inductors and voltage sources through
 * nodes where nothing else is attached (capacitors across the line are ignored: at the line
 * frequency they carry little current). This is how a designer finds "the source, through its
 * series R and L" feeding a rectifier.
 */
import { GROUND, otherEnd, type FlatElement, type NodeGraph } from '../circuit/index';

/** One element of a chain, traversed from `from` to `to`. */
export interface Step {
  element: FlatElement;
  from: string;
  to: string;
}

export interface Chain {
  end: string;
  steps: Step[];
}

/** An AC source's terminals after its series elements: where a rectifier would attach. */
export interface AcPort {
  ends: [string, string];
  /** From `ends[0]` to `ends[1]`, through the driver. */
  steps: Step[];
}

const SERIES_KINDS = new Set(['resistor', 'inductor', 'vsource']);

/**
 * Follows the series chain from `start` until a junction, ground, or a node in `stop`. The ports of
 * a resolved X instance are not junctions (its elements are in the graph); a black-box instance is
 * taken as high impedance, like a controller sensing the line.
 */
export function walkChain(graph: NodeGraph, start: string, exclude: ReadonlySet<string>, stop: ReadonlySet<string> = new Set()): Chain {
  const used = new Set(exclude);
  const visited = new Set([start]);
  const steps: Step[] = [];
  let node = start;
  for (;;) {
    if ((steps.length > 0 && stop.has(node)) || node === GROUND) break;
    const element = soleElementAt(graph, node, used);
    if (!element) break;
    const to = otherEnd(element, node);
    if (!SERIES_KINDS.has(element.kind) || element.terminals.length !== 2 || to === undefined || visited.has(to)) break;
    steps.push({ element, from: node, to });
    used.add(element.key);
    visited.add(to);
    node = to;
  }
  return { end: node, steps };
}

/**
 * The one element at a node that is neither used nor a capacitor, or undefined when there are
 * none or several. It stops at the second one, so a node with thousands of terminals costs two.
 */
function soleElementAt(graph: NodeGraph, node: string, used: ReadonlySet<string>): FlatElement | undefined {
  let sole: FlatElement | undefined;
  for (const { element } of graph.at(node)) {
    if (used.has(element.key) || element.kind === 'capacitor') continue;
    if (sole) return undefined;
    sole = element;
  }
  return sole;
}

/** Reverses a list of steps (for a chain walked from the other end). */
export function reverseSteps(steps: readonly Step[]): Step[] {
  return steps.map((s) => ({ element: s.element, from: s.to, to: s.from })).reverse();
}

/** The series loop from `a` to `b` (both chains may meet at a common node such as ground), or undefined. */
export function findLoop(graph: NodeGraph, a: string, b: string, exclude: ReadonlySet<string>): Step[] | undefined {
  const fromA = walkChain(graph, a, exclude, new Set([b]));
  if (fromA.end === b) return fromA.steps;
  const usedA = new Set([...exclude, ...fromA.steps.map((s) => s.element.key)]);
  const fromB = walkChain(graph, b, usedA, new Set([a]));
  if (fromB.end === a) return reverseSteps(fromB.steps);
  if (fromA.end === fromB.end) return [...fromA.steps, ...reverseSteps(fromB.steps)];
  return undefined;
}

/** Whether an element drives AC: a voltage source with a sine, or a coupled inductor. */
export function isAcDriver(element: FlatElement, coupled: ReadonlySet<string>): boolean {
  if (element.kind === 'vsource') return (element.sine?.amplitude ?? 0) !== 0;
  return element.kind === 'inductor' && coupled.has(element.key);
}

/** The AC ports of every driver: both of its chains followed outwards. Loops that close on themselves are left out. */
export function findAcPorts(graph: NodeGraph, elements: readonly FlatElement[], coupled: ReadonlySet<string>): AcPort[] {
  const ports: AcPort[] = [];
  const seen = new Set<string>();
  for (const driver of elements) {
    if (!isAcDriver(driver, coupled) || driver.terminals.length !== 2) continue;
    const [p, n] = driver.terminals.map((t) => t.node) as [string, string];
    const up = walkChain(graph, p, new Set([driver.key]));
    const down = walkChain(graph, n, new Set([driver.key, ...up.steps.map((s) => s.element.key)]));
    if (up.end === down.end) continue;
    const steps = [...reverseSteps(up.steps), { element: driver, from: p, to: n }, ...down.steps];
    const id = steps.map((s) => s.element.key).sort().join('|');
    if (seen.has(id)) continue;
    seen.add(id);
    ports.push({ ends: [up.end, down.end], steps });
  }
  return ports;
}

/** Whether a loop holds an AC driver. */
export function hasAcDriver(steps: readonly Step[], coupled: ReadonlySet<string>): boolean {
  return steps.some((s) => isAcDriver(s.element, coupled));
}
