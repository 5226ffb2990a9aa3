/**
 * How a rectifier MOSFET's gate is driven. A controller is any voltage source or X instance at the
 * gate (directly or through one gate resistor) that is not the package holding the MOSFET itself.
 * A gate tied to another AC node of the same rectifier is self-driven (the hybrid bridge).
 */
import type { FlatInstance, NodeGraph } from '../circuit/index';
import type { RectDevice } from './devices';
import type { GateDrive, RectifierDeviceRef } from './rectifier';

/** The gate node and the nodes one resistor away from it. */
function gateReach(graph: NodeGraph, gate: string): string[] {
  const reach = [gate];
  for (const { element, terminal } of graph.at(gate)) {
    if (element.kind === 'resistor' && element.terminals.length === 2) reach.push(element.terminals[1 - terminal]!.node);
  }
  return reach;
}

/** Whether an instance holds the device (is one of its ancestors in the hierarchy). */
function holds(instance: FlatInstance, deviceKey: string): boolean {
  return deviceKey.startsWith(`${instance.key}.`);
}

/** Fills in the gate drive of a MOSFET reference; `acNodes` are the rectifier's AC nodes. */
export function classifyGate(graph: NodeGraph, device: RectDevice, ref: RectifierDeviceRef, acNodes: readonly string[]): void {
  if (device.type !== 'mosfet' || device.gate === undefined) return;
  const reach = gateReach(graph, device.gate);
  const controllers: { name: string; subckt?: string }[] = [];
  for (const node of reach) {
    for (const { element } of graph.at(node)) {
      if (element.kind === 'vsource' && !controllers.some((c) => c.name === element.name)) controllers.push({ name: element.name });
    }
    for (const instance of graph.instancesAt(node)) {
      if (!holds(instance, device.element.key) && !controllers.some((c) => c.name === instance.name)) controllers.push({ name: instance.name, subckt: instance.subckt });
    }
  }
  const own = new Set([device.anode, device.cathode]);
  const selfDriven = reach.some((n) => acNodes.includes(n) && !own.has(n));
  // Self-drive is checked first: the AC node a gate is tied to is often touched by the AC source itself.
  let drive: GateDrive = 'undriven';
  if (selfDriven) drive = 'self-driven';
  else if (controllers.length > 0) drive = 'controller';
  ref.gate = drive;
  if (drive === 'controller') ref.controllers = controllers;
}
