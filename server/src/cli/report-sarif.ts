/** SARIF 2.1.0 output for code-scanning services (OASIS SARIF 2.1.0, errata 01). */
import { codeInfo } from '../rules/code-catalog';
import type { JsonReport } from './report-json';

const LEVEL: Readonly<Record<string, 'error' | 'warning' | 'note'>> = { error: 'error', warning: 'warning', info: 'note', hint: 'note' };

/** The base the relative artifact URIs resolve against (SARIF 2.1.0 §3.14.14, `originalUriBaseIds`). */
export const SARIF_BASE_ID = 'SRCROOT';

/**
 * `toUri` turns a report path into a URI relative to `baseUri` (the folder the check ran in), so a
 * code-scanning service can place the results in its checkout; related places (the card that
 * includes a file, the inner card of a packaged device) and quick fixes go with each result.
 */
export function toSarif(report: JsonReport, toolVersion: string, toUri: (path: string) => string = (p) => p, baseUri?: string): object {
  const location = (path: string) => ({ uri: toUri(path), ...(baseUri ? { uriBaseId: SARIF_BASE_ID } : {}) });
  const codes = [...new Set(report.files.flatMap((f) => f.diagnostics.map((d) => d.code)))].sort();
  const ruleIndex = new Map(codes.map((code, i) => [code, i]));
  const rules = codes.map((code) => {
    const info = codeInfo(code);
    return {
      id: code,
      name: code.replace(/(^|-)([a-z])/g, (_m, _d, c: string) => c.toUpperCase()),
      shortDescription: { text: info.description },
      fullDescription: { text: `${info.description}.${info.help ? ' ' + info.help : ''}` },
      help: { text: info.help || info.description },
    };
  });
  const results = report.files.flatMap((file) =>
    file.diagnostics.map((d) => ({
      ruleId: d.code,
      ruleIndex: ruleIndex.get(d.code)!,
      level: LEVEL[d.severity] ?? 'note',
      message: { text: d.message },
      locations: [{
        physicalLocation: {
          artifactLocation: location(file.path),
          region: { startLine: d.line, startColumn: d.column, endLine: d.endLine, endColumn: d.endColumn },
        },
      }],
      ...(d.related?.length ? {
        relatedLocations: d.related.map((r, id) => ({
          id, message: { text: r.message ?? '' }, physicalLocation: { artifactLocation: location(r.path), region: { startLine: r.line, startColumn: r.column } },
        })),
      } : {}),
      ...(d.fixes?.length ? {
        fixes: d.fixes.map((fix) => ({
          description: { text: fix.title },
          artifactChanges: [...new Set(fix.edits.map((e) => e.path))].map((path) => ({
            artifactLocation: location(path),
            replacements: fix.edits.filter((e) => e.path === path).map((e) => ({
              deletedRegion: { startLine: e.line, startColumn: e.column, endLine: e.endLine, endColumn: e.endColumn },
              insertedContent: { text: e.newText },
            })),
          })),
        })),
      } : {}),
    })),
  );
  return {
    $schema: 'https://json.schemastore.org/sarif-2.1.0.json',
    version: '2.1.0',
    runs: [{
      tool: { driver: { name: 'Rectilens', version: toolVersion, informationUri: 'https://example.invalid/rectilens', rules } },
      ...(baseUri ? { originalUriBaseIds: { [SARIF_BASE_ID]: { uri: baseUri } } } : {}),
      artifacts: report.files.map((f) => ({ location: location(f.path) })),
      results,
    }],
  };
}
