import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseNetlist, type Netlist } from '../../grammar/src/index';
import { netlistText } from '../fuzz/netlist-arbitrary';

// Re-parsing with the previous parse must give exactly what a parse from scratch gives.
function reparse(previous: Netlist, text: string): Netlist {
  return parseNetlist(text, { previous });
}

function expectSameAsFresh(previousText: string, text: string): void {
  const fresh = parseNetlist(text);
  expect(reparse(parseNetlist(previousText), text)).toEqual(fresh);
}

const BASE = `Reparse fixture (our own)
*@ mains 230V 50Hz
.param r0=50
V1 a b SIN(0 325 50) ; source
.subckt BR x y p n
D1 x p DX
D2 y p DX
.ends BR
R1 p 0 {r0}
+ tc=0
C1 p 0 100u
.model DX D(IS=1n
+ N=1.8)
.end
`;

describe('re-parsing after an edit', () => {
  const edits: [string, (t: string) => string][] = [
    ['a value in the middle', (t) => t.replace('100u', '220u')],
    ['a new line', (t) => t.replace('C1 p 0 100u\n', 'C1 p 0 100u\nR9 p 0 1k\n')],
    ['a deleted line', (t) => t.replace('R1 p 0 {r0}\n+ tc=0\n', '')],
    ['a new continuation line', (t) => t.replace('C1 p 0 100u\n', 'C1 p 0 100u\n+ ic=0\n')],
    ['a continuation turned into a card', (t) => t.replace('+ N=1.8)', 'N=1.8)')],
    ['a broken card', (t) => t.replace('D2 y p DX', 'D2 y p DX )')],
    ['an unclosed subcircuit', (t) => t.replace('.ends BR\n', '')],
    ['a directive', (t) => t.replace('230V', '120V')],
    ['the title line', (t) => t.replace('Reparse fixture', 'R1 a b 1 fixture')],
    ['the .end removed', (t) => t.replace('.end\n', '')],
    ['text after .end', (t) => t + 'R7 a 0 1\n'],
    ['everything', () => 'x\n'],
    ['CRLF line ends', (t) => t.replace(/\n/g, '\r\n')],
  ];
  it.each(edits)('%s gives the same tree and diagnostics as a fresh parse', (_name, edit) => {
    expectSameAsFresh(BASE, edit(BASE));
    expectSameAsFresh(edit(BASE), BASE);
  });

  it('keeps unchanged cards of a long file without re-parsing them (same objects before the edit)', () => {
    const long = BASE.replace('.end\n', '') + Array.from({ length: 200 }, (_, i) => `R${i + 10} n${i} 0 1k`).join('\n') + '\n';
    const previous = parseNetlist(long);
    const next = reparse(previous, long.replace('R150 n140', 'R150 n141'));
    expect(next.cards[3]).toBe(previous.cards[3]);
    expect(next).toEqual(parseNetlist(long.replace('R150 n140', 'R150 n141')));
  });

  it('equals a fresh parse after any chain of random edits to generated netlists and the examples (fast-check)', () => {
    const examples = readdirSync(join(__dirname, '../../examples')).map((f) => readFileSync(join(__dirname, '../../examples', f), 'utf8'));
    const source = fc.oneof(netlistText, fc.constantFrom(...examples, BASE));
    const piece = fc.oneof(
      fc.constantFrom('\n', '\r\n', '+', '+ ', '*', '*@ ', ' ', '.ends', '.end\n', 'R1 a b 1', '{', '(', ')', '\n+ x=1', 'D9 a b DX\n', ';'),
      fc.string({ maxLength: 6 }),
    );
    const edit = fc.record({ at: fc.nat(), cut: fc.nat({ max: 12 }), insert: piece });
    fc.assert(
      fc.property(source, fc.array(edit, { minLength: 1, maxLength: 6 }), (text, steps) => {
        let current = text;
        let previous = parseNetlist(current);
        for (const { at, cut, insert } of steps) {
          const start = at % (current.length + 1);
          current = current.slice(0, start) + insert + current.slice(Math.min(current.length, start + cut));
          const incremental = reparse(previous, current);
          expect(incremental).toEqual(parseNetlist(current));
          previous = incremental;
        }
      }),
      { seed: 20261201, numRuns: 300, endOnFailure: true },
    );
  });
});
