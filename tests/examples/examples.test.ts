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
  'universal-adapter-90-264v.cir': {
    kinds: ['diode-bridge'], present: { 'cap-voltage': ['CBULK'], 'hazardous-voltage': ['VMAINS'] },
    absent: ['piv-margin', 'surge-rating', 'current-rating', 'junction-temp', 'cap-ripple'], mains: true,
  },
  'ntc-restart-65w.cir': {
    kinds: ['diode-bridge'], present: { 'surge-rating': ['D1', 'D2', 'D3', 'D4'], 'cap-life': ['CBULK'], 'hazardous-voltage': ['VMAINS'] },
    absent: ['piv-margin', 'current-rating', 'cap-voltage', 'cap-ripple', 'junction-temp'], mains: true,
  },
  'drive-480v-line-reactors.cir': {
    kinds: ['three-phase-bridge'], present: { 'cap-voltage': ['CA', 'CB'], 'hazardous-voltage': ['VA', 'VB', 'VC'] },
    absent: ['unmodelled-inductance', 'surge-rating', 'piv-margin', 'cap-ripple', 'junction-temp', 'current-rating'], mains: true,
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

  it('universal adapter: PIV and capacitor voltage at 264 V in standby, hold-up at 90 V 50 Hz with the smallest capacitor', () => {
    const r = analyseExample('universal-adapter-90-264v.cir').rectifiers[0]!;
    const byName = new Map(r.solution.corners.map((c) => [c.name, c]));
    const piv = r.solution.devices[0]!.pivV!;
    // REFERENCES.md §1: bridge PIV = Vm, here the crest of 240 V + 10 %, less the drops.
    expect(byName.get(piv.corner)!.lineVrms).toBeCloseTo(264, 9);
    expect(piv.value).toBeLessThanOrEqual(264 * Math.SQRT2);
    expect(piv.value).toBeGreaterThan(264 * Math.SQRT2 * 0.99);
    expect(r.solution.worst.vOutMaxV!.corner).toBe('high-line hot light-load');
    const hold = byName.get(r.solution.worst.holdUpS!.corner)!;
    expect([hold.lineVrms, hold.freqHz]).toEqual([expect.closeTo(90, 9), 50]);
    expect(hold.parts).toEqual({ capacitance: 'min', esr: 'aged', vf: 'high' });
    // The smallest capacitance: 47 µF × (1 − 20 %) × (1 − 20 %) (tol= and life=).
    expect(r.circuit.capacitors[0]!.cMinF).toBeCloseTo(47e-6 * 0.8 * 0.8, 15);
  });

  it('every example in examples/ has an expectation here', () => {
    expect(examplePaths().map((p) => basename(p)).sort()).toEqual(Object.keys(EXPECTED).sort());
  });
});
