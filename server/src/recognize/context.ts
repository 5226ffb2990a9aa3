/**
 * What every topology matcher shares: the node graph, the devices and which of them a rectifier
 * has already claimed (each device belongs to at most one rectifier), couplings and AC ports.
 */
import { GROUND, buildNodeGraph, type CouplingElement, type FlatCircuit, type FlatElement, type NodeGraph } from '../circuit/index';
import { findDevices, type RectDevice } from './devices';
import { findAcPorts, findLoop, hasAcDriver, type AcPort, type Step } from './source-trace';

export class RecognizeContext {
  readonly graph: NodeGraph;
  readonly devices: RectDevice[];
  /** Inductor key → the K elements that couple it. */
  readonly couplings = new Map<string, CouplingElement[]>();
  readonly ports: AcPort[];
  private readonly claimed = new Set<string>();
  private readonly byCathode = new Map<string, RectDevice[]>();
  private readonly byAnode = new Map<string, RectDevice[]>();

  constructor(readonly flat: FlatCircuit) {
    this.graph = buildNodeGraph(flat);
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

  isFree(device: RectDevice): boolean {
    return !this.claimed.has(device.element.key);
  }

  claim(devices: readonly RectDevice[]): void {
    for (const d of devices) this.claimed.add(d.element.key);
  }

  /** Free devices conducting into a node (their cathode is there). */
  into(node: string): RectDevice[] {
    return (this.byCathode.get(node) ?? []).filter((d) => this.isFree(d));
  }

  /** Free devices conducting out of a node (their anode is there). */
  outOf(node: string): RectDevice[] {
    return (this.byAnode.get(node) ?? []).filter((d) => this.isFree(d));
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
    return this.graph.at(node).some(({ element: e }) => e.kind === 'vsource' && !(e.sine && e.sine.amplitude !== 0) && e.dc !== 0);
  }

  /** Two-terminal elements of a kind directly between two nodes. */
  between(kind: FlatElement['kind'], a: string, b: string): FlatElement[] {
    return this.graph.at(a).flatMap(({ element: e, terminal }) => {
      if (e.kind !== kind || e.terminals.length !== 2) return [];
      return e.terminals[1 - terminal]!.node === b ? [e] : [];
    });
  }

  /** The series loop from `a` to `b` if it holds an AC driver. */
  acLoop(a: string, b: string, exclude: readonly RectDevice[]): Step[] | undefined {
    const loop = findLoop(this.graph, a, b, new Set(exclude.map((d) => d.element.key)));
    return loop && hasAcDriver(loop, this.coupled) ? loop : undefined;
  }
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}
