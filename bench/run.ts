/** `npm run bench`: every figure of DESIGN.md §10 with its target; writes bench/results/latest.json. */
import { mkdirSync, writeFileSync } from 'node:fs';
import type { BenchFigure } from './measure';
import { runLspBench } from './lsp-bench';
import { runParseBench } from './parse-bench';
import { runSolveBench } from './solve-bench';
import { runRectifierBench } from './rectifier-bench';
import { runCliBench } from './cli-bench';
import { runOverlapBench } from './overlap-bench';

async function main(): Promise<void> {
  // `node dist/bench.js parse 'language server'` runs only the named sections.
  const wanted = process.argv.slice(2);
  const all: [string, () => BenchFigure[] | Promise<BenchFigure[]>][] = [
    ['parse', runParseBench],
    ['steady state', async () => (await runSolveBench()).map(withVerdict)],
    ['one rectifier', runRectifierBench],
    ['three-phase overlap', runOverlapBench],
    ['language server', runLspBench],
    ['command line', runCliBench],
  ];
  const sections: [string, BenchFigure[]][] = [];
  for (const [name, run] of all) if (wanted.length === 0 || wanted.includes(name)) sections.push([name, await run()]);
  for (const [section, figures] of sections) {
    console.log(`\n${section}`);
    for (const f of figures) {
      const verdict = f.met === undefined ? '' : f.met ? '  met' : '  MISSED';
      const target = f.target ? `  target ${f.target}` : '';
      console.log(`  ${f.name.padEnd(40)} ${formatValue(f.value).padStart(10)} ${f.unit.padEnd(5)}${target}${verdict}${f.note ? `  (${f.note})` : ''}`);
    }
  }
  mkdirSync('bench/results', { recursive: true });
  const result = { date: new Date().toISOString(), node: process.version, sections: Object.fromEntries(sections) };
  writeFileSync('bench/results/latest.json', JSON.stringify(result, null, 2) + '\n');
  console.log('\nwritten bench/results/latest.json');
}

/** The solver bench states targets as text; turn them into verdicts. */
function withVerdict(row: BenchFigure): BenchFigure {
  const match = /^([≤≥])\s*([\d.]+)/.exec(row.target ?? '');
  if (!match) return row;
  const limit = Number(match[2]);
  return { ...row, met: match[1] === '≤' ? row.value <= limit : row.value >= limit };
}

function formatValue(value: number): string {
  return Math.abs(value) >= 100 ? value.toFixed(0) : value.toPrecision(3);
}

void main();
