/** Code lenses above each rectifier: its kind and headline figures, and the two view commands. */
import { COMMANDS } from '../protocol/custom-protocol';
import type { FileAnalysis } from '../analysis/analyze';
import type { RectifierAnalysis } from '../equivalent/index';
import { formatHours, formatPercent, formatSi, KIND_NAMES, trim } from '../presentation/format';
import { conditionSpanText } from '../presentation/operating-conditions';

export interface CodeLens {
  /** Offset of the line the lens sits above. */
  offset: number;
  title: string;
  command?: { id: string; args: unknown[] };
}

export function codeLensesOf(file: FileAnalysis): CodeLens[] {
  return file.rectifiers.flatMap((analysis) => {
    const anchor = analysis.rectifier.anchor;
    if (anchor.uri !== file.uri) return [];
    const worst = analysis.solution.worst;
    const span = conditionSpanText(analysis.solution.corners, analysis.rectifier.surroundings.source.mains, analysis.rectifier.surroundings.load);
    const summary = [
      KIND_NAMES[analysis.rectifier.kind] ?? analysis.rectifier.kind,
      `η ${formatPercent(worst.efficiency?.value)}`,
      `ripple ${formatSi(worst.rippleVpp?.value, 'V')} p-p`,
      `PF ${worst.powerFactor ? trim(worst.powerFactor.value) : '—'}`,
      ...inrushAndLife(analysis),
      // Only when the file asks for more than one line, load or part value: the span solved.
      ...(span ? [span] : []),
    ].join(' · ');
    const args = [file.uri, analysis.rectifier.id];
    return [
      { offset: anchor.span.start, title: summary },
      { offset: anchor.span.start, title: 'Waveforms', command: { id: COMMANDS.showWaveforms, args } },
      { offset: anchor.span.start, title: 'Compare topologies', command: { id: COMMANDS.compareTopologies, args } },
    ];
  });
}

/**
 * The inrush peak, naming a hot restart when an NTC limiter makes it the worst case, and the
 * shortest capacitor life estimate when one was made.
 */
function inrushAndLife(analysis: RectifierAnalysis): string[] {
  const out: string[] = [];
  const peak = analysis.solution.worst.inrushPeakA;
  if (peak) {
    const inrushCase = analysis.solution.corners.find((c) => c.name === peak.corner)?.inrushCase;
    out.push(`inrush ${formatSi(peak.value, 'A')}${inrushCase?.startsWith('hot restart') ? ' (hot restart)' : ''}`);
  }
  const lives = analysis.capacitors.flatMap((c) => (c.stress?.lifeH ? [{ name: c.name, lifeH: c.stress.lifeH.value }] : []));
  const shortest = lives.reduce<(typeof lives)[number] | undefined>((best, l) => (!best || l.lifeH < best.lifeH ? l : best), undefined);
  if (shortest) out.push(`${shortest.name} life ${formatHours(shortest.lifeH)}`);
  return out;
}
