/**
 * `unmodelled-inductance` — fires when the solver could not model an inductance drawn in a
 * rectifier's loop: the line inductance of a three-phase bridge that the overlap solver does not
 * take (a MOSFET bridge, or line inductance together with a DC choke: during commutation three
 * devices conduct at once), line inductance together with a DC choke in a single-phase bridge or
 * centre tap (the same overlap), or a choke on a doubler. The solver then ran without it (its note
 * is quoted). A three-phase diode bridge with line inductance alone is solved with its overlap
 * (solve/overlap-corner.ts) and gets none. Called with the solver's other findings (limits.ts
 * `solverFindings`).
 *
 * Why: inductance lowers the current peaks, the ripple current and the inrush and raises the power
 * factor; figures computed without it are not those of the circuit as drawn. A stress rule passing
 * or failing on them has not checked the circuit, so that is said, never left to a note.
 *
 * Severity: a warning (the figures exist, but for a different circuit).
 */
import type { RectifierAnalysis } from '../equivalent/index';
import type { Finding } from '../findings/index';
import { UNMODELLED_INDUCTANCE_NOTES } from '../solve/index';

export const UNMODELLED_INDUCTANCE_CODE = 'unmodelled-inductance';

/** What such a solve leaves unchecked, in the words of the figures it shapes. */
const SHAPED_FIGURES = 'device peak and RMS currents, loss and junction temperature, output ripple, capacitor ripple current, source RMS current, power factor, harmonics and inrush';

/** The finding for one analysed rectifier whose solve left an inductance out; none otherwise. */
export function unmodelledInductanceFindings({ rectifier, solution }: RectifierAnalysis): Finding[] {
  const said = UNMODELLED_INDUCTANCE_NOTES.filter((n) => solution.notes.includes(n));
  if (said.length === 0) return [];
  const devices = rectifier.devices.map((d) => d.name).join(', ');
  return [{
    uri: rectifier.anchor.uri, span: rectifier.anchor.span, severity: 'warning', code: UNMODELLED_INDUCTANCE_CODE,
    message: `the ${rectifier.kind} ${devices}: ${said.join('; ')}. Its ${SHAPED_FIGURES} are those of the circuit without that inductance: not checked against the circuit as drawn`,
  }];
}
