/** Code lenses above each rectifier: its kind and headline figures, and the two view commands. */
import { COMMANDS } from '../protocol/custom-protocol';
import type { FileAnalysis } from '../analysis/analyze';
import { formatPercent, formatSi, KIND_NAMES, trim } from '../presentation/format';

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
    const summary = [
      KIND_NAMES[analysis.rectifier.kind] ?? analysis.rectifier.kind,
      `η ${formatPercent(worst.efficiency?.value)}`,
      `ripple ${formatSi(worst.rippleVpp?.value, 'V')} p-p`,
      `PF ${worst.powerFactor ? trim(worst.powerFactor.value) : '—'}`,
    ].join(' · ');
    const args = [file.uri, analysis.rectifier.id];
    return [
      { offset: anchor.span.start, title: summary },
      { offset: anchor.span.start, title: 'Waveforms', command: { id: COMMANDS.showWaveforms, args } },
      { offset: anchor.span.start, title: 'Compare topologies', command: { id: COMMANDS.compareTopologies, args } },
    ];
  });
}
