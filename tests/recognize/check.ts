/** Test helpers for recognition: build fixture netlists flat or wrapped, recognise, summarise. */
import type { DeviceRole } from '../../server/src/solve/equivalent-circuit';
import { recognizeRectifiers, type Recognition, type Rectifier } from '../../server/src/recognize/index';
import type { FlatCircuit } from '../../server/src/circuit/index';
import { flatten } from '../circuit/check';
import type { TopologyFixture } from './fixtures';

export type Form = 'flat' | 'wrapped';

/** The package instance name used by `wrap`. */
export const PACKAGE = 'XU1';

/**
 * The fixture as a netlist. Wrapped: the rectifier cards go into `.subckt PKG pin0 pin1 …` with
 * their port nodes renamed to the pins, and one X card connects the pins to the outer nodes.
 */
export function build(fixture: Pick<TopologyFixture, 'around' | 'rectifier' | 'ports'>, form: Form): string {
  if (form === 'flat') return `* ${form}\n${fixture.around}\n${fixture.rectifier}\n.end\n`;
  const pin = (node: string) => {
    const i = fixture.ports.findIndex((p) => p.toLowerCase() === node.toLowerCase());
    return i < 0 ? node : `pin${i}`;
  };
  const body = fixture.rectifier.split('\n').map((line) => {
    const words = line.trim().split(/\s+/);
    return words.map((w, i) => (i > 0 && i < words.length - 1 ? pin(w) : w)).join(' ');
  });
  const pins = fixture.ports.map((_, i) => `pin${i}`).join(' ');
  return [`* ${form}`, `.subckt PKG ${pins}`, ...body, '.ends PKG', fixture.around, `${PACKAGE} ${fixture.ports.join(' ')} PKG`, '.end', ''].join('\n');
}

/** Elaborates and recognises a root netlist (with optional extra files). */
export function recognize(text: string, extra: Record<string, string> = {}): { flat: FlatCircuit; result: Recognition } {
  const flat = flatten(text, extra);
  return { flat, result: recognizeRectifiers(flat) };
}

/**
 * A role with its AC-node letter replaced by the node itself (`upper-a` → `upper@ac1`), so the
 * comparison does not depend on which AC node a matcher happened to call `a`.
 */
export function placeRole(role: DeviceRole, acNodes: readonly string[]): string {
  const m = /^(upper|lower|winding)-([abc])$/.exec(role);
  return m ? `${m[1]}@${acNodes['abc'.indexOf(m[2]!)]}` : role;
}

export interface Summary {
  kind: string;
  doubler?: string;
  devices: Record<string, string>;
  ac: string[];
  dcPositive: string;
  dcNegative: string;
}

export function summarize(r: Rectifier): Summary {
  const devices = Object.fromEntries(r.devices.map((d) => [d.name, placeRole(d.role, r.acNodes)]));
  const s: Summary = { kind: r.kind, devices, ac: [...r.acNodes].sort(), dcPositive: r.dcPositive, dcNegative: r.dcNegative };
  if (r.doubler) s.doubler = r.doubler;
  return s;
}

/** The summary a fixture expects, with device names prefixed as the form names them. */
export function expected(fixture: TopologyFixture, form: Form, rename: (name: string) => string = (n) => n): Summary {
  const prefix = form === 'wrapped' ? `${PACKAGE}.` : '';
  const e = fixture.expect;
  const devices = Object.fromEntries(Object.entries(e.devices).map(([name, role]) => [prefix + rename(name), placeRole(role, e.ac)]));
  const s: Summary = { kind: e.kind, devices, ac: [...e.ac].sort(), dcPositive: e.dcPositive, dcNegative: e.dcNegative };
  if (e.doubler) s.doubler = e.doubler;
  return s;
}
