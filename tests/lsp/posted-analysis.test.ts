/**
 * What the analysis worker posts to the main thread (lsp/posted-analysis.ts) is smaller than the
 * analysis, and the main thread's features answer from it, once restored with its own parse, just
 * as they answer from the whole analysis: hints, lenses, the capacitor hover and the outline.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { serialize } from 'node:v8';
import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { analyze } from '../../server/src/analysis/analyze';
import { capacitorHover } from '../../server/src/editor/capacitor-hover';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { inlayHintsOf } from '../../server/src/editor/inlay-hints';
import { outlineOf } from '../../server/src/editor/outline';
import { mainThreadParse, postedForm, restoredForm, takeMovableTree } from '../../server/src/lsp/posted-analysis';

const URI = 'file:///posted.cir';
const TEXT = readFileSync(join(__dirname, '../../examples/led-driver-230v.cir'), 'utf8');

function analysed(text: string) {
  const file = analyze({ roots: [URI], readText: () => text, compactFlat: true }).files.get(URI)!;
  // As the worker posts it: findings without their lazily computed fixes.
  return { ...file, findings: file.findings.map(({ uri, span, severity, code, message, related }) => ({ uri, span, severity, code, message, ...(related ? { related } : {}) })) };
}

describe('the analysis as the worker posts it', () => {
  it('leaves out the root parse, the waveforms and all of the flat circuit but the filter capacitors', () => {
    const file = analysed(TEXT);
    expect(file.rectifiers.length).toBeGreaterThan(0);
    const posted = postedForm(file, TEXT);
    expect(posted.netlist).toBeUndefined();
    expect(posted.parsed.has(URI)).toBe(false);
    for (const r of posted.rectifiers) {
      expect('solution' in r).toBe(true);
      if ('solution' in r) for (const c of r.solution.corners) expect(c.waveform ?? c.inrushWaveform).toBeUndefined();
    }
    expect(posted.flat.elements.every((e) => e.kind === 'capacitor')).toBe(true);
    // Not a speed claim: the posted message must be a fraction of the analysis, or the change did nothing.
    expect(serialize(posted).length).toBeLessThan(serialize({ ...file, flat: { ...file.flat, models: [...file.flat.models] } }).length / 2);
  });

  it('keeps the root parse when the main thread did not send that text (a parse cut at a limit, or not open)', () => {
    const file = analysed(TEXT);
    expect(postedForm(file, undefined).netlist).toBe(file.netlist);
    expect(postedForm(file, `${TEXT}\n* newer`).netlist).toBe(file.netlist);
  });

  it('restored with the main thread\'s parse, answers hints, lenses, hovers and the outline as the whole analysis does', () => {
    const before = TEXT.replace(/^\*.*$/m, '* an older first comment');
    const file = analysed(TEXT);
    const restored = restoredForm(postedForm(file, TEXT), { text: TEXT, parse: () => mainThreadParse(TEXT, parseNetlist(before)), held: undefined });
    expect(restored.netlist).toEqual(file.netlist);
    expect([...restored.parsed.keys()]).toEqual([...file.parsed.keys()]);
    expect(inlayHintsOf(restored, 'full')).toEqual(inlayHintsOf(file, 'full'));
    expect(codeLensesOf(restored)).toEqual(codeLensesOf(file));
    expect(outlineOf(restored.netlist)).toEqual(outlineOf(file.netlist));
    const caps = file.netlist.cards.filter((c) => c.kind === 'passive' && c.letter === 'C');
    expect(caps.length).toBeGreaterThan(0);
    const hovers = caps.map((c) => capacitorHover(file, c.span));
    expect(hovers.some((h) => h !== undefined)).toBe(true);
    expect(caps.map((c) => capacitorHover(restored, c.span))).toEqual(hovers);
  });

  it('makes the root parse when the tree is first read, once: the diagnostics and hints of an edit go out without it', () => {
    const file = analysed(TEXT);
    let parses = 0;
    const restored = restoredForm(postedForm(file, TEXT), { text: TEXT, parse: () => (parses++, parseNetlist(TEXT)), held: undefined });
    // What the scheduler publishes and the hint request reads: findings, text, rectifiers.
    expect(restored.findings).toEqual(file.findings);
    expect(inlayHintsOf(restored, 'full')).toEqual(inlayHintsOf(file, 'full'));
    expect(codeLensesOf(restored)).toEqual(codeLensesOf(file));
    expect(parses).toBe(0);
    expect(restored.netlist).toEqual(file.netlist);
    expect(restored.parsed.get(URI)).toBe(restored.netlist);
    expect({ ...restored }.netlist).toBe(restored.netlist);
    expect(parses).toBe(1);
    // A parse of another text (the main thread's tree lagging) is not taken: the analysis's own text is parsed.
    const lagging = restoredForm(postedForm(file, TEXT), { text: TEXT, parse: () => parseNetlist(`${TEXT}\n* later`), held: undefined });
    expect(lagging.netlist).toEqual(file.netlist);
  });

  it('hands an unread tree on to the analysis that replaces it: a chain of edits makes one parse, moving the first tree\'s cards', () => {
    const texts = [0, 1, 2, 3].map((k) => TEXT.replace(/^\*.*$/m, `* edit ${k}`));
    const first = parseNetlist(texts[0]!);
    const kept = first.cards.at(-1)!;
    const parses: (string | undefined)[] = [];
    const counted = (text: string, movable: ReturnType<typeof parseNetlist> | undefined) => (parses.push(movable?.text), mainThreadParse(text, movable));
    let replaced = restoredForm(postedForm(analysed(texts[1]!), texts[1]!), { text: texts[1]!, movable: first, parse: counted, held: undefined });
    const unread = [replaced];
    for (const text of texts.slice(2)) {
      replaced = restoredForm(postedForm(analysed(text), text), { text, movable: takeMovableTree(replaced), parse: counted, held: undefined });
      unread.push(replaced);
    }
    expect(parses).toEqual([]);
    const last = replaced.netlist;
    // One parse, from the first tree: its last card moved into the newest tree, the same object.
    expect(parses).toEqual([texts[0]]);
    expect(last.cards.at(-1)).toBe(kept);
    expect(last).toEqual(parseNetlist(texts[3]!));
    // A replaced analysis read late parses its own text afresh and leaves the newest tree alone.
    expect(unread[0]!.netlist).toEqual(parseNetlist(texts[1]!));
    expect(parses).toEqual([texts[0], undefined]);
    expect(last).toEqual(parseNetlist(texts[3]!));
    // A tree once made is what is handed on.
    expect(takeMovableTree(replaced)).toBe(last);
  });
});
