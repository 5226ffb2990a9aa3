/**
 * The 480 V drive with line reactors through the whole analysis (parse, recognise, rate, solve at
 * every corner, rules): solved with commutation overlap, so no `unmodelled-inductance` finding,
 * every corner periodic, and the figures those of the circuit with its reactors.
 */
import { describe, expect, it } from 'vitest';
import { analyseText, findingsOf } from '../rules/check';
import { THREE_PHASE_LINE_L_NOTE } from '../../server/src/solve/network';
import { solveCorner } from '../../server/src/solve/solve-rectifier';

// Our own drive: 480 V line-to-line (391.9 V peak line-to-neutral), 60 Hz, 1.2 mH per phase,
// two 1000 µF in series drawn as their 500 µF, a 40 Ω load.
const drive = (reactor: string) => `480 V drive with line reactors (scenario of our own)
*@ ambient 25C
VA pa 0 SIN(0 391.9 60 0 0 0)
VB pb 0 SIN(0 391.9 60 0 0 -120)
VC pc 0 SIN(0 391.9 60 0 0 120)
LA pa la ${reactor}
LB pb lb ${reactor}
LC pc lc ${reactor}
D1 la dcp DBR
D2 lb dcp DBR
D3 lc dcp DBR
D4 dcn la DBR
D5 dcn lb DBR
D6 dcn lc DBR
CLINK dcp dcn 500u
RLOAD dcp dcn 40
.model DBR D(IS=10n N=1.8)
.end
`;

describe('the drive with line reactors through the analysis', () => {
  const f = analyseText(drive('1.2m'));
  const r = f.rectifiers[0]!;
  it('is a three-phase bridge carrying its 1.2 mH, solved with overlap at every corner', () => {
    expect(r.circuit.kind).toBe('three-phase-bridge');
    expect(r.circuit.source.seriesLH).toBeCloseTo(1.2e-3, 9);
    expect(r.solution.notes).not.toContain(THREE_PHASE_LINE_L_NOTE);
    expect(r.solution.corners.length).toBeGreaterThan(0);
    for (const c of r.solution.corners) expect(c.converged, c.name).toBe(true);
  });
  it('has no unmodelled-inductance and no limit-exceeded finding', () => {
    expect(findingsOf(f, 'unmodelled-inductance')).toHaveLength(0);
    expect(findingsOf(f, 'limit-exceeded')).toHaveLength(0);
  });
  it('reports the solver’s figures for the circuit as drawn (the nominal corner re-solved alone agrees to 1e-9)', () => {
    const nominal = r.solution.corners.find((c) => c.lineScale === 1 && c.parts === undefined) ?? r.solution.corners[0]!;
    const again = solveCorner(r.circuit, { name: nominal.name, lineScale: nominal.lineScale, ambientC: nominal.ambientC, ...(nominal.parts ? { parts: nominal.parts } : {}) });
    expect(Math.abs(again.rippleVpp! / nominal.rippleVpp! - 1)).toBeLessThan(1e-9);
    expect(Math.abs(again.inrushPeakA! / nominal.inrushPeakA! - 1)).toBeLessThan(1e-9);
  });
});
