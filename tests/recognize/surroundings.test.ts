/** Source, filter and load around a rectifier, and what is assumed when they are missing. */
import { describe, expect, it } from 'vitest';
import { build, recognize } from './check';
import { TOPOLOGIES } from './fixtures';

const DIODES = 'D1 ac1 out DM\nD2 ac2 out DM\nD3 0 ac1 DM\nD4 0 ac2 DM\n.model DM D';

function only(text: string) {
  const { result } = recognize(`* surroundings\n${text}\n.end\n`);
  expect(result.rectifiers).toHaveLength(1);
  return { rectifier: result.rectifiers[0]!, diagnostics: result.diagnostics, text: `* surroundings\n${text}\n.end\n` };
}

describe('the AC source', () => {
  it('reads the SIN amplitude and frequency, and the series R and L of the loop (a 0 V meter passes)', () => {
    const { rectifier, diagnostics } = only(`V1 l ac2 SIN(0 325.27 50)\nR1 l m 0.4\nL1 m k 2m\nVSENSE k ac1 0\nC1 out 0 100u\nRL out 0 1k\n${DIODES}`);
    expect(rectifier.surroundings.source).toMatchObject({ freqHz: 50, seriesROhm: 0.4, seriesLH: 2e-3, turnsRatio: 1, assumed: false });
    expect(rectifier.surroundings.source.vrms).toBeCloseTo(325.27 / Math.SQRT2, 9); // RMS of a sine = peak/√2 (definition)
    expect(rectifier.surroundings.source.elements.sort()).toEqual(['L1', 'R1', 'V1', 'VSENSE']);
    expect(diagnostics).toEqual([]);
  });
  it('sums several sources in series as phasors', () => {
    const { rectifier } = only(`V1 ac1 m SIN(0 100 50)\nV2 m ac2 SIN(0 50 50 0 0 90)\nC1 out 0 100u\nRL out 0 1k\n${DIODES}`);
    // Phasor sum of 100∠0° and 50∠90° (derived): |100 + 50j| = √12500.
    expect(rectifier.surroundings.source.vrms).toBeCloseTo(Math.sqrt(100 ** 2 + 50 ** 2) / Math.SQRT2, 9);
  });
  it('lets the mains directive override the amplitude and frequency, keeping its tolerance', () => {
    const { rectifier } = only(`*@ mains 120V 60Hz tol=-10%,+6%\nV1 ac1 ac2 SIN(0 325 50)\nC1 out 0 100u\nRL out 0 1k\n${DIODES}`);
    expect(rectifier.surroundings.source).toMatchObject({ freqHz: 60, mains: { vrms: 120, tolLow: -0.1, tolHigh: 0.06 } });
    expect(rectifier.surroundings.source.vrms).toBeCloseTo(120, 9);
  });
  it('assumes nominal mains when nothing feeds the AC nodes, and says so at the first device', () => {
    const { rectifier, diagnostics, text } = only(`R1 ac1 ac2 1k\nC1 out 0 100u\nRL out 0 1k\n${DIODES}`);
    expect(rectifier.surroundings.source).toMatchObject({ vrms: 230, freqHz: 50, assumed: true });
    expect(diagnostics).toHaveLength(1);
    expect(diagnostics[0]).toMatchObject({ severity: 'info', code: 'assumed-condition' });
    expect(diagnostics[0]!.message).toContain('no AC source traced to ac1/ac2');
    expect(text.slice(diagnostics[0]!.span.start, diagnostics[0]!.span.end)).toBe('D1');
  });
  it('gives each phase of a three-phase bridge its line-to-neutral voltage; a 3-phase directive is line-to-line', () => {
    const fixture = TOPOLOGIES.find((t) => t.expect.kind === 'three-phase-bridge')!;
    const plain = recognize(build(fixture, 'flat')).result.rectifiers[0]!;
    expect(plain.surroundings.source.vrms).toBeCloseTo(325.27 / Math.SQRT2, 9);
    const text = build({ ...fixture, around: `*@ mains 400V 50Hz phases=3\n${fixture.around}` }, 'flat');
    const withMains = recognize(text).result.rectifiers[0]!;
    expect(withMains.surroundings.source.vrms).toBeCloseTo(400 / Math.sqrt(3), 9); // VLN = VLL/√3 for a balanced star (derived)
  });
});

describe('filter capacitors', () => {
  it('takes a series resistor as ESR and merges parallel capacitors', () => {
    const { rectifier } = only(`V1 ac1 ac2 SIN(0 325 50)\nC1 out x1 100u\nR1 x1 0 0.1\nC2 out x2 100u\nR2 x2 0 0.1\nRL out 0 1k\n${DIODES}`);
    const [cap] = rectifier.surroundings.capacitors;
    expect(cap!.names.sort()).toEqual(['C1', 'C2']);
    expect(cap!.cF).toBeCloseTo(200e-6, 15);
    expect(cap!.esrOhm).toBeCloseTo(0.05, 12); // two equal ESRs in parallel: R/2
    expect(cap!.esrResistors.sort()).toEqual(['R1', 'R2']);
  });
  it('lists the doubler capacitors as [lower, upper] and [series, output]', () => {
    const names = (kind: string) => {
      const fixture = TOPOLOGIES.find((t) => t.expect.doubler === kind)!;
      return recognize(build(fixture, 'flat')).result.rectifiers[0]!.surroundings.capacitors.map((c) => c.names.join('+'));
    };
    expect(names('full-wave')).toEqual(['C2', 'C1']);
    expect(names('half-wave')).toEqual(['C1', 'C2']);
  });
});

describe('the load', () => {
  const base = `V1 ac1 ac2 SIN(0 325 50)\nC1 out 0 100u\n${DIODES}`;
  it('merges resistors in parallel', () => {
    expect(only(`${base}\nRA out 0 1k\nRB out 0 1k`).rectifier.surroundings.load).toMatchObject({ kind: 'resistance', ohm: 500 });
  });
  it('reads a DC current source drawing from the output', () => {
    expect(only(`${base}\nI1 out 0 DC 0.5`).rectifier.surroundings.load).toMatchObject({ kind: 'current', a: 0.5 });
  });
  it('falls back to the load directive, with vmin', () => {
    expect(only(`*@ load 45W vmin=200V\n${base}`).rectifier.surroundings.load).toMatchObject({ kind: 'power', w: 45, vminV: 200, fromDirective: true });
  });
  it('assumes no load and says so', () => {
    const { rectifier, diagnostics } = only(base);
    expect(rectifier.surroundings.load.kind).toBe('none');
    expect(diagnostics.map((d) => d.message)).toEqual(['no load found across out/0; assuming no load']);
  });
});
