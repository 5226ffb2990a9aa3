/** Generates large synthetic netlists for benchmarks: a repeating mix of every card kind, with bridges. */
export function generateNetlist(lineCount: number, rectifierEvery = 100): string {
  const lines: string[] = ['Generated benchmark netlist (synthetic)', '*@ mains 230V 50Hz tol=-10%,+10%', '*@ ambient 25C..50C'];
  lines.push('.model DGEN D(IS=2.5n N=1.75 RS=0.04)', '*@ rate DGEN vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=100');
  lines.push('.subckt FILTER in out ref rval=1k cval=1n', 'R1 in out {rval}', 'C1 out ref {cval}', '.ends FILTER');
  let block = 0;
  while (lines.length < lineCount) {
    const b = block++;
    if (b % rectifierEvery === 0) {
      lines.push(
        `* rectifier ${b}`,
        `V${b} l${b} n${b} SIN(0 325 50)`,
        `RS${b} l${b} a${b} 1`,
        `D${b}a a${b} p${b} DGEN`,
        `D${b}b n${b} p${b} DGEN`,
        `D${b}c m${b} a${b} DGEN`,
        `D${b}d m${b} n${b} DGEN`,
        `C${b} p${b} m${b} 100u`,
        `RL${b} p${b} m${b} {2*1k}`,
      );
      continue;
    }
    lines.push(
      `* filler block ${b}`,
      `R${b} x${b} y${b} 4.7k ; trailing comment`,
      `C${b} y${b} 0 10n`,
      `L${b} x${b} z${b} 1m`,
      `.param p${b}={${b}*2}`,
      `X${b} x${b} y${b} z${b} FILTER rval={p${b}}`,
      `+ cval=1n`,
    );
  }
  return lines.slice(0, lineCount).join('\n') + '\n';
}
