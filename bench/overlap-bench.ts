/**
 * Benchmark the three-phase diode bridge with line reactors, solved with commutation
 * overlap (server/src/solve/overlap-*.ts): one corner's steady state alone, one corner with its
 * inrush, and the 480 V drive's whole analysis (six corners) through `analyze()`, with the work
 * counts beside them (integration steps and bridge evaluations of one steady state).
 */
import { analyze } from '../server/src/analysis/analyze';
import { solveCorner } from '../server/src/solve/solve-rectifier';
import { overlapSystemOf } from '../server/src/solve/overlap-corner';
import { findOverlapSteadyState } from '../server/src/solve/overlap-shooting';
import { median, type BenchFigure } from './measure';

// Our own drive: 480 V line-to-line, 60 Hz, 1.2 mH per phase, 500 µF, 40 Ω (about 10 kW).
const DRIVE = `480 V drive with line reactors (scenario of our own)
*@ ambient 25C
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
CLINK dcp dcn 500u
RLOAD dcp dcn 40
.model DBR D(IS=10n N=1.8)
.end
`;

function analysed() {
  const snapshot = analyze({ roots: ['file:///drive.cir'], readText: () => DRIVE });
  return snapshot.files.get('file:///drive.cir')!.rectifiers[0]!;
}

export function runOverlapBench(): BenchFigure[] {
  const r = analysed();
  const c = r.circuit;
  const corner = { name: 'bench', lineScale: 1, ambientC: 25 };
  const sys = overlapSystemOf(c, 1, c.devices.map(() => 25), []);
  const ss = sys ? findOverlapSteadyState(sys) : undefined;
  if (!ss) throw new Error('the drive did not reach the overlap engine');
  return [
    { name: 'overlap corner, steady state', value: median(9, () => solveCorner(c, corner, { inrush: false })), unit: 'ms' },
    { name: 'overlap corner with inrush', value: median(9, () => solveCorner(c, corner)), unit: 'ms' },
    { name: 'overlap drive through analyze', value: median(5, analysed), unit: 'ms', note: `${r.solution.corners.length} corners` },
    { name: 'overlap steady state: steps', value: ss.steps, unit: '' },
    { name: 'overlap steady state: bridge evaluations', value: ss.evaluations, unit: '', note: `${ss.fallbacks} nested fallbacks` },
  ];
}
