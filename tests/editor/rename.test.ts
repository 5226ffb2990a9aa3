/**
 * Rename, in-process: `prepareRename` and `rename` (editor/navigation.ts) at the `$0` cursor of an
 * analysed fixture; the edits are applied to the text and compared with the expected netlist,
 * written out whole. The fixtures are netlists of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { prepareRename, rename } from '../../server/src/editor/navigation';
import { applyEdits } from '../../server/src/rules/fixes/text-edits';
import { analyseAt, textOf, URI } from './check';

/** The text after renaming the symbol at `$0` to `newName`. */
function renamed(fixture: string, newName: string): string {
  const { file, text, offset } = analyseAt(fixture);
  const edits = rename([file], offset, newName);
  if ('error' in edits) throw new Error(edits.error);
  expect(edits.every((e) => e.uri === URI)).toBe(true);
  return applyEdits(text, edits);
}

describe('rename', () => {
  it('renames a node on every card of its scope, and leaves a same-named node of a subcircuit alone', () => {
    expect(renamed(`t
V1 ac 0 SIN(0 10 50)
D1 ac out$0 DX
C1 out 0 100u
.subckt S out
R9 out 0 1
.ends S
.model DX D
`, 'vbus')).toBe(`t
V1 ac 0 SIN(0 10 50)
D1 ac vbus DX
C1 vbus 0 100u
.subckt S out
R9 out 0 1
.ends S
.model DX D
`);
  });

  it('renames a model at its definition and every use, whatever their case', () => {
    expect(renamed('t\nD1 a b dx\nD2 b c DX\n.model D$0X D(IS=1n)\n', 'DFAST')).toBe('t\nD1 a b DFAST\nD2 b c DFAST\n.model DFAST D(IS=1n)\n');
  });

  it('renames a subcircuit in its header, its `.ends` and its instances', () => {
    expect(renamed('t\n.subckt BR a b\nR1 a b 1\n.ends BR\nX1 p q B$0R\n', 'BRIDGE')).toBe('t\n.subckt BRIDGE a b\nR1 a b 1\n.ends BRIDGE\nX1 p q BRIDGE\n');
  });

  it('prepares the range of the name under the cursor, from anywhere in it', () => {
    const { file, text, offset, second } = analyseAt('t\nR1 a $0long$1name 0 1k\nR2 longname 0 1\n');
    for (const at of [offset, second!]) expect(textOf(text, prepareRename([file], at)!)).toBe('longname');
  });

  it('refuses ground, a place with no name, and a name the netlist cannot hold', () => {
    const ground = analyseAt('t\nR1 a 0$0 1k\n');
    expect(prepareRename([ground.file], ground.offset)).toBeUndefined();
    expect(rename([ground.file], ground.offset, 'earth')).toEqual({ error: 'nothing to rename here' });
    const value = analyseAt('t\nR1 a 0 1$0k\n');
    expect(rename([value.file], value.offset, 'x')).toEqual({ error: 'nothing to rename here' });
    const node = analyseAt('t\nR1 a$0 0 1k\n');
    expect(rename([node.file], node.offset, 'two words')).toEqual({ error: "'two words' is not a valid netlist name" });
  });
});
