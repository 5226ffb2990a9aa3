/**
 * Fixture netlists of our own invention for the rule tests: a 230 V 50 Hz capacitor-input
 * bridge with its parts' ratings written in `*@ rate` lines, and an active bridge on a 6 V
 * winding. Expected findings are caret annotations placed under the card they belong to.
 */

export interface BridgeOptions {
  /** The rate line for the diode model DR (the keys after the name). */
  diode?: string;
  /** The rate line for the capacitor CB. */
  cap?: string;
  /** Series resistance between the source and the bridge, Ω as written. */
  rs?: string;
  load?: string;
  capValue?: string;
  /** Extra directive lines at the top. */
  head?: string;
  /** Annotation lines placed under a card, by card name (D1…D4, CB, VAC). */
  notes?: Record<string, string>;
  /** Diode model for D3 and D4 when not DR. */
  lowerModel?: string;
}

/** A 230 V 50 Hz bridge (mains directive: default ±10 % line), model DR, bulk capacitor CB. */
export function bridge(o: BridgeOptions = {}): string {
  const card = (line: string) => {
    const name = line.split(' ')[0]!;
    return o.notes?.[name] ? `${line}\n${o.notes[name]}` : line;
  };
  const lower = o.lowerModel ?? 'DR';
  return [
    '230 V bridge for rule tests',
    '*@ mains 230V 50Hz',
    `*@ load ${o.load ?? '20W'}`,
    ...(o.head ? [o.head] : []),
    ...(o.diode === '' ? [] : [`*@ rate DR ${o.diode ?? 'vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80'}`]),
    ...(o.cap === '' ? [] : [`*@ rate CB ${o.cap ?? 'vrated=450V iripple=1A'}`]),
    card('VAC L N SIN(0 325 50)'),
    `RS L A ${o.rs ?? '10'}`,
    card('D1 A P DR'),
    card('D2 N P DR'),
    card(`D3 0 A ${lower}`),
    card(`D4 0 N ${lower}`),
    card(`CB P 0 ${o.capValue ?? '47u'}`),
    '.model DR D(IS=5n N=1.8 RS=0.05)',
    ...(lower !== 'DR' ? [`.model ${lower} D(IS=5n N=1.8 RS=0.05)`] : []),
    '.end',
    '',
  ].join('\n');
}

/** The same annotation under each of the four diodes. */
export function underDiodes(annotation: string): Record<string, string> {
  return { D1: annotation, D2: annotation, D3: annotation, D4: annotation };
}

/** An active bridge on a 6 V rms (8.5 V crest) winding, driven by controller XC. */
export function activeBridge(rate: { fet: string; controller: string }, notes: Record<string, string> = {}): string {
  const card = (line: string) => (notes[line.split(' ')[0]!] ? `${line}\n${notes[line.split(' ')[0]!]}` : line);
  return [
    'active bridge for rule tests',
    `*@ rate XC ${rate.controller}`,
    `*@ rate NM ${rate.fet}`,
    'V1 ac1 ac2 SIN(0 8.5 50)',
    card('XC ac1 ac2 g1 g2 g3 g4 SYNCDRV'),
    card('M1 out g1 ac1 ac1 NM'),
    card('M2 out g2 ac2 ac2 NM'),
    card('M3 ac1 g3 0 0 NM'),
    card('M4 ac2 g4 0 0 NM'),
    'C1 out 0 2200u',
    'RL out 0 24',
    '.subckt SYNCDRV a b g1 g2 g3 g4',
    '.ends SYNCDRV',
    '.model NM NMOS(rdson=0.02)',
    '.end',
    '',
  ].join('\n');
}
