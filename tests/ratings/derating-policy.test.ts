import { describe, expect, it } from 'vitest';
import { DEFAULT_DERATING, describePolicyOrigin, junctionLimitC, resolveDeratingPolicy } from '../../server/src/ratings/index';
import { directivesOf, textAt } from './check';

describe('default derating policy, each with its origin (REFERENCES.md §4)', () => {
  it('diode reverse voltage 80 % — IPC-9592B, from memory', () => {
    expect(DEFAULT_DERATING.vr.value).toBe(0.8);
    expect(DEFAULT_DERATING.vr.origin).toMatchObject({ kind: 'default', basis: 'from-memory', source: expect.stringMatching(/^IPC-9592B \(from memory/) });
  });

  it('diode average current 70 % — common practice, not a published table', () => {
    expect(DEFAULT_DERATING.if.value).toBe(0.7);
    expect(DEFAULT_DERATING.if.origin).toMatchObject({ basis: 'common-practice', source: expect.stringMatching(/common practice.*EEE-INST-002 \(50 %, from memory/) });
  });

  it('surge current at 100 % of IFSM — common practice', () => {
    expect(DEFAULT_DERATING.ifsm.value).toBe(1);
    expect(DEFAULT_DERATING.ifsm.origin).toMatchObject({ basis: 'common-practice' });
  });

  it('junction at most min(125 °C, Tjmax − 20 °C) — IPC-9592B, from memory', () => {
    expect(DEFAULT_DERATING.tj.value).toEqual({ kind: 'below-max', ceilingC: 125, marginC: 20 });
    expect(DEFAULT_DERATING.tj.origin).toMatchObject({ basis: 'from-memory', source: expect.stringMatching(/IPC-9592B.*125 °C or Tjmax − 20 °C/) });
  });

  it('capacitor voltage 80 % — RAC/SRC "Part Derating Parameters", benign, confirmed', () => {
    expect(DEFAULT_DERATING.cap.value).toBe(0.8);
    expect(DEFAULT_DERATING.cap.origin).toMatchObject({ basis: 'confirmed', source: expect.stringMatching(/Part Derating Parameters.*benign/) });
  });

  it('ripple 100 % and MOSFET VDS 80 % — IPC-9592B, from memory; MOSFET ID 80 % — MIL-DTL-917 Table XIX, confirmed', () => {
    expect(DEFAULT_DERATING.ripple).toMatchObject({ value: 1, origin: { basis: 'from-memory' } });
    expect(DEFAULT_DERATING.vds).toMatchObject({ value: 0.8, origin: { basis: 'from-memory', source: expect.stringMatching(/IPC-9592B.*EEE-INST-002 gives 75 %/) } });
    expect(DEFAULT_DERATING.id).toMatchObject({ value: 0.8, origin: { basis: 'confirmed', source: expect.stringMatching(/MIL-DTL-917, Table XIX/) } });
  });

  it('says where each default comes from in words', () => {
    expect(describePolicyOrigin(DEFAULT_DERATING.cap.origin)).toMatch(/^default: Reliability Analysis Center/);
  });
});

describe('resolveDeratingPolicy: directive, then settings, then defaults', () => {
  const text = '*@ derate vr=70% tj=110C\n*@ derate vr=75%\n';
  const directives = directivesOf(text);

  it('takes the directive over settings, the last directive winning', () => {
    const { policy, ignored } = resolveDeratingPolicy(directives, { vr: 0.9, if: 0.6 });
    expect(policy.vr.value).toBe(0.75);
    expect(policy.vr.origin.kind).toBe('directive');
    expect(textAt(text, (policy.vr.origin as { span: { start: number; end: number } }).span)).toBe('vr=75%');
    expect(policy.if).toEqual({ value: 0.6, origin: { kind: 'setting', key: 'if' } });
    expect(policy.cap).toBe(DEFAULT_DERATING.cap);
    expect(policy.tj.value).toEqual({ kind: 'absolute', tjC: 110 });
    expect(ignored).toEqual([]);
  });

  it('returns the defaults untouched with no directive or setting', () => {
    expect(resolveDeratingPolicy(undefined, undefined).policy).toEqual(DEFAULT_DERATING);
  });

  it('ignores settings out of range, saying why', () => {
    const { policy, ignored } = resolveDeratingPolicy([], { cap: 1.5, tj: 900, vds: 0.7 });
    expect(policy.cap).toBe(DEFAULT_DERATING.cap);
    expect(policy.vds.value).toBe(0.7);
    expect(ignored.map((i) => i.key)).toEqual(['cap', 'tj']);
  });
});

describe('junctionLimitC', () => {
  const below = DEFAULT_DERATING.tj.value;
  it('is the lower of 125 °C and Tjmax − 20 °C', () => {
    expect(junctionLimitC(below, 150)).toBe(125);
    expect(junctionLimitC(below, 175)).toBe(125);
    expect(junctionLimitC(below, 125)).toBe(105);
    expect(junctionLimitC(below)).toBe(125);
  });
  it('never lets an absolute limit exceed the part\'s Tjmax', () => {
    expect(junctionLimitC({ kind: 'absolute', tjC: 150 }, 125)).toBe(125);
    expect(junctionLimitC({ kind: 'absolute', tjC: 110 }, 150)).toBe(110);
  });
});
