/**
 * The webviews run no script and load nothing remote: the page the client builds carries a strict
 * content security policy, and the bodies the core renders hold no script and no remote URL.
 */
import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, viewPage } from '../../client/src/view-page';
import { renderComparisonView, renderWaveformView } from '../../server/src/report/view-content';
import { renderHtmlReport } from '../../server/src/report/report-html';
import { analyseText, bridge, DIODE_MODEL } from '../limits/check';
import { unsafeHtmlParts } from './html-safety';

const WEBVIEW_ORIGIN = 'vscode-webview-resource:';

function policyOf(page: string): Map<string, string[]> {
  const content = /<meta http-equiv="Content-Security-Policy" content="([^"]*)">/.exec(page)?.[1];
  if (!content) throw new Error('no CSP meta element');
  return new Map(content.split(';').map((d) => d.trim()).filter(Boolean).map((d) => {
    const [name, ...sources] = d.split(/\s+/);
    return [name!, sources];
  }));
}

describe('view pages', () => {
  const page = viewPage({ title: 'Waveforms <script>x</script>', body: '<p>body</p>' }, WEBVIEW_ORIGIN);

  it('deny everything by default and allow no script source at all', () => {
    const policy = policyOf(page);
    expect(policy.get('default-src')).toEqual(["'none'"]);
    expect(policy.has('script-src')).toBe(false);
    expect([...policy.keys()].sort()).toEqual(['default-src', 'img-src', 'style-src']);
  });

  it('name no host but the webview itself', () => {
    const sources = [...policyOf(page).values()].flat();
    expect(sources.filter((s) => s !== WEBVIEW_ORIGIN && !["'none'", "'unsafe-inline'", 'data:'].includes(s))).toEqual([]);
    expect(contentSecurityPolicy(WEBVIEW_ORIGIN)).not.toMatch(/https?:|\*/);
  });

  it('escape the title', () => {
    expect(page).toContain('Waveforms &lt;script&gt;x&lt;/script&gt;');
    expect(unsafeHtmlParts(page)).toEqual([]);
  });
});

describe('view bodies from the core', () => {
  // A hostile title and names: they must come out as text.
  const text = `<script>alert(1)</script> https://evil.example/x.js\n*@ mains 230V 50Hz\n${bridge(1)}\n${DIODE_MODEL}\n`;
  const file = analyseText(text);

  it('hold no script, no event handler and no remote URL', () => {
    expect(file.rectifiers).toHaveLength(1);
    for (const view of [renderWaveformView(file), renderComparisonView(file)]) expect(unsafeHtmlParts(view.body)).toEqual([]);
  });

  it('the HTML report page has the same strict policy', () => {
    const report = renderHtmlReport([{ file, displayPath: 'root.cir' }], { generator: 'rectilens test' });
    expect(policyOf(report).get('default-src')).toEqual(["'none'"]);
    expect(policyOf(report).has('script-src')).toBe(false);
    expect(unsafeHtmlParts(report)).toEqual([]);
  });
});

describe('the HTML checker itself', () => {
  it.each([
    ['<script>1</script>'], ['<img src="https://evil.example/a.png">'], ['<a href="//evil.example">x</a>'], ['<div onclick="x()">'],
    ['<style>body{background:url(https://evil.example/a.png)}</style>'], ['<style>@import "x.css";</style>'], ['<iframe></iframe>'],
  ])('flags %s', (html) => {
    expect(unsafeHtmlParts(html).length).toBeGreaterThan(0);
  });
  it('lets inert text, the SVG namespace and data: images through', () => {
    expect(unsafeHtmlParts('<p>see https://example.org</p><svg xmlns="http://www.w3.org/2000/svg"></svg><img src="data:image/png;base64,AA">')).toEqual([]);
  });
});
