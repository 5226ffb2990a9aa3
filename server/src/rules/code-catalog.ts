/**
 * Every finding code Rectilens can report, with a short description and help text: the source
 * of SARIF rule metadata, of `*@ allow` completion and of the README's rules table.
 */
import { FINDING_CODES } from './codes';

export interface CodeInfo {
  code: string;
  description: string;
  /** What to do about it. */
  help: string;
  /** Where the finding comes from. */
  stage: 'syntax' | 'circuit' | 'analysis';
}

const SYNTAX: Readonly<Record<string, [string, string]>> = {
  'syntax-error': ['a card does not follow the netlist syntax', 'Compare the card with the syntax the message shows.'],
  'value-notation': ['a value is written in a form simulators read differently', 'Write the value with SPICE suffixes, e.g. 4.7k or 1.5MEG.'],
  'unknown-element': ['an element letter this subset does not model', 'The card is kept but not analysed.'],
  'unclosed-block': ['a .subckt or .lib section is never closed', 'Add the matching .ends or .endl.'],
  'unmatched-end': ['an .ends or .endl without its opening card, or with another name', 'Remove it or fix the name.'],
  'after-end': ['cards after .end', 'Simulators ignore them; move them above .end.'],
  'directive-error': ['a *@ directive cannot be read', 'See the directive table in the README.'],
  'param-cycle': ['parameters that refer to each other in a cycle', 'Break the cycle with a plain value.'],
  'undefined-param': ['an expression uses a parameter with no value', 'Define it with .param, or on the .subckt or X card.'],
  'unknown-param': ['an instance sets a parameter the subcircuit does not declare', 'Check the name against the .subckt card.'],
  'bad-value': ['a value is not a finite number', 'Write a finite value.'],
  'param-redefined': ['a parameter is defined twice', 'The later value wins; remove one of them.'],
  'file-encoding': ['a file is not UTF-8 text (UTF-16, or binary)', 'Save the file as UTF-8; it is not analysed until then.'],
};

const CIRCUIT: Readonly<Record<string, [string, string]>> = {
  'missing-include': ['an included file cannot be read', 'Check the path (relative to the including file).'],
  'untrusted-file': ['the workspace is untrusted and a file it names (include, library or parts file) lies outside its folders, by its real path', 'Trust the workspace to read it, or copy the file into the workspace; it is not read until then.'],
  'unreadable-file': ['a file named by an include, library or parts file is not a regular file (a folder, device, named pipe or socket) or cannot be read', 'Name a regular file you can read.'],
  'missing-lib-section': ['a .lib reference names a section the library does not have', 'Check the section name.'],
  'include-cycle': ['files include each other in a cycle', 'Remove one of the includes.'],
  'include-depth': ['includes nested too deeply', 'Flatten the include chain.'],
  'include-error': ['an included file has errors, so part of the circuit was not analysed as written', 'Fix the errors in the included file; the message quotes the first.'],
  'unknown-subckt': ['an X card names a subcircuit that is not defined (an error: nothing inside it is analysed)', 'Define or include the subcircuit; where a defined name is near, a quick fix changes the name to it.'],
  'unknown-model': ['a device names a model that is not defined (an error: the device gets no ratings from its model)', 'Define or include the model, or take the quick fix that changes the name to the nearest defined one; defaults are used meanwhile.'],
  'subckt-redefined': ['a subcircuit is defined twice', 'The later definition wins; remove one.'],
  'recursive-subckt': ['a subcircuit instantiates itself', 'Break the recursion.'],
  'subckt-depth': ['subcircuits nested too deeply', 'Flatten the hierarchy.'],
  'port-count': ['an X card connects a different number of nodes than the subcircuit has ports', 'Match the node list to the .subckt ports.'],
  'circuit-too-large': ['the flattened circuit exceeds the size limit', 'Analyse a smaller part of the design.'],
};

const ANALYSIS_HELP: Readonly<Record<string, string>> = {
  'reversed-device': 'Swap the anode and cathode of the named device (a quick fix does this).',
  'piv-margin': 'Choose a part with a higher VRRM; the quick fix offers the lowest-rated one that passes.',
  'current-rating': 'Choose a part with a higher average current rating, or improve cooling.',
  'surge-rating': 'Add series resistance (the quick fix inserts an E12 value) or choose a part with a higher IFSM.',
  'junction-temp': 'Reduce loss or thermal resistance, or choose a part with more margin.',
  'thermal-runaway': 'The part cannot dissipate its loss at this ambient: choose a larger part or add cooling.',
  'cap-voltage': 'Raise the capacitor voltage class (a quick fix does this).',
  'cap-ripple': 'Use a capacitor with a higher ripple-current rating, or several in parallel.',
  'cap-life': 'Choose a capacitor with a longer or hotter endurance rating, lower ESR, or a cooler place; state endurance= and rth= in its rate line.',
  'unbalanced-string': 'Put a resistor across each capacitor of the string, sized to carry several times the largest leakage current (common practice).',
  'controller-undervoltage': 'Below its minimum voltage the controller never switches and the bridge runs on body diodes.',
  'controller-overvoltage': 'Above its maximum supply voltage the controller is overstressed; choose one rated above the crest at high line.',
  'mosfet-vds': 'Choose a MOSFET with a higher VDS rating.',
  'harmonic-limit': 'Add power-factor correction or input inductance, or review the equipment class.',
  'missing-rating': 'Add a *@ rate line for the part (a quick fix inserts a template).',
  'default-model': 'Give the device a .model with IS, N and RS, or vf= points in its rate line.',
  'assumed-condition': 'State the condition in the netlist (e.g. *@ mains, *@ load) to remove the assumption.',
  'mixed-bridge': 'Devices of different models share the stress unevenly; use one model unless that is intended.',
  'hazardous-voltage': 'Estimates only, not a safety or compliance test; follow local codes and licensed practice.',
  'implausible-value': 'Correct the value; the part is left out of the analysis until then.',
  'shorted-source': 'Remove the short or give the source or the load its real value.',
  'bypassed-device': 'Remove the resistor, or model it in the circuit some other way; the figures leave it out.',
  'duplicate-name': 'Rename one of the two; element names must be unique.',
  'limit-exceeded': 'Split the netlist, or analyse the part that matters; the message names the limit.',
  'figure-omitted': 'Check the values feeding the rectifier for ones far outside any real part.',
  'parts-file': 'Fix the parts file where the finding points; its JSON Schema is parts-file.schema.json.',
  'project-config': 'Fix the entry: the keys are the editor settings without their rectilens. prefix; its JSON Schema is project-config.schema.json.',
  'no-rectifier': 'Check the node names of the device cards against the source and the filter; if no device here rectifies, allow the code.',
  'unsolved-rectifier': 'Give the rectifier what the quoted reason lacks (a source voltage and frequency, a filter capacitor or a load resistance).',
  'unmodelled-inductance': 'Treat the named figures as not checked: verify them another way (a circuit simulation or a bench measurement), or allow the code once they are.',
};

/** Metadata for a code, with a generic fallback for codes added later. */
export function codeInfo(code: string): CodeInfo {
  const syntax = SYNTAX[code];
  if (syntax) return { code, description: syntax[0], help: syntax[1], stage: 'syntax' };
  const circuit = CIRCUIT[code];
  if (circuit) return { code, description: circuit[0], help: circuit[1], stage: 'circuit' };
  const analysis = FINDING_CODES[code];
  if (analysis) return { code, description: analysis, help: ANALYSIS_HELP[code] ?? '', stage: 'analysis' };
  return { code, description: code.replace(/-/g, ' '), help: '', stage: 'analysis' };
}

/** Every known code, in a stable order. */
export function allCodes(): CodeInfo[] {
  return [...Object.keys(SYNTAX), ...Object.keys(CIRCUIT), ...Object.keys(FINDING_CODES)].map(codeInfo);
}
