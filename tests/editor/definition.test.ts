/**
 * Go to definition and find references, in-process: `findDefinition` and `findReferences`
 * (editor/navigation.ts, on editor/name-index.ts) at the `$0` cursor of an analysed fixture, with
 * the file set the language server passes (lsp/navigation-features.ts). Where a fixture has a
 * `$1`, it marks the place the answer must point at. The fixtures are netlists of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { findDefinition, findReferences, type FileSet } from '../../server/src/editor/navigation';
import { analyseAt, lineOf, textOf, URI } from './check';

/** The definitions found from `$0`, as text and line. */
function definitionsAt(fixture: string, extra?: Record<string, string>) {
  const at = analyseAt(fixture, { extra });
  const found = findDefinition([at.file], at.offset);
  return { ...at, found, shown: found.map((l) => ({ uri: l.uri, text: textOf(at.text, l.span), line: lineOf(at.text, l.span.start) })) };
}

const PACKAGED = `packaged bridge (our own)
.subckt BR4 ac1 ac2 p n
D1 ac1 p DR
D2 ac2 p DR
D3 n ac1 DR
D4 n ac2 DR
.ends BR4
V1 l n SIN(0 17 50)
X1 l n out 0 BR4
C1 out 0 2200u
R1 out 0 24
.model DR D(IS=5n N=1.8 RS=0.05)
`;

describe('go to definition', () => {
  it('from a model use goes to its `.model` card', () => {
    const { found, second } = definitionsAt(PACKAGED.replace('D1 ac1 p DR', 'D1 ac1 p D$0R').replace('.model DR', '.model $1DR'));
    expect(found).toEqual([{ uri: URI, span: { start: second!, end: second! + 2 } }]);
  });

  it('from an X card\'s subcircuit goes to the `.subckt` header, not to `.ends`', () => {
    const { shown } = definitionsAt(PACKAGED.replace('X1 l n out 0 BR4', 'X1 l n out 0 B$0R4'));
    expect(shown).toEqual([{ uri: URI, text: 'BR4', line: 1 }]);
  });

  it('from a node inside a subcircuit goes to its port in the header', () => {
    const { shown } = definitionsAt(PACKAGED.replace('D3 n ac1 DR', 'D3 n a$0c1 DR'));
    expect(shown).toEqual([{ uri: URI, text: 'ac1', line: 1 }]);
  });

  it('from a top-level node goes to its first appearance, not to a same-named port of a subcircuit', () => {
    // `n` is both a port of BR4 (line 1) and a top-level node first written on V1's card (line 7).
    const { shown } = definitionsAt(PACKAGED.replace('X1 l n out', 'X1 l $0n out'));
    expect(shown).toEqual([{ uri: URI, text: 'n', line: 7 }]);
  });

  it('finds nothing on a card name, a value or a comment', () => {
    expect(definitionsAt(PACKAGED.replace('C1 out 0 2200u', 'C$01 out 0 2200u')).found).toEqual([]);
    expect(definitionsAt(PACKAGED.replace('C1 out 0 2200u', 'C1 out 0 22$000u')).found).toEqual([]);
    expect(definitionsAt('t\n* see D$0R\n.model DR D\n').found).toEqual([]);
  });

  it('goes into an included file for a model defined there, given the files the root\'s analysis parsed', () => {
    const lib = 'file:///w/lib.cir';
    const at = analyseAt('t\n.include "lib.cir"\nD1 a b D$0LIB\n', { extra: { [lib]: '.model DLIB D(IS=2n)\n' } });
    // The root alone has no definition of DLIB; with its includes (root first, as lsp/server-state.ts `fileSet` gives them) it has.
    expect(findDefinition([at.file], at.offset)).toEqual([]);
    const files: FileSet = [...at.file.parsed].map(([uri, netlist]) => ({ uri, netlist }));
    expect(files.map((f) => f.uri)).toEqual([URI, lib]);
    expect(findDefinition(files, at.offset)).toEqual([{ uri: lib, span: { start: '.model '.length, end: '.model DLIB'.length } }]);
  });
});

describe('find references', () => {
  it('of a model: every use, and the `.model` card when the declaration is asked for too', () => {
    const at = analyseAt(PACKAGED.replace('.model DR', '.model D$0R'));
    const uses = findReferences([at.file], at.offset, false).map((l) => lineOf(at.text, l.span.start));
    expect(uses).toEqual([2, 3, 4, 5]);
    expect(findReferences([at.file], at.offset, true).map((l) => lineOf(at.text, l.span.start))).toEqual([2, 3, 4, 5, 11]);
  });

  it('of a subcircuit: the X card and the `.ends` name', () => {
    const at = analyseAt(PACKAGED.replace('.subckt BR4', '.subckt B$0R4'));
    expect(findReferences([at.file], at.offset, false).map((l) => lineOf(at.text, l.span.start))).toEqual([6, 8]);
  });

  it('of a node: only in its own scope, names compared without case', () => {
    const at = analyseAt(`t
V1 IN 0 SIN(0 10 50)
R1 in$0 out 1k
.subckt S in x
R2 in x 1
.ends S
`);
    const found = findReferences([at.file], at.offset, true);
    expect(found.map((l) => [lineOf(at.text, l.span.start), textOf(at.text, l.span)])).toEqual([[1, 'IN'], [2, 'in']]);
  });

  it('of ground: everywhere, inside subcircuits too (ground is global)', () => {
    const at = analyseAt('t\nR1 a 0$0 1k\n.subckt S p\nR2 p 0 1\n.ends S\nX1 a S\n');
    expect(findReferences([at.file], at.offset, true).map((l) => lineOf(at.text, l.span.start))).toEqual([1, 3]);
  });
});
