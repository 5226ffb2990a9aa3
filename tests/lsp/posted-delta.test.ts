/**
 * After an edit the worker posts a rectifier whose solution the main thread already holds without
 * that solution and its device figures (lsp/posted-analysis.ts): restored against the analysis the
 * main thread holds, it must be the very analysis a whole post gives, and a rectifier whose inputs
 * changed must cross whole.
 */
import { serialize } from 'node:v8';
import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { inlayHintsOf } from '../../server/src/editor/inlay-hints';
import { hoverInFile } from '../../server/src/editor/stress-hover';
import { postedBaseOf, postedForm, postedWithBase, restoredForm, type PostedRectifier } from '../../server/src/lsp/posted-analysis';
import type { SolutionCache } from '../../server/src/solve/index';

const URI = 'file:///delta.cir';

/** Two plain bridges of our own invention, the second one's reservoir given by `c2`. */
function twoBridges(c2: string, comment = ''): string {
  return [
    'two bridges',
    '*@ mains 230V 50Hz',
    '.model DX D(IS=2n N=1.8 RS=0.05)',
    '*@ rate DX vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=90',
    ...(comment ? [comment] : []),
    'V1 l1 n1 SIN(0 325 50)', 'RS1 l1 a1 1',
    'D1a a1 p1 DX', 'D1b n1 p1 DX', 'D1c m1 a1 DX', 'D1d m1 n1 DX',
    'C1 p1 m1 100u', 'RL1 p1 m1 2k',
    'V2 l2 n2 SIN(0 325 50)', 'RS2 l2 a2 1',
    'D2a a2 p2 DX', 'D2b n2 p2 DX', 'D2c m2 a2 DX', 'D2d m2 n2 DX',
    `C2 p2 m2 ${c2}`, 'RL2 p2 m2 2k',
    '',
  ].join('\n');
}

function analysed(text: string, cache: SolutionCache, previous?: FileAnalysis, consumePreviousParse = false): FileAnalysis {
  const file = analyze({ roots: [URI], readText: () => text, solutionCache: cache, compactFlat: true, previousParse: (u) => previous?.parsed.get(u), consumePreviousParse }).files.get(URI)!;
  // As the worker posts it: findings without their lazily computed fixes.
  return { ...file, findings: file.findings.map(({ uri, span, severity, code, message, related }) => ({ uri, span, severity, code, message, ...(related ? { related } : {}) })) };
}

/** How a rectifier crossed: as a pointer to the held one moved by the edit, without its solution, or whole. */
const crossed = (r: PostedRectifier) => ('movedFrom' in r ? 'moved' : 'sameSolutionAs' in r ? 'solution' : 'whole');

/** What the main thread holds after the first analysis: a whole post, cloned as it crosses, restored. */
function held(file: FileAnalysis, text: string): FileAnalysis {
  return restoredForm(structuredClone(postedForm(file, text)), { text, parse: () => parseNetlist(text), held: undefined });
}

describe('a posted analysis that points at the one the main thread holds', () => {
  it('leaves out the solutions and figures of unchanged rectifiers and restores to the whole post', () => {
    const cache: SolutionCache = new Map();
    const first = analysed(twoBridges('100u'), cache);
    expect(first.rectifiers).toHaveLength(2);
    const before = held(first, twoBridges('100u'));
    // A comment line above both bridges moves every offset but changes no rectifier's inputs.
    const text = twoBridges('100u', '* a new comment');
    const second = analysed(text, cache, first);
    const posted = postedForm(second, text, first);
    expect(posted.rectifiers.map(crossed)).toEqual(['moved', 'moved']);
    // Not a speed claim: without its solutions the message must be smaller, or nothing was left out.
    expect(serialize(posted).length).toBeLessThan(serialize(postedForm(second, text)).length);

    const restored = restoredForm(posted, { text, parse: () => parseNetlist(text), held: before });
    const whole = held(second, text);
    expect(restored.rectifiers).toEqual(whole.rectifiers);
    expect(restored.text).toBe(text);
    expect(inlayHintsOf(restored, 'full')).toEqual(inlayHintsOf(whole, 'full'));
    expect(codeLensesOf(restored)).toEqual(codeLensesOf(whole));
    const diodes = whole.netlist.cards.filter((c) => /^D/.test(text.slice(c.span.start, c.span.end)));
    expect(diodes.length).toBeGreaterThan(0);
    const hovers = diodes.map((c) => hoverInFile(whole, c.span.start)?.markdown);
    expect(hovers.some((h) => h !== undefined)).toBe(true);
    expect(diodes.map((c) => hoverInFile(restored, c.span.start)?.markdown)).toEqual(hovers);
  });

  it('posts a rectifier whose inputs changed whole, and only that one', () => {
    const cache: SolutionCache = new Map();
    const first = analysed(twoBridges('100u'), cache);
    const before = held(first, twoBridges('100u'));
    const text = twoBridges('47u');
    const second = analysed(text, cache, first);
    const posted = postedForm(second, text, first);
    // The first bridge lies before the edit, so nothing of it moved; the second one's inputs changed.
    expect(posted.rectifiers.map(crossed)).toEqual(['moved', 'whole']);
    const restored = restoredForm(posted, { text, parse: () => parseNetlist(text), held: before });
    expect(restored.rectifiers).toEqual(held(second, text).rectifiers);
    expect(restored.rectifiers[1]!.solution).not.toEqual(before.rectifiers[1]!.solution);
  });

  it('points at the held rectifier after the worker\'s parse moved the previous trees, which share offsets with it', () => {
    const cache: SolutionCache = new Map();
    const first = analysed(twoBridges('100u'), cache);
    const before = held(first, twoBridges('100u'));
    // Kept before the next parse: that parse moves the cards, and the first analysis's offsets with them.
    const base = postedBaseOf(first);
    const text = twoBridges('100u', '* a new comment that moves both bridges');
    const second = analysed(text, cache, first, true);
    const posted = postedForm(second, text, base);
    expect(posted.rectifiers.map(crossed)).toEqual(['moved', 'moved']);
    const restored = restoredForm(posted, { text, parse: () => parseNetlist(text), held: before });
    expect(restored.rectifiers).toEqual(held(second, text).rectifiers);
    expect(inlayHintsOf(restored, 'full')).toEqual(inlayHintsOf(held(second, text), 'full'));
  });

  it('keeps pointing at the held rectifiers edit after edit, as the worker chains its bases', () => {
    const cache: SolutionCache = new Map();
    let text = twoBridges('100u');
    let file = analysed(text, cache);
    let base = postedBaseOf(file);
    let mainThread = held(file, text);
    for (const comment of ['* one comment line', '* one comment line\n* and a second, longer one']) {
      text = twoBridges('100u', comment);
      file = analysed(text, cache, file, true);
      const { posted, next } = postedWithBase(file, text, base);
      // The base the proof moved is the next edit's base: it must hold the moved offsets, or every later edit posts whole.
      expect(posted.rectifiers.map(crossed)).toEqual(['moved', 'moved']);
      mainThread = restoredForm(structuredClone(posted), { text, parse: () => parseNetlist(text), held: mainThread });
      expect(mainThread.rectifiers).toEqual(held(file, text).rectifiers);
      base = next;
    }
  });

  it('posts whole a rectifier that differs in anything but the edit\'s move, even with the same solution', () => {
    const cache: SolutionCache = new Map();
    const first = analysed(twoBridges('100u'), cache);
    const before = held(first, twoBridges('100u'));
    // Renaming the source changes no solver input but changes what the rectifier says.
    const text = twoBridges('100u').replace('V2 l2', 'VB l2');
    const second = analysed(text, cache, first);
    const posted = postedForm(second, text, first);
    expect(posted.rectifiers.map(crossed)).toEqual(['moved', 'solution']);
    expect(restoredForm(posted, { text, parse: () => parseNetlist(text), held: before }).rectifiers).toEqual(held(second, text).rectifiers);
  });

  it('refuses to restore a pointer without the analysis it points into', () => {
    const cache: SolutionCache = new Map();
    const first = analysed(twoBridges('100u'), cache);
    const text = twoBridges('100u', '* moved');
    const posted = postedForm(analysed(text, cache, first), text, first);
    expect(() => restoredForm(posted, { text, parse: () => undefined, held: undefined })).toThrow(/does not hold/);
  });
});
