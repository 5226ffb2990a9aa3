import { describe, expect, it } from 'vitest';
import { analyze } from '../../server/src/analysis/analyze';
import type { AnalysisSettings } from '../../server/src/analysis/settings';

// A 12 V bridge of our own invention; its figures sit well inside every default limit.
const TEXT = `Null settings fixture (our own)
*@ mains 12V 50Hz tol=-10%,+10%
*@ rate DG vrrm=100V ifav=1A ifsm=30A tjmax=150C rthja=80
V1 a b SIN(0 17 50)
D1 a p DG
D2 b p DG
D3 n a DG
D4 n b DG
C1 p n 2200u
R1 p n 24
.model DG D(IS=2.5n N=1.75 RS=0.04)
`;

function codes(settings: unknown): string[] {
  const snapshot = analyze({ roots: ['file:///n.cir'], readText: () => TEXT, settings: settings as AnalysisSettings });
  return snapshot.files.get('file:///n.cir')!.findings.map((f) => f.code);
}

describe('settings that are not numbers', () => {
  it('ignores null, NaN and text in the derating settings (an editor sends null for an unset setting)', () => {
    const clean = codes({});
    expect(clean).not.toContain('junction-temp');
    expect(codes({ derating: { junctionTempC: null, reverseVoltage: null, capacitorVoltage: Number.NaN, forwardCurrent: 'x' } })).toEqual(clean);
  });
});
