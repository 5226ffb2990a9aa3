/** The stable codes of the analysis findings (DESIGN.md §6), with one-line descriptions. */
export const FINDING_CODES: Readonly<Record<string, string>> = {
  'reversed-device': 'a device in a would-be bridge points the wrong way and shorts the source on one half-cycle',
  'piv-margin': 'peak inverse voltage against the repetitive reverse rating, with the derating margin',
  'current-rating': 'average forward current against the rated average current, with derating',
  'surge-rating': 'switch-on inrush against the surge rating (IFSM, I²t)',
  'junction-temp': 'junction temperature at the hottest corner against the derated limit',
  'thermal-runaway': 'loss and junction temperature do not settle',
  'cap-voltage': 'filter capacitor voltage against its rated voltage, with derating',
  'cap-ripple': 'filter capacitor ripple current against its rating',
  'controller-undervoltage': 'the input never reaches the synchronous controller\'s minimum operating voltage',
  'mosfet-vds': 'MOSFET drain-source voltage against its rating, with derating',
  'harmonic-limit': 'mains harmonic currents against IEC 61000-3-2 limits',
  'missing-rating': 'a rectifier part has no rating to check against',
  'default-model': 'a device uses default model parameters',
  'assumed-condition': 'a condition the netlist does not state was assumed',
  'mixed-bridge': 'the devices of one bridge use different models',
  'hazardous-voltage': 'a source above extra-low voltage: caution',
};
