/**
 * Every example analysed with what it is meant to show: the rectifiers recognised and the key
 * findings present or absent. A new example must be added here (the last test says so).
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { FileAnalysis } from '../../server/src/analysis/analyze';
import { LineIndex } from '../../grammar/src/index';
import { analyseExample, examplePaths } from '../report/fixtures';

interface Expectation {
  kinds: string[];
  /** code → the device or element names whose cards carry it (empty: anywhere in the file). */
  present: Record<string, string[]>;
  absent: string[];
  mains: boolean;
}

const EXPECTED: Record<string, Expectation> = {
  'bench-supply-centre-tap.cir': {
    kinds: ['centre-tap'], present: { 'hazardous-voltage': ['VP'] }, absent: ['piv-margin', 'surge-rating', 'missing-rating', 'cap-voltage'], mains: true,
  },
  'harvester-sync-bridge.cir': {
    kinds: ['active-bridge'], present: { 'controller-undervoltage': ['XSR'] }, absent: ['hazardous-voltage', 'assumed-condition', 'mosfet-vds', 'junction-temp'], mains: false,
  },
  'irrigation-valve-24vac.cir': {
    kinds: ['diode-bridge'], present: { 'hazardous-voltage': ['VMAINS'] }, absent: ['piv-margin', 'surge-rating', 'current-rating', 'cap-voltage', 'cap-ripple'], mains: true,
  },
  'led-driver-230v.cir': {
    kinds: ['diode-bridge'], present: { 'hazardous-voltage': ['VMAINS'] }, absent: ['piv-margin', 'surge-rating', 'cap-voltage', 'harmonic-limit', 'junction-temp'], mains: true,
  },
  'mistakes-demo.cir': {
    kinds: ['diode-bridge'],
    present: { 'reversed-device': ['D3'], 'piv-margin': ['D5', 'D6', 'D7', 'D8'], 'cap-voltage': ['CSMALL'] },
    absent: ['surge-rating'], mains: true,
  },
  'motor-drive-3ph-400v.cir': {
    kinds: ['three-phase-bridge'], present: { 'surge-rating': [], 'harmonic-limit': [] }, absent: ['piv-margin', 'cap-voltage', 'junction-temp'], mains: true,
  },
};

/** The name of the card a finding sits on (its first word). */
function cardNameAt(file: FileAnalysis, offset: number): string {
  const lines = new LineIndex(file.text);
  const line = lines.positionAt(offset).line;
  return file.text.slice(lines.lineStart(line)).split(/\s/)[0]!;
}

describe('examples', () => {
  for (const [name, expected] of Object.entries(EXPECTED)) {
    describe(name, () => {
      const file = analyseExample(name);
      const codes = file.findings.map((f) => f.code);

      it('recognises the rectifiers it is about', () => {
        expect(file.rectifiers.map((r) => r.rectifier.kind)).toEqual(expected.kinds);
        expect(file.rectifiers.every((r) => r.solution.corners.every((c) => c.converged))).toBe(true);
      });

      it('carries the findings it is meant to show, on the right cards', () => {
        for (const [code, cards] of Object.entries(expected.present)) {
          expect(codes, code).toContain(code);
          const on = file.findings.filter((f) => f.code === code).map((f) => cardNameAt(file, f.span.start));
          expect(on, code).toEqual(expect.arrayContaining(cards));
        }
        for (const code of expected.absent) expect(codes, code).not.toContain(code);
      });

      it('says on its title line and in a comment that it is our own scenario, with invented ratings', () => {
        const text = readFileSync(file.uri, 'utf8');
        expect(text.split('\n')[0]).toMatch(/\(a scenario of our own invention\)$/);
        expect(text).toMatch(/^\* .*(invented|not from any datasheet|not taken from any datasheet)/m);
        if (expected.mains) expect(text.replace(/\n\* /g, ' ')).toMatch(/estimates only, not a safety or\s+compliance test; follow local codes and licensed practice/);
      });
    });
  }

  it('mistakes-demo: the reversed bridge is not taken for a rectifier', () => {
    const file = analyseExample('mistakes-demo.cir');
    expect(file.rectifiers.flatMap((r) => r.rectifier.devices.map((d) => d.name))).toEqual(['D5', 'D6', 'D7', 'D8']);
    expect(file.nearMisses.map((n) => n.reversed.name)).toEqual(['D3']);
  });

  it('led-driver: bridge PIV is the crest at high line, less a diode drop (REFERENCES.md §1: bridge PIV = Vm)', () => {
    const vmHighV = 230 * 1.1 * Math.SQRT2;
    const piv = Math.max(...analyseExample('led-driver-230v.cir').rectifiers[0]!.solution.devices.map((d) => d.pivV!.value));
    expect(piv).toBeLessThanOrEqual(vmHighV);
    expect(piv).toBeGreaterThan(vmHighV - 5);
  });

  it('motor drive: six-pulse PIV is √2·VLL at high line (REFERENCES.md §1, D), within the drops', () => {
    const vllPeakV = 400 * 1.1 * Math.SQRT2;
    const piv = Math.max(...analyseExample('motor-drive-3ph-400v.cir').rectifiers[0]!.solution.devices.map((d) => d.pivV!.value));
    expect(piv).toBeLessThanOrEqual(vllPeakV);
    expect(piv).toBeGreaterThan(vllPeakV * 0.97);
  });

  it('every example in examples/ has an expectation here', () => {
    expect(examplePaths().map((p) => basename(p)).sort()).toEqual(Object.keys(EXPECTED).sort());
  });
});
