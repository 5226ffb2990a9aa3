/**
 * A 12 V-class bench supply of our own invention: a 12 V rms winding behind 0.25 Ω into a
 * synchronous MOSFET bridge whose controller draws a quiescent current rising with its supply,
 * 4700 µF, and a load from 5 mA to 1.5 A. All ratings invented, not from any datasheet.
 */
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';

export const BENCH_12V = `12 V bench supply, synchronous bridge with its controller (a scenario of our own invention)
*@ load 5mA..1.5A
*@ ambient 25C..40C
*@ rate NSR vds=40V id=10A rdson=20m tjmax=150C rthja=60 cost=0.30
*@ rate XCTL vmin=8V vmax=60V iq=0.5mA@8V,1.5mA@60V cost=0.80
*@ rate CBULK vrated=35V iripple=3A esr=0.03ohm
VSEC s1 s2 SIN(0 16.97 50)
RWIND s1 ac1 0.25
XCTL out 0 g1 g2 g3 g4 SRCTRL
M1 out g1 ac1 ac1 NSR
M2 out g2 s2 s2 NSR
M3 ac1 g3 0 0 NSR
M4 s2 g4 0 0 NSR
CBULK out 0 4700u
.subckt SRCTRL vcc vss q1 q2 q3 q4
.ends
.model NSR NMOS(rdson=20m)
.end
`;

export function analyseText(text: string): FileAnalysis {
  return analyze({ roots: ['file:///bench.cir'], readText: () => text }).files.get('file:///bench.cir')!;
}

/** The fixture with its load directive replaced. */
export function withLoad(text: string, load: string): string {
  return text.replace(/^\*@ load .*$/m, `*@ load ${load}`);
}
