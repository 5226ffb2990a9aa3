/**
 * A DC choke between a bridge and its filter capacitor is found and carried into the solve; an
 * inductance the solver cannot model (line inductance of a three-phase bridge together with a DC
 * choke: commutation overlap) is a warning naming the figures not checked, never only a note.
 */
import { describe, expect, it } from 'vitest';
import { analyseText, findingsOf } from '../rules/check';

// Our own scenario: a 24 VAC secondary (drawn as its EMF), a bridge, a 47 mH choke into 2200 µF, 24 Ω.
const chokeBridge = (choke: string) => `24 VAC bridge with a DC choke (scenario of our own)
*@ ambient 25C
V1 a b SIN(0 33.9 50)
R1 a a1 0.3
D1 a1 p DM
D2 b p DM
D3 0 a1 DM
D4 0 b DM
${choke}
C1 out 0 2200u
RL out 0 24
.model DM D(IS=5n N=1.8)
.end
`;

describe('DC choke', () => {
  it('an inductor from DC+ to the capacitor is the choke; the filter and the load are read beyond it', () => {
    const r = analyseText(chokeBridge('L1 p out 47m')).rectifiers[0]!;
    expect(r.rectifier.surroundings.choke).toEqual({ names: ['L1'], lH: 0.047, rOhm: 0 });
    expect(r.circuit.choke).toEqual({ names: ['L1'], lH: 0.047, rOhm: 0 });
    expect(r.rectifier.surroundings.capacitors.map((c) => c.names)).toEqual([['C1']]);
    expect(r.circuit.load).toEqual({ kind: 'resistance', ohm: 24 });
    const nominal = r.solution.corners.find((c) => c.name === 'nominal-line nominal')!;
    // Critical inductance R/(3ω) = 25 mH (Millman & Halkias, L-section filter): 47 mH conducts
    // continuously, so the output sits near the full-wave average 2Vm/π less the drops, well
    // below the crest a capacitor-input filter would hold.
    expect(nominal.vOutAvgV!).toBeLessThan((2 * 33.9) / Math.PI);
    expect(nominal.vOutAvgV!).toBeGreaterThan(0.85 * ((2 * 33.9) / Math.PI));
  });
  it('the same choke on the DC− side is found too', () => {
    const text = chokeBridge('L1 0 ret 47m').replace('C1 out 0 2200u\nRL out 0 24', 'C1 p ret 2200u\nRL p ret 24');
    const r = analyseText(text).rectifiers[0]!;
    expect(r.circuit.choke?.lH).toBe(0.047);
    expect(r.circuit.load).toEqual({ kind: 'resistance', ohm: 24 });
  });
});

describe('an inductance the solver cannot model is a finding', () => {
  const drive = `480 V drive with line reactors (scenario of our own)
*@ mains 480V 60Hz phases=3
*@ load 10kW
VA pa 0 SIN(0 391.9 60 0 0 0)
VB pb 0 SIN(0 391.9 60 0 0 -120)
VC pc 0 SIN(0 391.9 60 0 0 120)
LA pa la 1.2m
LB pb lb 1.2m
LC pc lc 1.2m
D1 la dcp DBR
D2 lb dcp DBR
D3 lc dcp DBR
D4 dcn la DBR
D5 dcn lb DBR
D6 dcn lc DBR
CLINK dcp dcn 1000u
.model DBR D(IS=10n N=1.8)
.end
`;
  it('a three-phase bridge with line reactors and a DC choke gets unmodelled-inductance naming what was not checked', () => {
    // The overlap solver takes line reactors alone (tests/solve/three-phase-overlap*.test.ts);
    // with a choke between bridge and capacitor as well the one-path network solves it with L = 0.
    const withChoke = drive.replace('CLINK dcp dcn 1000u', 'LDC dcp dco 5m\nCLINK dco dcn 1000u');
    const f = analyseText(withChoke);
    expect(f.rectifiers[0]!.circuit.choke?.lH).toBe(0.005);
    const found = findingsOf(f, 'unmodelled-inductance');
    expect(found).toHaveLength(1);
    expect(found[0]!.severity).toBe('warning');
    expect(found[0]!.message).toContain('commutation overlap');
    expect(found[0]!.message).toContain('not checked');
  });
  it('line reactors alone are solved with overlap: no unmodelled-inductance', () => {
    expect(findingsOf(analyseText(drive), 'unmodelled-inductance')).toHaveLength(0);
  });
  it('without the reactors there is none', () => {
    const f = analyseText(drive.replace(/^L([ABC]) p([abc]) l([abc]) 1\.2m$/gm, 'R$1 p$2 l$3 0.01'));
    expect(findingsOf(f, 'unmodelled-inductance')).toHaveLength(0);
  });
});
