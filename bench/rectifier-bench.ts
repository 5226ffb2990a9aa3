/**
 * Benchmark: one rectifier's whole analysis (parse, recognise, rate, solve every corner, rules)
 * through `analyze()` with no solution cache, for the same capacitor-input bridge twice: at one
 * line voltage and one load (the six line × ambient corners), and as a universal input with a
 * load range, a bleeder and part spreads (issue 15: seven corners, part vertices). The second may
 * take at most twice the first. Then the solve alone (the rectifier's corners, thermal loop and
 * inrush, no parse or rules), and a multiplied corner plan — every line end of the universal
 * input × both frequencies × both ambients × both load ends, 48 corners — per corner.
 */
import { analyze } from '../server/src/analysis/analyze';
import { solveRectifier } from '../server/src/solve/solve-rectifier';
import type { Corner, EquivalentCircuit } from '../server/src/solve/equivalent-circuit';
import { median, type BenchFigure } from './measure';

const bridge = (directives: string, extra: string) => `bench bridge (scenario of our own)
${directives}
VAC L N SIN(0 325 50)
RS L A 4.7
D1 A P DR
D2 N P DR
D3 0 A DR
D4 0 N DR
C1 P 0 47u
${extra}
*@ rate DR vrrm=600V ifav=1A ifsm=40A tjmax=150C rthja=80
.model DR D(IS=3n N=1.8 RS=0.05)
.end
`;

const SINGLE = bridge('*@ mains 230V 50Hz tol=-10%,+10%\n*@ load 18W vmin=80V', '*@ rate C1 vrated=400V esr=1.2ohm esrlife=1');
const UNIVERSAL = bridge(
  '*@ mains 100V..240V 50Hz,60Hz tol=-10%,+10%\n*@ load 0.3W..18W vmin=80V',
  'RB P 0 470k\n*@ rate C1 vrated=400V esr=1.2ohm tol=-20%,+20% life=-20%\n*@ rate DR vfspread=-0.03V,+0.05V',
);

function analyseOnce(text: string): number {
  return analysed(text).solution.corners.length;
}

function analysed(text: string) {
  const snapshot = analyze({ roots: ['file:///bench.cir'], readText: () => text });
  return snapshot.files.get('file:///bench.cir')!.rectifiers[0]!;
}

/** Line ends (as multiples of the 240 V drawn nominal) × 50/60 Hz × 25/50 °C × full/light load. */
function multipliedPlan(c: EquivalentCircuit): Corner[] {
  const light = c.load.kind === 'power' ? { ...c.load, w: 0.3 } : c.load;
  const plan: Corner[] = [];
  for (const lineScale of [(100 / 240) * 0.9, 100 / 240, (100 / 240) * 1.1, 0.9, 1, 1.1]) {
    for (const freqHz of [50, 60]) {
      for (const [loadLevel, load] of [['full', c.load], ['light', light]] as const) {
        for (const ambientC of [25, 50]) plan.push({ name: `${lineScale.toFixed(3)} ${freqHz} Hz ${loadLevel} ${ambientC} °C`, lineScale, ambientC, freqHz, load, loadLevel });
      }
    }
  }
  return plan;
}

export function runRectifierBench(): BenchFigure[] {
  for (let k = 0; k < 5; k++) { analyseOnce(SINGLE); analyseOnce(UNIVERSAL); } // warm-up
  const singleCorners = analyseOnce(SINGLE);
  const universalCorners = analyseOnce(UNIVERSAL);
  const singleMs = median(21, () => analyseOnce(SINGLE));
  const universalMs = median(21, () => analyseOnce(UNIVERSAL));
  const ratio = universalMs / singleMs;
  const single = analysed(SINGLE);
  const solveMs = median(21, () => solveRectifier(single.circuit, single.solution.corners));
  const plan = multipliedPlan(analysed(UNIVERSAL).circuit);
  solveRectifier(analysed(UNIVERSAL).circuit, plan);
  const planMs = median(7, () => solveRectifier(analysed(UNIVERSAL).circuit, plan));
  const perCorner = planMs / plan.length;
  return [
    { name: `whole analysis, one line and load (${singleCorners} corners)`, value: singleMs, unit: 'ms' },
    { name: `whole analysis, universal input (${universalCorners} corners)`, value: universalMs, unit: 'ms' },
    { name: 'universal input / one line and load', value: ratio, unit: '×', target: '≤ 2×', met: ratio <= 2 },
    { name: `solve alone, one line and load (${single.solution.corners.length} corners, thermal, inrush)`, value: solveMs, unit: 'ms', target: '≤ 5 ms', met: solveMs <= 5 },
    { name: `solve, multiplied plan (${plan.length} corners), per corner`, value: perCorner, unit: 'ms', target: '≤ 0.5 ms', met: perCorner <= 0.5 },
  ];
}
