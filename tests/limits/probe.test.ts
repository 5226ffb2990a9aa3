import { it } from 'vitest';
import { analyze } from '../../server/src/analysis/analyze';
import { inlayHintsOf } from '../../server/src/features/inlay-hints';
import { codeLensesOf } from '../../server/src/features/code-lens';
const base = (v: string, c: string, r: string, extra = '') => `t\n*@ mains 230V 50Hz\n${v}\nD1 ac1 out DM\nD2 ac2 out DM\nD3 0 ac1 DM\nD4 0 ac2 DM\n${c}\n${r}\n${extra}\n.model DM D(IS=2n N=1.8 RS=0.04)\n`;
const cases: Record<string, string> = {
  zeroF: base('V1 ac1 ac2 SIN(0 325 50)', 'C1 out 0 0', 'RL out 0 1k'),
  negR: base('V1 ac1 ac2 SIN(0 325 50)', 'C1 out 0 100u', 'RL out 0 -1k'),
  shortedR: base('V1 ac1 ac2 SIN(0 325 50)', 'C1 out 0 100u', 'RL out 0 1k', 'RS ac1 ac2 0'),
  zeroV: base('V1 ac1 ac2 SIN(0 0 50)', 'C1 out 0 100u', 'RL out 0 1k'),
  zeroVdc: base('V1 ac1 ac2 0', 'C1 out 0 100u', 'RL out 0 1k'),
  noload: base('V1 ac1 ac2 SIN(0 325 50)', 'C1 out 0 100u', ''),
  zeroHz: base('V1 ac1 ac2 SIN(0 325 0)', 'C1 out 0 100u', 'RL out 0 1k').replace('*@ mains 230V 50Hz\n', ''),
  negAmp: base('V1 ac1 ac2 SIN(0 -325 50)', 'C1 out 0 100u', 'RL out 0 1k'),
  big: base('V1 ac1 ac2 SIN(0 325 50)', 'C1 out 0 1e400', 'RL out 0 1k'),
  zeroRload: base('V1 ac1 ac2 SIN(0 325 50)', 'C1 out 0 100u', 'RL out 0 0'),
};
it('probe', () => {
  for (const [name, text] of Object.entries(cases)) {
    const t0 = performance.now();
    const f = analyze({ roots: ['file:///a.cir'], readText: () => text }).files.get('file:///a.cir')!;
    console.log(name, Math.round(performance.now() - t0), 'ms', f.rectifiers.length, f.findings.map((x) => `${x.code}: ${x.message}`).join('\n   '), '\n HINTS', inlayHintsOf(f, 'full').map((h) => h.label), codeLensesOf(f).map((l) => l.title)[0], f.rectifiers[0]?.solution.notes);
  }
});
