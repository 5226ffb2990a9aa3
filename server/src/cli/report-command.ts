/** `rectilens report <file> [--html out.html]`: the annotated netlist and tables, or one HTML page. */
import { parseArgs, UsageError } from './args';
import type { CommandIo } from './command-io';
import { describeError } from './netlist-files';
import { analyseSingleNetlist } from './single-netlist';
import { TOOL_VERSION } from './tool-version';
import { renderHtmlReport } from '../report/report-html';
import { renderAnnotatedText } from '../report/report-text-annotated';
import { reviewCsv, reviewRowsOf } from '../report/review-table';

export const REPORT_USAGE = 'rectilens report <file> [--html out.html] [--parts-table out.csv] [--config FILE] [--parts FILE]…';

export const REPORT_HELP = `${REPORT_USAGE}

Writes the netlist annotated with its figures and the tables of every rectifier to standard
output, or one self-contained HTML page with --html.

  --html FILE         write the HTML report to FILE
  --parts-table FILE  write the design-review record to FILE as CSV: one row per rectifier part,
                      each stress at its worst corner, its rating, the share used, the limit,
                      where each comes from, and the verdict
  --config FILE   the project configuration, instead of the nearest rectilens.json
  --parts FILE    a parts file beside those the configuration names (repeatable)
`;

/** Runs the report; exit 0 when written, 2 on a usage error or an unreadable or unwritable file. */
export function runReport(argv: readonly string[], io: CommandIo): number {
  const args = parseArgs(argv, { html: {}, 'parts-table': {}, config: {}, parts: { repeatable: true }, help: { boolean: true, short: 'h' } });
  if (args.flags.get('help')) {
    io.stdout(REPORT_HELP);
    return 0;
  }
  const htmlPath = args.flags.get('html') as string | undefined;
  if (htmlPath !== undefined && htmlPath.trim() === '') throw new UsageError(`--html needs a file name\nusage: ${REPORT_USAGE}`);
  const file = analyseSingleNetlist(args.positional, 'report', REPORT_USAGE, io, { config: args.flags.get('config') as string | undefined, parts: args.lists.get('parts') });
  if (!file) return 2;
  const displayPath = args.positional[0]!;
  const tablePath = args.flags.get('parts-table') as string | undefined;
  if (tablePath !== undefined) {
    if (!io.writeFile) throw new Error('this command line cannot write files');
    try {
      io.writeFile(tablePath, reviewCsv([{ path: displayPath, rows: reviewRowsOf(file) }]));
    } catch (error) {
      io.stderr(`rectilens: cannot write ${tablePath}: ${describeError(error)}\n`);
      return 2;
    }
    if (htmlPath === undefined) return 0;
  }
  if (htmlPath === undefined) {
    io.stdout(renderAnnotatedText(file, displayPath));
    return 0;
  }
  const page = renderHtmlReport([{ file, displayPath }], { generator: `Rectilens ${TOOL_VERSION}` });
  if (!io.writeFile) throw new Error('this command line cannot write files');
  try {
    io.writeFile(htmlPath, page);
  } catch (error) {
    io.stderr(`rectilens: cannot write ${htmlPath}: ${describeError(error)}\n`);
    return 2;
  }
  const n = file.rectifiers.length;
  io.stdout(`wrote ${htmlPath}: ${n} rectifier${n === 1 ? '' : 's'}, ${file.findings.length} finding${file.findings.length === 1 ? '' : 's'}\n`);
  return 0;
}
