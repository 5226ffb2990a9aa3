/**
 * Diodes that are not rectifiers: nothing is claimed, no near miss is reported. Where the file has
 * an AC source, the one finding is `no-rectifier` (issue 16: no silent pass; the designer allows it).
 */
import { describe, expect, it } from 'vitest';
import { recognize } from './check';
import { NEGATIVES } from './fixtures';

describe.each(NEGATIVES)('$name', ({ netlist }) => {
  it('holds no rectifier', () => {
    const { result } = recognize(`* negative\n${netlist}\n.end\n`);
    expect(result.rectifiers).toEqual([]);
    expect(result.nearMisses).toEqual([]);
    const acSource = /SIN\(/.test(netlist);
    expect(result.diagnostics.map((d) => d.code)).toEqual(acSource ? ['no-rectifier'] : []);
  });
});
