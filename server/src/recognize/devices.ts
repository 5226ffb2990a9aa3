/**
 * Rectifying devices and their forward direction: anode→cathode for a diode, the body diode for
 * a MOSFET (source→drain for N-channel, drain→source for P-channel). Recognition looks only at
 * these directions and the nodes, never at names.
 */
import type { DiodeElement, FlatCircuit, MosfetElement, Terminal } from '../circuit/index';
import type { DeviceRole } from '../solve/equivalent-circuit';
import type { RectifierDeviceRef } from './rectifier';

export interface RectDevice {
  element: DiodeElement | MosfetElement;
  type: 'diode' | 'mosfet';
  anode: string;
  cathode: string;
  /** The terminals a quick fix swaps to reverse the device. */
  anodeTerminal: Terminal;
  cathodeTerminal: Terminal;
  channel?: 'n' | 'p';
  gate?: string;
}

/** Every diode and MOSFET with its terminals in place and not shorted. */
export function findDevices(flat: FlatCircuit): RectDevice[] {
  const out: RectDevice[] = [];
  for (const element of flat.elements) {
    if (element.kind === 'diode' && element.terminals.length >= 2) {
      const [a, k] = element.terminals as [Terminal, Terminal];
      if (a.node !== k.node) out.push({ element, type: 'diode', anode: a.node, cathode: k.node, anodeTerminal: a, cathodeTerminal: k });
    } else if (element.kind === 'mosfet' && element.terminals.length >= 3) {
      const [d, g, s] = element.terminals as [Terminal, Terminal, Terminal];
      const type = element.model ? flat.models.get(element.model)?.type : undefined;
      const channel = type === 'pmos' ? 'p' : 'n';
      const [anode, cathode] = channel === 'n' ? [s, d] : [d, s];
      if (d.node !== s.node) out.push({ element, type: 'mosfet', anode: anode.node, cathode: cathode.node, anodeTerminal: anode, cathodeTerminal: cathode, channel, gate: g.node });
    }
  }
  return out;
}

/** The device as a rectifier lists it. */
export function deviceRef(device: RectDevice, role: DeviceRole): RectifierDeviceRef {
  const ref: RectifierDeviceRef = {
    name: device.element.name, key: device.element.key, type: device.type, role,
    anode: device.anode, cathode: device.cathode, model: device.element.model, origin: device.element.origin,
  };
  if (device.type === 'mosfet') {
    ref.channel = device.channel;
    ref.gateNode = device.gate;
  }
  return ref;
}
