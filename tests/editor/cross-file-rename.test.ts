/**
 * Rename and references across the files of a netlist, in-process: a model renamed with its
 * `*@ rate` line, a model defined in an include renamed in the include, `.param` names, and the
 * refusals of prepareRename. After a rename the analysis finds what it found before (the same
 * codes, severities and places), since a consistent rename changes no meaning.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../server/src/analysis/analyze';
import { findReferences, prepareRename, rename, type FileSet } from '../../server/src/editor/navigation';
import { applyEdits } from '../../server/src/rules/fixes/text-edits';
import { readCursor } from '../helpers/cursor';

const ROOT = 'file:///w/root.cir';
const LIB = 'file:///w/models.inc';

function analyseAll(texts: Record<string, string>) {
  return analyze({ roots: [ROOT], readText: (uri) => texts[uri] }).files.get(ROOT)!;
}

/** The files of the root's analysis, the root first (as the server's fileSet gives them). */
function filesOf(texts: Record<string, string>): FileSet {
  return [...analyseAll(texts).parsed].map(([uri, netlist]) => ({ uri, netlist }));
}

const summary = (texts: Record<string, string>) => analyseAll(texts).findings.map((f) => `${f.uri} ${f.severity} ${f.code} ${f.span.start}`);

function renameIn(texts: Record<string, string>, offset: number, newName: string): Record<string, string> {
  const edits = rename(filesOf(texts), offset, newName);
  if ('error' in edits) throw new Error(edits.error);
  return Object.fromEntries(Object.entries(texts).map(([uri, text]) => [uri, applyEdits(text, edits.filter((e) => e.uri === uri))]));
}

// A 24 V bridge of our own; its diode model is rated by a directive and lives in an include.
const BRIDGE = (model: string) => `Cross-file fixture (our own)
*@ mains 24V 50Hz
*@ rate ${model} vrrm=40V ifav=1A ifsm=30A tjmax=150C rthja=80
.include "models.inc"
V1 a b SIN(0 34 50)
D1 a p ${model}$0
D2 b p ${model}
D3 n a ${model}
D4 n b ${model}
C1 p n 1000u
R1 p n 100
`;

describe('rename across files', () => {
  it('renames a model in its .model card in the include, on every device, and in its *@ rate line; findings unchanged', () => {
    const { text, offset } = readCursor(BRIDGE('DW'));
    const before = { [ROOT]: text, [LIB]: '.model DW D(IS=2.5n N=1.75 RS=0.04)\n' };
    const after = renameIn(before, offset, 'DBRIDGE');
    expect(after[LIB]).toBe('.model DBRIDGE D(IS=2.5n N=1.75 RS=0.04)\n');
    expect(after[ROOT]).toBe(readCursor(BRIDGE('DBRIDGE')).text);
    // piv-margin fires on the 40 V part (34·1.1 V of crest > 0.8·40 V) before and after: the rating still applies.
    expect(summary(before).some((s) => s.includes('piv-margin'))).toBe(true);
    const renamedOffsets = summary(after);
    expect(renamedOffsets.map((s) => s.split(' ').slice(0, 3).join(' '))).toEqual(summary(before).map((s) => s.split(' ').slice(0, 3).join(' ')));
  });

  it('counts the *@ rate line among the references of the model', () => {
    const { text, offset } = readCursor(BRIDGE('DW'));
    const texts = { [ROOT]: text, [LIB]: '.model DW D(IS=2.5n N=1.75 RS=0.04)\n' };
    const refs = findReferences(filesOf(texts), offset, true);
    expect(refs.filter((r) => r.uri === ROOT).map((r) => text.slice(r.span.start, r.span.end))).toEqual(['DW', 'DW', 'DW', 'DW', 'DW']);
    expect(refs.filter((r) => r.uri === LIB)).toHaveLength(1);
  });

  it('renames a global .param with its uses, and leaves a subcircuit\'s own parameter of that name alone', () => {
    const { text, offset } = readCursor(`params (our own)
.param r0$0=10
R1 a 0 {r0*2}
R2 a 0 r0
.subckt S x params: r0=5
R9 x 0 {r0}
.ends S
X1 a S
`);
    const after = renameIn({ [ROOT]: text }, offset, 'rbase');
    expect(after[ROOT]).toBe(`params (our own)
.param rbase=10
R1 a 0 {rbase*2}
R2 a 0 rbase
.subckt S x params: r0=5
R9 x 0 {r0}
.ends S
X1 a S
`);
  });

  it('refuses to rename ground, and a part known only by its catalog name (no .model in any file)', () => {
    const ground = readCursor('g\nV1 a 0$0 SIN(0 10 50)\n');
    expect(prepareRename(filesOf({ [ROOT]: ground.text }), ground.offset)).toBeUndefined();
    const catalog = readCursor('c\nV1 a 0 SIN(0 10 50)\nD1 a b 1N4007$0\nR1 b 0 1k\n');
    expect(prepareRename(filesOf({ [ROOT]: catalog.text }), catalog.offset)).toBeUndefined();
    const defined = readCursor('m\nV1 a 0 SIN(0 10 50)\nD1 a b DM$0\nR1 b 0 1k\n.model DM D\n');
    expect(prepareRename(filesOf({ [ROOT]: defined.text }), defined.offset)).toEqual({ start: defined.offset - 2, end: defined.offset });
  });
});
