/**
 * Everything shown to a user from hostile netlists (issue 13, item 6): no message, hover, hint,
 * lens or report text says NaN or Infinity, prints a raw double, carries a control character or
 * cites our own reference notes ("REFERENCES"). Plus the one number formatter and the Markdown
 * escaping of netlist text in hovers. Fixtures are our own.
 */
import { describe, expect, it } from 'vitest';
import { clipText, displayNumber, displayPercent, escapeControlChars } from '../../grammar/src/index';
import type { FileAnalysis } from '../../server/src/analysis/analyze';
import { toJsonReport } from '../../server/src/cli/report-json';
import { toTextReport } from '../../server/src/cli/report-text';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { hoverAt } from '../../server/src/editor/hover';
import { inlayHintsOf } from '../../server/src/editor/inlay-hints';
import { escapeMarkdown, markdownCode } from '../../server/src/presentation/markup';
import { devicesAtCard } from '../../server/src/editor/rectifier-lookup';
import { renderAnnotatedText } from '../../server/src/report/report-text-annotated';
import { stressHover } from '../../server/src/editor/stress-hover';
import { analyseText, bridge, DIODE_MODEL, ROOT } from './check';

const ESC = '\u001b';
const withBridge = (body: string, head = '') => `hostile\n*@ mains 230V 50Hz\n${head}${body}\n${DIODE_MODEL}\n`;

/** Hostile inputs: broken ratings, extreme values, escape sequences, Markdown in names, a foreign encoding. */
const HOSTILE: Record<string, string> = {
  'ifsm pulse of -1 ms': withBridge(bridge(1), '*@ rate DM ifsm=30A@-1ms\n'),
  'ifsm pulse of 0 ms': withBridge(bridge(1), '*@ rate DM ifsm=30A@0ms\n'),
  'ratings of 1e-300': withBridge(bridge(1), '*@ rate DM vrrm=1e-300V ifav=1e-300A ifsm=1e-300A tjmax=150C rthja=1e30\n*@ rate C1 vrated=1e-300V iripple=1e-300A\n'),
  'ratings of 1e300': withBridge(bridge(1), '*@ rate DM vrrm=1e300V ifav=1e300A ifsm=1e300A tjmax=1e300C\n'),
  'extreme parts': withBridge(bridge(1, '1e-30', '1e-30'), '*@ ambient 1e30C\n'),
  'extreme mains': `hostile\n*@ mains 1e300V 1e-300Hz tol=-99.9999%,+1e300%\n${bridge(1)}\n${DIODE_MODEL}\n`,
  'extreme load directive': withBridge(bridge(1, '100u', ''), '*@ load 1e300W vmin=1e300V\n'),
  'mains 0 Hz': `hostile\n*@ mains 230V 0Hz tol=-150%\n${bridge(1)}\n${DIODE_MODEL}\n`,
  'a catalog part with a division by zero': `hostile\n*@ mains 230V 50Hz\n.param z={1/0}\n${bridge(1).replace(/ DM/g, ' 1N4007')}\nRX q 0 {z}\n.model 1N4007 D(IS=2n N=1.8 RS={z})\n`,
  'escape sequences': withBridge(`${bridge(1).replace(/D11/g, `D${ESC}[31m${ESC}]0;pwned\u0007`)}\n* ${ESC}[2J comment\nV9 q${ESC}[1m q${ESC}[1m 5`, `*@ rate D${ESC}[31mX vrrm=1V\n`),
  'bidi and C1 controls': withBridge(`${bridge(1).replace(/p1/g, 'p\u202Eevil\u009b1')}`),
  'Markdown in names': withBridge(bridge(1).replace(/D11/g, 'D*[x]*').replace(/RL1/g, 'R<img_src:x>`|').replace(/C1 /, 'C~~1~~ ')),
  'a 1 MB name': withBridge(`${bridge(1)}\nR${'y'.repeat(1 << 20)} p1 0 1k\nR${'y'.repeat(1 << 20)} p1 0 2k`),
  'bypass and shorts': withBridge(`${bridge(1, '100u', '0')}\nRB a1 p1 1e-300\nV9 q q 5\nRL1 p1 0 1k`, '*@ load -1e300W\n'),
  'UTF-16': Buffer.from(withBridge(bridge(1)), 'utf16le').toString('utf8'),
};

/** Every text a user can be shown for the file: messages, hovers at each card's name, hints, lenses, both text reports. */
function shownTexts(file: FileAnalysis): string[] {
  const shown: string[] = [];
  for (const f of file.findings) shown.push(f.message, ...(f.related ?? []).map((r) => r.message));
  for (const card of file.netlist.cards) {
    const at = 'name' in card && card.name ? card.name.span.start : card.span.start;
    const hover = hoverAt(file.netlist, at, (c) => {
      const hits = devicesAtCard(file, c.span);
      return hits.length ? stressHover(file, hits) : undefined;
    });
    if (hover) shown.push(hover.markdown);
  }
  for (const detail of ['brief', 'full'] as const) for (const h of inlayHintsOf(file, detail)) shown.push(h.label, h.tooltip);
  shown.push(...codeLensesOf(file).map((l) => l.title));
  shown.push(renderAnnotatedText(file, 'hostile.cir'));
  shown.push(toTextReport(toJsonReport({ files: new Map([[ROOT, file]]), unreadable: [] })));
  return shown;
}

/** A number token with more significant digits than a reader can use (a raw double). */
function rawDoubles(text: string): string[] {
  return [...text.matchAll(/\d+(?:\.\d+)?(?:e[+-]?\d+)?/gi)].map((m) => m[0]).filter((token) => {
    const mantissa = token.split(/e/i)[0]!.replace('.', '').replace(/^0+/, '').replace(/0+$/, '');
    return mantissa.length > 7;
  });
}

const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/;

describe('hostile inputs: what is shown is clean', () => {
  for (const [name, text] of Object.entries(HOSTILE)) {
    it(name, () => {
      const shown = shownTexts(analyseText(text));
      expect(shown.length).toBeGreaterThan(0);
      for (const s of shown) {
        expect(s, s.slice(0, 300)).not.toMatch(/\bNaN\b|Infinity/);
        expect(rawDoubles(s), s.slice(0, 300)).toEqual([]);
        expect(CONTROL.test(s), JSON.stringify(s.slice(0, 300))).toBe(false);
        expect(s).not.toContain('REFERENCES');
        // Messages quote netlist text clipped; the report prints the netlist itself, which may be long.
        if (!s.startsWith('== ') && !s.includes('file checked')) expect(s.length, s.slice(0, 100)).toBeLessThan(20_000);
      }
    });
  }

  it('the raw-double detector itself catches what the issue saw', () => {
    expect(rawDoubles('the surge is 3.5661252202237543e+304 % of it')).toEqual(['3.5661252202237543e+304']);
    expect(rawDoubles('279.4213368923354 V')).toEqual(['279.4213368923354']);
    expect(rawDoubles('356909 A, 1000000 V, 0.0000123 F, IEC 61000-3-2:2018')).toEqual([]);
  });
});

describe('the one number formatter (grammar/src/display.ts)', () => {
  it('three significant figures, whole from 1000, an exponent from a million; never NaN or Infinity', () => {
    expect([358.44, 0.14249, 1.0549, 1234.5, 4439.2, 999999, 3.5661252202237543e304, 9.11e-301, -115, 0, -0]
      .map((v) => displayNumber(v))).toEqual(['358', '0.142', '1.05', '1235', '4439', '999999', '3.57e304', '9.11e-301', '-115', '0', '0']);
    expect([Number.NaN, Infinity, -Infinity].map((v) => displayNumber(v))).toEqual(['—', '—', '—']);
  });
  it('percentages: whole, an exponent for huge ratios, a dash for none', () => {
    expect([0.8, 1.5, 48728.4, 4.872845542609085e303, Number.NaN, Infinity].map(displayPercent))
      .toEqual(['80 %', '150 %', '4.87e6 %', '4.87e305 %', '— %', '— %']);
  });
  it('clips quoted text in the middle, keeping both ends, and escapes control characters', () => {
    const clipped = clipText(`start${'x'.repeat(1000)}file.cir`);
    expect(clipped).toHaveLength(60);
    expect(clipped.startsWith('startxx')).toBe(true);
    expect(clipped.endsWith('xxfile.cir')).toBe(true);
    expect(clipText('short')).toBe('short');
    expect(escapeControlChars(`a${ESC}[31mb\u0007c\u202Ed\te`)).toBe('a\\x1B[31mb\\x07c\\u202Ed\te');
  });
});

describe('Markdown escaping of netlist text in hovers', () => {
  it('escapes what Markdown reads as markup inside a line, and nothing a reader would notice', () => {
    expect(escapeMarkdown('D*[x](command:evil)*')).toBe('D\\*\\[x\\](command:evil)\\*');
    expect(escapeMarkdown('R<img src=x>&amp;|~~_')).toBe('R\\<img src=x\\>\\&amp;\\|\\~\\~\\_');
    expect(escapeMarkdown('X1.D3 4.7k')).toBe('X1.D3 4.7k');
  });
  it('makes a code span that no backtick in the text can close', () => {
    expect(markdownCode('a')).toBe('`a`');
    expect(markdownCode('a`b')).toBe('``a`b``');
    expect(markdownCode('`x')).toBe('`` `x ``');
  });
  it('a hover on a hostile name shows it as text: no link, image, HTML or emphasis is made', () => {
    const file = analyseText(HOSTILE['Markdown in names']!);
    const text = file.netlist.text;
    const hoverOf = (name: string) => hoverAt(file.netlist, text.indexOf(`\n${name}`) + 1, (c) => {
      const hits = devicesAtCard(file, c.span);
      return hits.length ? stressHover(file, hits) : undefined;
    })!.markdown;
    const diode = hoverOf('D*[x]*');
    expect(diode).toContain('**D\\*\\[x\\]\\***');
    expect(diode).not.toMatch(/(^|[^\\])\[x/);
    const load = hoverOf('R<img_src:x>`|');
    expect(load).toContain('**R\\<img\\_src:x\\>\\`\\|**');
    expect(load).not.toMatch(/(^|[^\\])<img/);
  });
});
