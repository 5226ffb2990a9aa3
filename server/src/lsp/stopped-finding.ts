/** The finding shown for a file the editor could not analyse at all, so that it never looks clean. */
import type { Finding } from '../findings/index';
import type { AnalysisStop } from './analysis-worker-host';

export function stoppedFinding(uri: string, text: string, stop: AnalysisStop): Finding {
  const firstLineEnd = text.search(/\r?\n|$/);
  const span = { start: 0, end: Math.max(0, firstLineEnd) };
  const message = stop.cause === 'patience'
    ? `This file was not checked: ${stop.reason}. None of its rectifiers were analysed; \`rectilens check\` analyses it without a time limit.`
    : `This file was not checked: ${stop.reason}. None of its rectifiers were analysed. The analysis restarts with the file's next change; please report the file if this persists.`;
  return { uri, span, severity: 'error', code: stop.cause === 'patience' ? 'limit-exceeded' : 'internal-error', message };
}
