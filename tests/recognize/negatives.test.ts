/** Diodes that are not rectifiers: nothing is claimed, no near miss is reported. */
import { describe, expect, it } from 'vitest';
import { recognize } from './check';
import { NEGATIVES } from './fixtures';

describe.each(NEGATIVES)('$name', ({ netlist }) => {
  it('holds no rectifier', () => {
    const { result } = recognize(`* negative\n${netlist}\n.end\n`);
    expect(result.rectifiers).toEqual([]);
    expect(result.nearMisses).toEqual([]);
    expect(result.diagnostics).toEqual([]);
  });
});
