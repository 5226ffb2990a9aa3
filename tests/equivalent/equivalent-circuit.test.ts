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

describe('the body diode of a MOSFET', () => {
  const SYNC = (rate: string) => `* body diode\n*@ rate QX ${rate}\nV1 ac1 ac2 SIN(0 12 50)\nC1 out 0 1000u\nRL out 0 22\n` +
    'M1 out ac1 ac1 ac1 QX\nM2 out ac2 ac2 ac2 QX\nM3 ac1 0 0 0 QX\nM4 ac2 0 0 0 QX\n.model QX NMOS(rdson=20m)\n';
  it('takes IS from the rated vsd at the rated id: V(id) = vsd by the SPICE3 diode law at 25 °C', () => {
    const { circuit } = convert(SYNC('vds=30V id=5A vsd=0.9V'));
    for (const d of circuit.devices) {
      if (d.kind !== 'mosfet') throw new Error('expected MOSFETs');
      // V = N·Vt·ln(1 + I/IS), Vt = kT/q at 298.15 K (Berkeley SPICE3 diode model), evaluated here.
      const vt = (1.380649e-23 * 298.15) / 1.602176634e-19;
      expect(d.body.n * vt * Math.log1p(5 / d.body.isA)).toBeCloseTo(0.9, 9);
      expect(d.body.tnomC).toBe(25);
    }
  });
  it('at 1 A when no id is rated, and the SPICE3 default diode when no vsd is', () => {
    const at1A = convert(SYNC('vds=30V vsd=0.7V')).circuit.devices[0]!;
    const vt = (1.380649e-23 * 298.15) / 1.602176634e-19;
    if (at1A.kind !== 'mosfet') throw new Error('expected a MOSFET');
    expect(vt * Math.log1p(1 / at1A.body.isA)).toBeCloseTo(0.7, 9);
    const bare = convert(SYNC('vds=30V')).circuit.devices[0]!;
    if (bare.kind !== 'mosfet') throw new Error('expected a MOSFET');
    expect(bare.body).toEqual(SPICE_DIODE_DEFAULTS);
  });
});

describe('a bridge of MOSFETs whose channels never turn on (body diodes only)', () => {
  it('loses 2 × the difference in vsd at the crest: two body diodes conduct in series', async () => {
    const { solveRectifier } = await import('../../server/src/solve/index');
    const { bodyDiodeParams } = await import('../../server/src/equivalent/index');
    const { circuit } = await import('../solve/fixtures');
    const peak = (vsdV: number) => {
      const devices = (['upper-a', 'lower-a', 'upper-b', 'lower-b'] as const).map((role, k) => ({
        kind: 'mosfet' as const, name: `M${k + 1}`, role, rdsOn25Ohm: 0.02, rdsOnTempExponent: 2.3, body: bodyDiodeParams(vsdV, 2), gate: 'undriven' as const,
      }));
      const c = circuit('active-bridge', { vrms: 12 / Math.SQRT2 }, devices, [[1000e-6, 0]], { kind: 'resistance', ohm: 220 });
      return solveRectifier(c, [{ name: 't', lineScale: 1, ambientC: 25 }], { waveformPoints: 0 }).corners[0]!.vOutMaxV!;
    };
    // Same N and Vt: the drops differ by exactly 0.5 V at any current (V = N·Vt·ln(1 + I/IS)), two
    // in series; the crest current changes a little with the output, hence 20 mV.
    expect(Math.abs(peak(0.7) - peak(1.2) - 1.0)).toBeLessThan(0.02);
  });
});
