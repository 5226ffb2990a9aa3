/** The quick-fix fixture both code-action suites use. */
// A packaged 230 V bridge of our own whose 440 V diodes lack margin at high line (358 V > 0.8 × 440 V = 352 V).
export const PACKAGED_BRIDGE = [
  'packaged bridge', '*@ mains 230V 50Hz', '*@ load 20W', '*@ rate DR vrrm=440V ifav=1A ifsm=60A tjmax=150C rthja=80',
  '.subckt BR4 ac1 ac2 p n', 'D1 ac1 p DR', 'D2 ac2 p DR', 'D3 n ac1 DR', 'D4 n ac2 DR', '.ends BR4',
  'VAC L N SIN(0 325 50)', 'RS L A 10', 'XB A N P 0 BR4', 'CB P 0 47u',
  '.model DR D(IS=5n N=1.8 RS=0.05)', '.end', '',
].join('\n');
