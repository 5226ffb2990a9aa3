import { describe, expect, it } from 'vitest';
import {
  diodeCurrentA, diodeVoltageV, fitDiodeFromTwoPoints, scaleDiodeToTemp, thermalVoltageV,
} from '../../server/src/solve/diode-model';
import { rdsOnOhm } from '../../server/src/solve/mosfet-model';
import { SPICE_DIODE_DEFAULTS } from '../../server/src/solve/equivalent-circuit';

describe('SPICE diode model', () => {
  it('thermal voltage kT/q: 25.865 mV at 300.15 K, 25.693 mV at 298.15 K (REFERENCES §8, SI-exact k and q)', () => {
    expect(thermalVoltageV(27)).toBeCloseTo(0.025865, 6);
    expect(thermalVoltageV(25)).toBeCloseTo(0.025693, 6);
  });

  it('IS = 1e-14, N = 1: VD = 0.65512 V at 1 mA and 0.83379 V at 1 A, 300.15 K (Berkeley SPICE3 manual; REFERENCES §8)', () => {
    const d = scaleDiodeToTemp(SPICE_DIODE_DEFAULTS, 27);
    expect(diodeVoltageV(1e-3, d)).toBeCloseTo(0.65512, 5);
    expect(diodeVoltageV(1, d)).toBeCloseTo(0.83379, 5);
  });

  it('dVF/dT from the SPICE3 temperature law: −1.78 mV/K at 1 mA, −1.18 mV/K at 1 A (derived in REFERENCES §8)', () => {
    const slope = (i: number) => (diodeVoltageV(i, scaleDiodeToTemp(SPICE_DIODE_DEFAULTS, 27.5)) - diodeVoltageV(i, scaleDiodeToTemp(SPICE_DIODE_DEFAULTS, 26.5))) / 1;
    // Derived here: V = Vt·ln(I/IS(T)) ⇒ dV/dT = (V − EG − XTI·Vt)/T at T = TNOM.
    const t = 300.15;
    const vt = thermalVoltageV(27);
    for (const i of [1e-3, 1]) {
      const v = diodeVoltageV(i, scaleDiodeToTemp(SPICE_DIODE_DEFAULTS, 27));
      expect(slope(i)).toBeCloseTo((v - 1.11 - 3 * vt) / t, 6);
    }
    expect(Math.abs(slope(1e-3) * 1e3 + 1.78)).toBeLessThan(0.01); // printed to 3 digits
    expect(Math.abs(slope(1) * 1e3 + 1.18)).toBeLessThan(0.01);
    // Sedra & Smith, Microelectronic Circuits: about −2 mV/°C at constant current (C) — same sign and size.
    expect(slope(1e-3) * 1e3).toBeGreaterThan(-2.5);
    expect(slope(1e-3) * 1e3).toBeLessThan(-1.5);
  });

  it('current from voltage through RS (Lambert W) inverts the explicit voltage law (analytic identity)', () => {
    const d = { isA: 3e-9, nVtV: 0.05, rsOhm: 0.07 };
    for (const i of [1e-9, 1e-3, 0.5, 10, 300]) {
      const v = diodeVoltageV(i, d);
      expect(diodeCurrentA(v, d) / i).toBeCloseTo(1, 9);
    }
    expect(Number.isFinite(diodeCurrentA(1000, d))).toBe(true); // 1 kV forward: no overflow
  });

  it('a diode fitted to two forward points passes through both (0.93 V @ 1 A, 0.78 V @ 0.1 A, our example)', () => {
    const p = fitDiodeFromTwoPoints({ vV: 0.93, iA: 1 }, { vV: 0.78, iA: 0.1 })!;
    const d = scaleDiodeToTemp(p, 25);
    expect(diodeVoltageV(1, d)).toBeCloseTo(0.93, 4);
    expect(diodeVoltageV(0.1, d)).toBeCloseTo(0.78, 4);
    // Derived: N = ΔV/(Vt·ln 10).
    expect(p.n).toBeCloseTo(0.15 / (thermalVoltageV(25) * Math.LN10), 9);
    expect(fitDiodeFromTwoPoints({ vV: 0.7, iA: 1 }, { vV: 0.8, iA: 0.1 })).toBeUndefined();
  });
});

describe('MOSFET on-resistance against temperature', () => {
  it('rdson(100 °C)/rdson(25 °C) in 1.4–1.8 and rdson(125 °C) in 1.6–2.1 (REFERENCES §8 band, Park, Choi & Chung)', () => {
    expect(rdsOnOhm(1, 2.3, 100)).toBeGreaterThan(1.4);
    expect(rdsOnOhm(1, 2.3, 100)).toBeLessThan(1.8);
    expect(rdsOnOhm(1, 2.3, 125)).toBeGreaterThan(1.6);
    expect(rdsOnOhm(1, 2.3, 125)).toBeLessThan(2.1);
    expect(rdsOnOhm(1, 2.3, 25)).toBeCloseTo(1, 12); // rdson25 at 25 °C by definition
  });
});
