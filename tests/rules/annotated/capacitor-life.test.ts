/**
 * `cap-life` and the hot restart of `surge-rating` as annotated fixtures, on a 230 V 50 Hz bridge of
 * our own invention with an NTC limiter (10 Ω cold, 1 Ω hot) and a bulk capacitor rated 2000 h at
 * 105 °C (tests/rules/cap-life.test.ts and inrush-surge.test.ts check the numbers).
 */
import { describe, expect, it } from 'vitest';
import { expectAnnotated, withoutAnnotations } from './check';

const fixture = `230 V bridge with an NTC and a rated bulk capacitor
*@ mains 230V 50Hz
*@ load 20W
*@ derate life=100000h
*@ rate RNTC hot=1ohm
*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80
*@ rate CB vrated=450V iripple=1A esr=0.5ohm endurance=2000h@105C
VAC L N SIN(0 325 50)
RNTC L A 10
D1 A P DR
*^ error surge-rating: hot restart at the positive crest (RNTC still hot, capacitor empty)
D2 N P DR
*^ error surge-rating: hot restart at the negative crest (RNTC still hot, capacitor empty)
D3 0 A DR
*^ error surge-rating: hot restart at the negative crest
D4 0 N DR
*^ error surge-rating: hot restart at the positive crest
CB P 0 470u
*^ warning cap-life: is below the 100000 h (derate directive)
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;

describe('cap-life', () => {
  it('warns on the capacitor whose life estimate misses the life asked for', () => {
    const [finding] = expectAnnotated(fixture, 'cap-life');
    // L = 2000 h·2^((105 − T)/10) with T a little above the 50 °C ambient (REFERENCES.md §4, C): below 2000·2^5.5 = 90 500 h.
    const lifeH = Number(/life estimate (\d+) h/.exec(finding!.message)![1]);
    expect(lifeH).toBeLessThan(2000 * 2 ** 5.5);
    expect(lifeH).toBeGreaterThan(2000 * 2 ** 5);
  });

  it('is silent when the file asks for no more than the estimate', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('life=100000h', 'life=50000h'), 'cap-life');
  });
});

describe('surge-rating on a hot restart', () => {
  it('trips every diode on the restart; from cold alone it passes', () => {
    expectAnnotated(fixture, 'surge-rating');
    expectAnnotated(withoutAnnotations(fixture).replace('*@ rate RNTC hot=1ohm\n', ''), 'surge-rating');
  });
});
