/**
 * Topology fixtures: scenarios of our own. Each is the rectifier's own cards (`rectifier`) and what
 * sits around it (`around`); `wrap` in check.ts also packs the rectifier cards into a `.subckt`
 * whose pins are `ports`, so every fixture is checked flat and through the hierarchy.
 */
import type { DeviceRole, RectifierKind } from '../../server/src/solve/equivalent-circuit';

export interface TopologyFixture {
  name: string;
  around: string;
  rectifier: string;
  ports: string[];
  expect: {
    kind: RectifierKind;
    doubler?: 'full-wave' | 'half-wave';
    devices: Record<string, DeviceRole>;
    ac: string[];
    dcPositive: string;
    dcNegative: string;
  };
}

const DIODE_MODEL = '.model DM D(IS=2n N=1.8 RS=0.04)';
const FET_MODEL = '.model NM NMOS(rdson=20m)';

export const TOPOLOGIES: TopologyFixture[] = [
  {
    name: 'diode bridge on 230 V mains',
    around: `V1 line ac2 SIN(0 325.27 50)\nR1 line ac1 0.5\nC1 out 0 100u\nRL out 0 1k\n${DIODE_MODEL}`,
    rectifier: 'D1 ac1 out DM\nD2 ac2 out DM\nD3 0 ac1 DM\nD4 0 ac2 DM',
    ports: ['ac1', 'ac2', 'out', '0'],
    expect: { kind: 'diode-bridge', devices: { D1: 'upper-a', D2: 'upper-b', D3: 'lower-a', D4: 'lower-b' }, ac: ['ac1', 'ac2'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'active bridge with a controller instance on the gates',
    around: `V1 ac1 ac2 SIN(0 16.97 50)\nXC1 ac1 ac2 g1 g2 g3 g4 SYNCDRV\nC1 out 0 2200u\nRL out 0 24\n${FET_MODEL}`,
    rectifier: 'M1 out g1 ac1 ac1 NM\nM2 out g2 ac2 ac2 NM\nM3 ac1 g3 0 0 NM\nM4 ac2 g4 0 0 NM',
    ports: ['ac1', 'ac2', 'out', '0', 'g1', 'g2', 'g3', 'g4'],
    expect: { kind: 'active-bridge', devices: { M1: 'upper-a', M2: 'upper-b', M3: 'lower-a', M4: 'lower-b' }, ac: ['ac1', 'ac2'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'hybrid bridge: two diodes up, two self-driven MOSFETs down',
    around: `V1 ac1 ac2 SIN(0 16.97 50)\nC1 out 0 2200u\nRL out 0 24\n${DIODE_MODEL}\n${FET_MODEL}`,
    rectifier: 'D1 ac1 out DM\nD2 ac2 out DM\nM3 ac1 ac2 0 0 NM\nM4 ac2 ac1 0 0 NM',
    ports: ['ac1', 'ac2', 'out', '0'],
    expect: { kind: 'hybrid-bridge', devices: { D1: 'upper-a', D2: 'upper-b', M3: 'lower-a', M4: 'lower-b' }, ac: ['ac1', 'ac2'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'half-wave peak rectifier',
    around: `V1 in 0 SIN(0 17 60)\nC1 out 0 470u\nRL out 0 100\n${DIODE_MODEL}`,
    rectifier: 'D1 in out DM',
    ports: ['in', 'out'],
    expect: { kind: 'half-wave', devices: { D1: 'series' }, ac: ['in', '0'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'centre tap from a transformer with two coupled half-windings',
    around: `V1 line 0 SIN(0 325.27 50)\nLP line 0 1\nLS1 a 0 2.5m\nLS2 0 b 2.5m\nK1 LP LS1 LS2 0.999\nC1 out 0 2200u\nRL out 0 24\n${DIODE_MODEL}`,
    rectifier: 'D1 a out DM\nD2 b out DM',
    ports: ['a', 'b', 'out'],
    expect: { kind: 'centre-tap', devices: { D1: 'winding-a', D2: 'winding-b' }, ac: ['a', 'b'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'centre tap from two sources in series',
    around: `V1 a 0 SIN(0 17 50)\nV2 0 b SIN(0 17 50)\nC1 out 0 1000u\nRL out 0 50\n${DIODE_MODEL}`,
    rectifier: 'D1 a out DM\nD2 b out DM',
    ports: ['a', 'b', 'out'],
    expect: { kind: 'centre-tap', devices: { D1: 'winding-a', D2: 'winding-b' }, ac: ['a', 'b'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'full-wave (symmetrical) voltage doubler',
    around: `V1 ac mid SIN(0 169.7 60)\nC1 out mid 470u\nC2 mid 0 470u\nRL out 0 2k\n${DIODE_MODEL}`,
    rectifier: 'D1 0 ac DM\nD2 ac out DM',
    ports: ['ac', 'out', '0'],
    expect: { kind: 'doubler', doubler: 'full-wave', devices: { D1: 'd1', D2: 'd2' }, ac: ['ac', 'mid'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'half-wave (cascade) voltage doubler',
    around: `V1 in 0 SIN(0 17 50)\nC1 in a 100u\nC2 out 0 100u\nRL out 0 10k\n${DIODE_MODEL}`,
    rectifier: 'D1 0 a DM\nD2 a out DM',
    ports: ['a', 'out', '0'],
    expect: { kind: 'doubler', doubler: 'half-wave', devices: { D1: 'd1', D2: 'd2' }, ac: ['in', '0'], dcPositive: 'out', dcNegative: '0' },
  },
  {
    name: 'three-phase six-pulse bridge from a star of sources',
    around: [
      'VA pa 0 SIN(0 325.27 50 0 0 0)', 'VB pb 0 SIN(0 325.27 50 0 0 -120)', 'VC pc 0 SIN(0 325.27 50 0 0 120)',
      'C1 out neg 470u', 'RL out neg 100', DIODE_MODEL,
    ].join('\n'),
    rectifier: 'D1 pa out DM\nD2 pb out DM\nD3 pc out DM\nD4 neg pa DM\nD5 neg pb DM\nD6 neg pc DM',
    ports: ['pa', 'pb', 'pc', 'out', 'neg'],
    expect: {
      kind: 'three-phase-bridge', devices: { D1: 'upper-a', D2: 'upper-b', D3: 'upper-c', D4: 'lower-a', D5: 'lower-b', D6: 'lower-c' },
      ac: ['pa', 'pb', 'pc'], dcPositive: 'out', dcNegative: 'neg',
    },
  },
];

/** Would-be bridges with one reversed device; `reversed` is the device, `swap` its two node names. */
export const NEAR_MISSES: (Omit<TopologyFixture, 'expect'> & { reversed: string; swap: [string, string] })[] = [
  {
    name: 'diode bridge with D3 reversed',
    around: `V1 ac1 ac2 SIN(0 325.27 50)\nC1 out 0 100u\nRL out 0 1k\n${DIODE_MODEL}`,
    rectifier: 'D1 ac1 out DM\nD2 ac2 out DM\nD3 ac1 0 DM\nD4 0 ac2 DM',
    ports: ['ac1', 'ac2', 'out', '0'],
    reversed: 'D3', swap: ['ac1', '0'],
  },
  {
    name: 'active bridge with M2 reversed (drain and source swapped)',
    around: `V1 ac1 ac2 SIN(0 16.97 50)\nXC1 ac1 ac2 g1 g2 g3 g4 SYNCDRV\nC1 out 0 2200u\nRL out 0 24\n${FET_MODEL}`,
    rectifier: 'M1 out g1 ac1 ac1 NM\nM2 ac2 g2 out out NM\nM3 ac1 g3 0 0 NM\nM4 ac2 g4 0 0 NM',
    ports: ['ac1', 'ac2', 'out', '0', 'g1', 'g2', 'g3', 'g4'],
    reversed: 'M2', swap: ['ac2', 'out'],
  },
];

/** Circuits with diodes that are not rectifiers. */
export const NEGATIVES: { name: string; netlist: string }[] = [
  {
    name: 'four diodes in series (a level-shifting string from a DC rail)',
    netlist: `V1 in 0 DC 12\nD1 in n1 DM\nD2 n1 n2 DM\nD3 n2 n3 DM\nD4 n3 out DM\nR1 out 0 1k\nC1 out 0 10u\n${DIODE_MODEL}`,
  },
  {
    name: 'diode-OR of two DC rails',
    netlist: `V1 a 0 DC 12\nV2 b 0 DC 5\nD1 a out DM\nD2 b out DM\nRL out 0 100\nC1 out 0 10u\n${DIODE_MODEL}`,
  },
  {
    name: 'clamp network: two signal lines clamped to a 5 V rail and ground',
    netlist: [
      'VCC vcc 0 DC 5', 'VS1 s1 0 SIN(0 10 1k)', 'VS2 s2 0 SIN(0 10 1k 0 0 180)', 'R1 s1 x1 1k', 'R2 s2 x2 1k',
      'D1 x1 vcc DM', 'D2 0 x1 DM', 'D3 x2 vcc DM', 'D4 0 x2 DM', 'C1 vcc 0 100n', DIODE_MODEL,
    ].join('\n'),
  },
];
