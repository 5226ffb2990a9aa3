/** Parse throughput on a generated 100,000-line netlist, against a bare line split of the same text. */
import { parseNetlist } from '../grammar/src/index';
import { generateNetlist } from './generate-netlist';
import { median, type BenchFigure } from './measure';

export function runParseBench(lineCount = 100_000): BenchFigure[] {
  const text = generateNetlist(lineCount);
  const megabytes = Buffer.byteLength(text) / 1e6;
  parseNetlist(text); // warm-up: lexer and parser caches
  const parseMs = median(7, () => parseNetlist(text));
  const splitMs = median(21, () => text.split('\n'));
  return [
    { name: 'netlist size', value: megabytes, unit: 'MB', note: `${lineCount} lines` },
    { name: 'parse time (median of 7)', value: parseMs, unit: 'ms' },
    { name: 'parse throughput', value: megabytes / (parseMs / 1000), unit: 'MB/s', target: '≥ 30 MB/s', met: megabytes / (parseMs / 1000) >= 30 },
    { name: 'bare line split (median of 21)', value: splitMs, unit: 'ms' },
    { name: 'parse time / line split', value: parseMs / splitMs, unit: '×', target: '≤ 3×', met: parseMs / splitMs <= 3 },
  ];
}
