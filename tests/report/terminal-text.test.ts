/**
 * Netlist text written to a terminal (issue 13, item 6): `report`, `check` and `compare` print
 * control characters from the netlist as escapes (`\x1B`), so a netlist cannot recolour, retitle
 * or clear the terminal, or reorder what it shows. The bytes written are checked, in-process.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from './fixtures';

const ESC = '\u001b';
/** What a terminal acts on: C0 controls but tab and line feed, DEL, C1 controls, bidirectional overrides. */
const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/;

/**
 * A bridge of our own with escape sequences in its title, a comment, a directive and an include
 * path, and C1 and bidirectional controls in device and node names (the lexer takes those into a
 * name; ESC it refuses, and its syntax error quotes it).
 */
const HOSTILE = [
  `title ${ESC}]0;pwned\u0007 ${ESC}[2J`,
  '*@ mains 230V 50Hz',
  `* a comment that clears the screen ${ESC}[2J${ESC}[H and rings \u0007`,
  `*@ ${ESC}[31mred`,
  `.include "missing${ESC}[2J.cir"`,
  'V1 a b SIN(0 325 50)',
  'D\u009b1 a p DM',
  'D2 b p DM',
  'D3 0 a DM',
  'D4 0 b DM',
  'C1 p 0 100u',
  'RL p 0 1k',
  'R\u202Eevil p 0 2k',
  `R9 q${ESC}[1m 0 1k`,
  '.model DM D(IS=2n N=1.8 RS=0.04)',
  '',
].join('\n');

function hostileFile(): string {
  const dir = mkdtempSync(join(tmpdir(), 'rectilens-terminal-'));
  const path = join(dir, 'hostile.cir');
  writeFileSync(path, HOSTILE);
  return path;
}

describe('control characters from the netlist never reach the terminal', () => {
  const path = hostileFile();

  it('report: the annotated netlist, tables and findings show them as escapes', () => {
    const result = run(['report', path]);
    expect(result.code).toBe(0);
    expect(CONTROL.test(result.stdout), JSON.stringify(result.stdout.match(CONTROL))).toBe(false);
    expect(result.stdout).toContain('* a comment that clears the screen \\x1B[2J\\x1B[H and rings \\x07');
    expect(result.stdout).toContain('R\\u202Eevil p 0 2k');
    // The device with a control in its name is still annotated with its figures.
    expect(result.stdout).toMatch(/D\\x9B1 a p DM +; PIV \d+ V/);
  });

  it('check: messages that quote the netlist show them as escapes', () => {
    const result = run(['check', path]);
    expect(CONTROL.test(result.stdout), JSON.stringify(result.stdout.match(CONTROL))).toBe(false);
    expect(result.stdout).toContain("missing-include: 'missing\\x1B[2J.cir'");
    expect(result.stdout).toContain("unknown directive '\\x1B[31mred'");
    expect(result.stdout).toContain("unexpected '\\x1B'");
  });

  it('compare: the rectifier label shows them as escapes', () => {
    const result = run(['compare', path]);
    expect(result.code).toBe(0);
    expect(CONTROL.test(result.stdout), JSON.stringify(result.stdout.match(CONTROL))).toBe(false);
    expect(result.stdout).toContain('D\\x9B1');
  });

  it('tabs and line breaks, which terminals show as space, are kept', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-terminal-'));
    const plain = join(dir, 'tabs.cir');
    writeFileSync(plain, 'tabs\nR1\ta\t0\t1k\n');
    expect(run(['report', plain]).stdout).toContain('\nR1\ta\t0\t1k\n');
  });
});
