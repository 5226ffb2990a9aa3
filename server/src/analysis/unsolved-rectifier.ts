/**
 * `unsolved-rectifier` — fires when a recognised rectifier could not be solved at some corner:
 * the solver could not build its network there (no source voltage, no frequency, no capacitor and
 * no load resistance, a device whose role does not fit the topology…), so the corner has no
 * figures at all. The solver's reason, which is otherwise only a note under the rectifier, is
 * quoted. Called with the solver's other findings (limits.ts `solverFindings`).
 *
 * Why: the worst case of every stress is taken over the corners that were solved; a rectifier
 * solved nowhere has no figure, so every stress rule passes it without having looked. A rectifier
 * that could not be solved is a finding, never only a note.
 *
 * Severity: an error when no corner was solved (none of its parts was checked), a warning when
 * only some were (the worst case may lie at a missing corner). A steady state not reached within
 * the solver's limits is `limit-exceeded` (analysis/limits.ts): those corners have figures.
 */
import type { RectifierAnalysis } from '../equivalent/index';
import type { Finding } from '../findings/index';

export const UNSOLVED_RECTIFIER_CODE = 'unsolved-rectifier';

/** The finding for one analysed rectifier with corners the solver could not solve; none when every corner has figures. */
export function unsolvedRectifierFindings({ rectifier, solution }: RectifierAnalysis): Finding[] {
  const missing = solution.corners.filter((c) => c.vOutAvgV === undefined);
  if (missing.length === 0) return [];
  const none = missing.length === solution.corners.length;
  const reasons = [...new Set(missing.flatMap((c) => c.notes))];
  const why = reasons.length ? reasons.join('; ') : 'the solver gave no reason';
  const devices = rectifier.devices.map((d) => d.name).join(', ');
  const message = none
    ? `the ${rectifier.kind} ${devices} could not be solved at any corner (${why}): none of its parts was checked`
    : `the ${rectifier.kind} ${devices} could not be solved at ${missing.map((c) => c.name).join(', ')} (${why}): its worst case is taken over the other corners only`;
  return [{ uri: rectifier.anchor.uri, span: rectifier.anchor.span, severity: none ? 'error' : 'warning', code: UNSOLVED_RECTIFIER_CODE, message }];
}
