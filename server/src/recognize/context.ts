/**
 * What every topology matcher shares: the node graph, the devices and which of them a rectifier
 * has already claimed (each device belongs to at most one rectifier), couplings and AC ports, and
 * the work budget: every device listed at a node and every step of a chain walked is counted, and
 * once the budget is spent the matchers stop (the caller turns that into a finding).
 */
import { GROUND, nodeGraphOf, type CouplingElement, type FlatCircuit, type FlatElement, type NodeGraph } from '../circuit/index';
import { findDevices, type RectDevice } from './devices';
import { findAcPorts, findLoop, hasAcDriver, walkChain, type AcPort, type Chain, type Step } from './source-trace';

/**
 * Steps of recognition per analysis, by default. A step is one device or terminal looked at; a
 * netlist of 100,000 lines with 50 rectifiers takes well under a million, so this stops only
 * pathological inputs (thousands of devices on one node arranged to defeat the indexes).
 */
export const DEFAULT_RECOGNITION_STEPS = 20_000_000;

export class RecognizeContext {
  readonly graph: NodeGraph;
  readonly devices: RectDevice[];
  /** Inductor key → the K elements that couple it. */
  readonly couplings = new Map<string, CouplingElement[]>();
  readonly ports: AcPort[];
  private readonly claimed = new Set<string>();
  private readonly byCathode = new Map<string, RectDevice[]>();
  private readonly byAnode = new Map<string, RectDevice[]>();
  private readonly stiff = new Map<string, boolean>();
  private stepsLeft: number;

  constructor(readonly flat: FlatCircuit, readonly maxSteps = DEFAULT_RECOGNITION_STEPS) {
    this.stepsLeft = maxSteps;
    this.graph = nodeGraphOf(flat);
    this.devices = findDevices(flat);
    for (const d of this.devices) {
      push(this.byCathode, d.cathode, d);
      push(this.byAnode, d.anode, d);
    }
    for (const element of flat.elements) {
      if (element.kind !== 'coupling') continue;
      for (const inductor of element.inductors) push(this.couplings, inductor, element);
    }
    this.ports = findAcPorts(this.graph, flat.elements, this.coupled);
  }

  /** Keys of the inductors that some K card couples. */
  get coupled(): ReadonlySet<string> {
    return this.couplingKeys ??= new Set(this.couplings.keys());
  }

  private couplingKeys?: ReadonlySet<string>;

  /** Whether the work budget is spent; every matcher stops then. */
  get exhausted(): boolean {
    return this.stepsLeft < 0;
  }

  /** Counts `steps` of work; false once the budget is spent. */
  spend(steps: number): boolean {
    this.stepsLeft -= steps;
    return this.stepsLeft >= 0;
  }

  isFree(device: RectDevice): boolean {
    return !this.claimed.has(device.element.key);
  }

  claim(devices: readonly RectDevice[]): void {
    for (const d of devices) this.claimed.add(d.element.key);
  }

  /** Free devices conducting into a node (their cathode is there). */
  into(node: string): RectDevice[] {
    return this.freeOf(this.byCathode.get(node));
  }

  /** Free devices conducting out of a node (their anode is there). */
  outOf(node: string): RectDevice[] {
    return this.freeOf(this.byAnode.get(node));
  }

  private freeOf(list: readonly RectDevice[] | undefined): RectDevice[] {
    if (!list) return [];
    this.spend(list.length);
    return list.filter((d) => this.isFree(d));
  }

  /** Nodes where some free device's cathode sits. */
  cathodeNodes(): string[] {
    return [...this.byCathode.keys()].filter((node) => this.into(node).length > 0);
  }

  /**
   * A rail held by a DC voltage source is a supply, not a rectifier output: diodes into it form a
   * clamp network. A 0 V source (a current meter) does not hold anything.
   */
  isStiff(node: string): boolean {
    if (node === GROUND) return false;
    let stiff = this.stiff.get(node);
    if (stiff === undefined) {
      this.spend(this.graph.at(node).length);
      stiff = this.graph.at(node).some(({ element: e }) => e.kind === 'vsource' && !(e.sine && e.sine.amplitude !== 0) && e.dc !== 0);
      this.stiff.set(node, stiff);
    }
    return stiff;
  }

  /** Two-terminal elements of a kind directly between two nodes. */
  between(kind: FlatElement['kind'], a: string, b: string): FlatElement[] {
    this.spend(this.graph.at(a).length);
    return this.graph.at(a).flatMap(({ element: e, terminal }) => {
      if (e.kind !== kind || e.terminals.length !== 2) return [];
      return e.terminals[1 - terminal]!.node === b ? [e] : [];
    });
  }

  /** The series loop from `a` to `b` if it holds an AC driver. */
  acLoop(a: string, b: string, exclude: readonly RectDevice[]): Step[] | undefined {
    const loop = findLoop(this.graph, a, b, new Set(exclude.map((d) => d.element.key)));
    this.spend(2 + (loop?.length ?? 0));
    return loop && hasAcDriver(loop, this.coupled) ? loop : undefined;
  }

  /** The series chain from a node (see `walkChain`), counted as work: a step per node it passed. */
  walk(start: string, exclude: ReadonlySet<string>): Chain {
    const chain = walkChain(this.graph, start, exclude);
    this.spend(1 + chain.steps.length);
    return chain;
  }
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}
