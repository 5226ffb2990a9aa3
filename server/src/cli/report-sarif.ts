/** SARIF 2.1.0 output for code-scanning services (OASIS SARIF 2.1.0, errata 01). */
import { codeInfo } from '../rules/code-catalog';
import type { JsonReport } from './report-json';

const LEVEL: Readonly<Record<string, 'error' | 'warning' | 'note'>> = { error: 'error', warning: 'warning', info: 'note', hint: 'note' };

export function toSarif(report: JsonReport, toolVersion: string, toUri: (path: string) => string = (p) => p): object {
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
          artifactLocation: { uri: toUri(file.path) },
          region: { startLine: d.line, startColumn: d.column, endLine: d.endLine, endColumn: d.endColumn },
        },
      }],
    })),
  );
  return {
    $schema: 'https://json.schemastore.org/sarif-2.1.0.json',
    version: '2.1.0',
    runs: [{
      tool: { driver: { name: 'Rectilens', version: toolVersion, informationUri: 'https://example.invalid/rectilens', rules } },
      artifacts: report.files.map((f) => ({ location: { uri: toUri(f.path) } })),
      results,
    }],
  };
}
