/** A recognised rectifier with resolved ratings → the solver's equivalent circuit: models, ratings, defaults said. */
import { describe, expect, it } from 'vitest';
import { rateRectifier, toEquivalentCircuit, DEFAULT_RDSON_OHM } from '../../server/src/equivalent/index';
import { createRatingResolver } from '../../server/src/ratings/index';
import { DEFAULT_CONTROLLER_VMIN_V, SPICE_DIODE_DEFAULTS } from '../../server/src/solve/index';
import { build, recognize } from '../recognize/check';
import { TOPOLOGIES } from '../recognize/fixtures';

function convert(text: string) {
  const { flat, result } = recognize(text);
  expect(result.rectifiers).toHaveLength(1);
  const rectifier = result.rectifiers[0]!;
  const { parts } = rateRectifier(rectifier, flat, createRatingResolver({ directives: flat.directives, partsFiles: [] }));
  const { circuit, findings } = toEquivalentCircuit(rectifier, flat.models, parts);
  return { circuit, diagnostics: findings };
}

const BRIDGE = 'V1 ac1 ac2 SIN(0 325.27 50)\nC1 out 0 100u\nRL out 0 1k\nD1 ac1 out DM\nD2 ac2 out DM\nD3 0 ac1 DM\nD4 0 ac2 DM';

describe('diodes', () => {
  it('take IS, N, RS, EG, XTI and TNOM from the model', () => {
    const { circuit, diagnostics } = convert(`* m\n${BRIDGE}\n.model DM D(IS=2n N=1.8 RS=40m EG=0.69 XTI=2 TNOM=25)\n`);
    expect(circuit.devices[0]).toMatchObject({ kind: 'diode', params: { isA: 2e-9, n: 1.8, rsOhm: 0.04, egEv: 0.69, xti: 2, tnomC: 25 } });
    expect(circuit).toMatchObject({ kind: 'diode-bridge', load: { kind: 'resistance', ohm: 1000 }, capacitors: [{ name: 'C1', cF: expect.closeTo(100e-6, 15), esrOhm: 0 }] });
    expect(diagnostics).toEqual([]);
  });
  it('fill what the model leaves out with the SPICE3 defaults', () => {
    const { circuit } = convert(`* m\n${BRIDGE}\n.model DM D(N=2)\n`);
    expect(circuit.devices[0]).toMatchObject({ params: { ...SPICE_DIODE_DEFAULTS, n: 2 } });
  });
  it('without a model use the defaults and say so', () => {
    const { circuit, diagnostics } = convert(`* m\n${BRIDGE}\n`);
    expect(circuit.devices.every((d) => d.kind === 'diode' && d.params.isA === SPICE_DIODE_DEFAULTS.isA)).toBe(true);
    expect(diagnostics.filter((d) => d.code === 'default-model')).toHaveLength(4);
  });
  it('take rthja from a rate directive on the model', () => {
    const { circuit } = convert(`* m\n*@ rate DM vrrm=600V rthja=60\n${BRIDGE}\n.model DM D\n`);
    expect(circuit.devices.map((d) => d.rthjaKPerW)).toEqual([60, 60, 60, 60]);
  });
});

describe('MOSFETs and the controller', () => {
  const active = TOPOLOGIES.find((t) => t.expect.kind === 'active-bridge')!;
  it('take rdson from the model, gate drive from the circuit, vmin from a rate directive on the controller', () => {
    const text = build({ ...active, around: `*@ rate XC1 vmin=7.5V\n${active.around}` }, 'flat');
    const { circuit, diagnostics } = convert(text);
    expect(circuit.devices.map((d) => d.kind === 'mosfet' && [d.rdsOn25Ohm, d.gate, d.rdsOnTempExponent])).toEqual(Array(4).fill([0.02, 'controller', 2.3]));
    expect(circuit.controllerVminV).toBe(7.5);
    expect(diagnostics).toEqual([]);
  });
  it('read vmin rated for the controller subcircuit name, through a package', () => {
    const text = build({ ...active, around: `*@ rate SYNCDRV vmin=8V\n${active.around}` }, 'wrapped');
    expect(convert(text).circuit.controllerVminV).toBe(8);
  });
  it('fall back to a rate directive for rdson, then to the documented defaults, saying so', () => {
    const noRdson = active.around.replace('NMOS(rdson=20m)', 'NMOS');
    const rated = convert(build({ ...active, around: `*@ rate NM rdson=15mohm\n${noRdson}` }, 'flat'));
    expect(rated.circuit.devices.map((d) => d.kind === 'mosfet' && d.rdsOn25Ohm)).toEqual([0.015, 0.015, 0.015, 0.015]);
    const bare = convert(build({ ...active, around: noRdson }, 'flat'));
    expect(bare.circuit.devices.map((d) => d.kind === 'mosfet' && d.rdsOn25Ohm)).toEqual(Array(4).fill(DEFAULT_RDSON_OHM));
    expect(bare.circuit.controllerVminV).toBe(DEFAULT_CONTROLLER_VMIN_V);
    expect(bare.diagnostics.map((d) => d.code).sort()).toEqual(['assumed-condition', 'default-model', 'default-model', 'default-model', 'default-model']);
  });
  it('mark the hybrid bridge MOSFETs self-driven, with no controller vmin', () => {
    const hybrid = TOPOLOGIES.find((t) => t.expect.kind === 'hybrid-bridge')!;
    const { circuit } = convert(build(hybrid, 'wrapped'));
    expect(circuit.devices.map((d) => (d.kind === 'mosfet' ? d.gate : d.kind))).toEqual(['diode', 'diode', 'self-driven', 'self-driven']);
    expect(circuit.controllerVminV).toBeUndefined();
  });
});

describe('doublers and loads', () => {
  it('carry the doubler variant and a power load with vmin', () => {
    const doubler = TOPOLOGIES.find((t) => t.expect.doubler === 'half-wave')!;
    const text = build({ ...doubler, around: `*@ load 2W vmin=30V\n${doubler.around.replace(/RL .*\n/, '')}` }, 'flat');
    const { circuit } = convert(text);
    expect(circuit).toMatchObject({ kind: 'doubler', doubler: 'half-wave', load: { kind: 'power', w: 2, vminV: 30 } });
    expect(circuit.capacitors.map((c) => c.name)).toEqual(['C1', 'C2']);
  });
});
