/** Recognition reads terminals, not names or card order: any shuffle and any renaming finds the same rectifier. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { build, expected, recognize, summarize, type Form } from './check';
import { TOPOLOGIES } from './fixtures';

function shuffledFixture(fixture: (typeof TOPOLOGIES)[number], order: number[], aroundOrder: number[], suffixes: string[]) {
  const lines = fixture.rectifier.split('\n');
  const names = new Map<string, string>();
  const renamed = lines.map((line, i) => {
    const [head, ...rest] = line.split(' ');
    const name = `${head!.charAt(0)}${suffixes[i]}`;
    names.set(head!, name);
    return [name, ...rest].join(' ');
  });
  const around = fixture.around.split('\n');
  return {
    text: { ...fixture, rectifier: order.map((i) => renamed[i]).join('\n'), around: aroundOrder.map((i) => around[i]).join('\n') },
    rename: (n: string) => names.get(n) ?? n,
  };
}

describe.each(TOPOLOGIES)('$name', (fixture) => {
  const count = fixture.rectifier.split('\n').length;
  const aroundCount = fixture.around.split('\n').length;
  it.each<Form>(['flat', 'wrapped'])('is found whatever the card order and device names (%s)', (form) => {
    const permutation = (n: number) => fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n });
    const suffixes = fc.uniqueArray(fc.stringMatching(/^[a-z0-9_]{1,6}$/), { minLength: count, maxLength: count });
    fc.assert(
      fc.property(permutation(count), permutation(aroundCount), suffixes, (order, aroundOrder, names) => {
        const { text, rename } = shuffledFixture(fixture, order, aroundOrder, names);
        const { result } = recognize(build(text, form));
        expect(result.rectifiers.map(summarize)).toEqual([expected(fixture, form, rename)]);
      }),
      { numRuns: 25, seed: 20240611 },
    );
  });
});

describe('two independent bridges in one netlist', () => {
  it('finds both, each with its own nodes', () => {
    const bridge = (n: string) => [
      `V${n} line${n} b${n} SIN(0 325.27 50)`, `R${n} line${n} a${n} 1`,
      `DA${n} a${n} p${n} DM`, `DB${n} b${n} p${n} DM`, `DC${n} m${n} a${n} DM`, `DD${n} m${n} b${n} DM`,
      `C${n} p${n} m${n} 47u`, `RL${n} p${n} m${n} 2k`,
    ].join('\n');
    const { result } = recognize(`two supplies\n${bridge('1')}\n${bridge('2')}\n.model DM D\n.end\n`);
    const found = result.rectifiers.map(summarize).sort((x, y) => x.dcPositive.localeCompare(y.dcPositive));
    expect(found).toEqual(['1', '2'].map((n) => ({
      kind: 'diode-bridge', ac: [`a${n}`, `b${n}`], dcPositive: `p${n}`, dcNegative: `m${n}`,
      devices: { [`DA${n}`]: `upper@a${n}`, [`DB${n}`]: `upper@b${n}`, [`DC${n}`]: `lower@a${n}`, [`DD${n}`]: `lower@b${n}` },
    })));
  });
});
