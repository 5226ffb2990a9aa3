/**
 * Parse throughput on a generated 100,000-line netlist, against a bare line split of the same text;
 * the scanner alone; a re-parse after a one-character edit in the middle; the tree's size per card.
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { parseNetlist, type Netlist } from '../grammar/src/index';
import { Scan, Scanner } from '../grammar/src/scanner';
import { generateNetlist } from './generate-netlist';
import { median, type BenchFigure } from './measure';

export function runParseBench(lineCount = 100_000): BenchFigure[] {
  const text = generateNetlist(lineCount);
  const megabytes = Buffer.byteLength(text) / 1e6;
  const tree = parseNetlist(text); // warm-up: parser caches, optimised code
  const parseMs = median(7, () => parseNetlist(text));
  const splitMs = median(21, () => text.split('\n'));
  const scanMs = median(7, () => scanAll(text));
  // One character typed at the end of the line in the middle of the file.
  const middle = text.indexOf('\n', text.length >> 1);
  const edited = text.slice(0, middle) + '0' + text.slice(middle);
  const reparseMs = median(7, () => parseNetlist(edited, { previous: tree }));
  // Moving consumes the previous tree, so each run moves a fresh one (its parse is not timed).
  const moveMs = medianWithSetup(7, () => parseNetlist(text), (previous) => parseNetlist(edited, { previous, consumePrevious: true }));
  const perCard = retainedBytesPerCard(text);
  return [
    { name: 'netlist size', value: megabytes, unit: 'MB', note: `${lineCount} lines, ${tree.cards.length} cards` },
    { name: 'parse time (median of 7)', value: parseMs, unit: 'ms' },
    { name: 'parse throughput', value: megabytes / (parseMs / 1000), unit: 'MB/s', target: '≥ 30 MB/s', met: megabytes / (parseMs / 1000) >= 30 },
    { name: 'bare line split (median of 21)', value: splitMs, unit: 'ms' },
    { name: 'parse time / line split', value: parseMs / splitMs, unit: '×', target: '≤ 10×', met: parseMs / splitMs <= 10 },
    { name: 'scanner alone', value: megabytes / (scanMs / 1000), unit: 'MB/s', note: `${(scanMs / splitMs).toFixed(1)}× a line split` },
    { name: 're-parse, 1-char edit mid-file (copy)', value: reparseMs, unit: 'ms', note: 'the cards after the edit copied, shifted' },
    { name: 're-parse, 1-char edit mid-file (move)', value: moveMs, unit: 'ms', note: 'consumePrevious: the cards after the edit moved in place' },
    { name: 'tree objects per card', value: objectsIn(tree) / tree.cards.length, unit: '', note: 'objects and arrays reachable from the cards, shared empties once' },
    ...(perCard === undefined ? [] : [{ name: 'tree heap per card', value: perCard, unit: 'B', note: 'heap used with the tree kept, after full GCs (counts fragmentation)' }]),
  ];
}

/** Objects (and arrays) reachable from the tree's cards and comments, each counted once. */
function objectsIn(netlist: Netlist): number {
  const seen = new Set<object>();
  const walk = (value: unknown): void => {
    if (value === null || typeof value !== 'object' || seen.has(value)) return;
    seen.add(value);
    for (const field of Object.values(value)) walk(field);
  };
  walk(netlist.cards);
  walk(netlist.comments);
  return seen.size;
}

/** Every token, comment and directive of the text, materialised as the parser receives them. */
function scanAll(text: string): number {
  const scanner = new Scanner(text, 0, text.length);
  let count = 0;
  for (let found = scanner.next(); found !== Scan.End; found = scanner.next()) if (found === Scan.Token && scanner.token()) count++;
  return count;
}

function medianWithSetup<T>(runs: number, setup: () => T, work: (input: T) => unknown): number {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const input = setup();
    const start = process.hrtime.bigint();
    work(input);
    times.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  return times.sort((a, b) => a - b)[Math.floor(runs / 2)]!;
}

/** Heap held by one parse's tree, per card, between two full collections; undefined if GC cannot be asked for. */
function retainedBytesPerCard(text: string): number | undefined {
  let collect: (() => void) | undefined;
  try {
    setFlagsFromString('--expose-gc');
    collect = runInNewContext('gc') as () => void;
  } catch {
    return undefined;
  }
  // The least of three, each between two full collections: what is left is the tree and nothing else.
  let least = Infinity;
  for (let run = 0; run < 3; run++) {
    let kept: Netlist | undefined;
    collect();
    collect();
    const before = process.memoryUsage().heapUsed;
    kept = parseNetlist(text);
    collect();
    collect();
    least = Math.min(least, (process.memoryUsage().heapUsed - before) / kept.cards.length);
    kept = undefined;
  }
  return least;
}
