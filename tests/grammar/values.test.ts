import { describe, expect, it } from 'vitest';
import { readNumber, spiceSpelling } from '../../grammar/src/index';

// Scale factors: Berkeley SPICE3 user's manual, "General structure and conventions"
// (REFERENCES.md §8): T G MEG K MIL M U N P F; M is milli; letters after a number or after a
// scale factor are ignored.
describe('SPICE number reader (Berkeley SPICE3 user\'s manual, scale-suffix table)', () => {
  const table: [string, number][] = [
    ['1T', 1e12], ['1G', 1e9], ['1MEG', 1e6], ['1K', 1e3], ['1MIL', 25.4e-6], ['1M', 1e-3],
    ['1U', 1e-6], ['1N', 1e-9], ['1P', 1e-12], ['1F', 1e-15],
  ];
  it.each(table)('%s = %d', (text, expected) => {
    expect(readNumber(text)!.value).toBeCloseTo(expected, 20);
    expect(readNumber(text.toLowerCase())!.value).toBeCloseTo(expected, 20);
  });

  it('reads M as milli and MEG as mega (the manual\'s trap)', () => {
    expect(readNumber('1M')!.value).toBe(1e-3);
    expect(readNumber('1MEG')!.value).toBe(1e6);
    expect(readNumber('1m')!.value).not.toBe(readNumber('1meg')!.value);
  });

  it('ignores unit letters after a number or a scale factor', () => {
    expect(readNumber('10uF')!.value).toBeCloseTo(10e-6, 18);
    expect(readNumber('4.7kohm')!.value).toBeCloseTo(4700, 9);
    // The manual: 10, 10V, 10Volts and 10Hz are the same number; M, MA, MSec and MMhos the same factor.
    for (const text of ['10', '10V', '10Volts', '10Hz']) expect(readNumber(text)!.value).toBe(10);
    for (const text of ['1M', '1MA', '1MSec', '1MMhos']) expect(readNumber(text)!.value).toBeCloseTo(1e-3, 15);
    // The manual: 1000, 1000.0, 1000Hz, 1e3, 1.0e3, 1kHz and 1k are equal.
    for (const text of ['1000', '1000.0', '1000Hz', '1e3', '1.0e3', '1kHz', '1k']) expect(readNumber(text)!.value).toBeCloseTo(1000, 9);
  });

  it('applies a suffix after an exponent: 1e3k = 1e6', () => {
    expect(readNumber('1e3k')!.value).toBeCloseTo(1e6, 3);
  });

  it('reads "1F" as one femto, not one farad (manual: F = 1e-15)', () => {
    expect(readNumber('1F')!.value).toBe(1e-15);
  });

  it('reads signs, fractions without a leading digit and exponents', () => {
    expect(readNumber('-15')!.value).toBe(-15);
    expect(readNumber('.5u')!.value).toBeCloseTo(0.5e-6, 18);
    expect(readNumber('2.5e-3')!.value).toBeCloseTo(2.5e-3, 15);
  });

  it('warns on RKM codes (IEC 60062) and names the value assumed', () => {
    const reading = readNumber('4k7')!;
    expect(reading.value).toBeCloseTo(4700, 9);
    expect(reading.warning).toMatch(/IEC 60062/);
    expect(reading.warning).toMatch(/4700/);
    expect(readNumber('2R2')!.value).toBeCloseTo(2.2, 12);
    expect(readNumber('1M5')!.value).toBeCloseTo(1.5e6, 3); // RKM: M is mega
  });

  it('returns undefined for text that is not a number', () => {
    expect(readNumber('out')).toBeUndefined();
    expect(readNumber('')).toBeUndefined();
  });

  it('writes values back in an unambiguous SPICE spelling', () => {
    expect(spiceSpelling(4700)).toBe('4.7k');
    expect(spiceSpelling(1.5e6)).toBe('1.5MEG');
    expect(spiceSpelling(100e-6)).toBe('100u');
    expect(readNumber(spiceSpelling(3.3e-9))!.value).toBeCloseTo(3.3e-9, 20);
  });
});

describe('scaled values are exact to the last bit', () => {
  it('reads 100u as the double nearest 1e-4 (decimal scaling, not 100 × 1e-6)', () => {
    expect(readNumber('100u')!.value).toBe(1e-4);
    expect(readNumber('4.7k')!.value).toBe(4700);
    expect(readNumber('2.2e-3MEG')!.value).toBe(2200);
  });
});
