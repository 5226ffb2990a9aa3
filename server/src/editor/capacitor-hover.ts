/**
 * The hover section of a rectifier's filter capacitor: its worst ripple current against its
 * rating, the ripple loss in its ESR, its core temperature and its life estimate by the 10 °C rule
 * (equivalent/capacitor-stress.ts), each with its corner, and what the estimate assumed.
 */
import type { Span } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import type { CapacitorAnalysis, RectifierAnalysis } from '../equivalent/index';
import { describeOrigin, RATED_RIPPLE_RISE_K, type CoreRiseModel } from '../ratings/index';
import { formatCelsius, formatHours, formatPercent, formatSi } from '../presentation/format';
import { escapeMarkdown as md } from '../presentation/markup';

const RISE_WORDS: Record<CoreRiseModel, string> = {
  'thermal-resistance': 'core = ambient + ripple loss × rth',
  'rated-ripple': `core = ambient + ${RATED_RIPPLE_RISE_K} K × (I/I_rated)², the rise at rated ripple taken as ${RATED_RIPPLE_RISE_K} K (common practice)`,
  none: 'core taken at the ambient: no rth and no rated ripple to estimate its self-heating',
};

/** The capacitor sections for the capacitor whose top-level card starts at `card`, or undefined. */
export function capacitorHover(file: FileAnalysis, card: Span): string | undefined {
  const element = file.flat.elements.find((e) => e.kind === 'capacitor' && e.origin.chain.length === 0 && e.origin.uri === file.uri && e.origin.span.start === card.start);
  if (!element) return undefined;
  for (const analysis of file.rectifiers) {
    const cap = analysis.capacitors.find((c) => c.name.toLowerCase() === element.key);
    if (cap?.stress) return section(analysis, cap);
  }
  return undefined;
}

function section(analysis: RectifierAnalysis, cap: CapacitorAnalysis): string {
  const s = cap.stress!;
  const r = cap.ratings;
  const hottestIrms = s.corners.reduce((best, c) => (c.irmsA > (best?.irmsA ?? -1) ? c : best), s.corners[0]);
  const used = r.iRippleA && hottestIrms ? ` — ${formatPercent(hottestIrms.irmsA / r.iRippleA.value)} of its rated ${formatSi(r.iRippleA.value, 'A')}` : '';
  const lines = [
    `**Filter capacitor ${md(cap.name)}** of the ${md(analysis.rectifier.id)}`,
    '',
    `- Ripple current: ${formatSi(hottestIrms?.irmsA, 'A')} rms at ${md(hottestIrms?.corner ?? '—')}${used}`,
    s.lossW ? `- Ripple loss I²·ESR: ${formatSi(s.lossW.value, 'W')} at ${md(s.lossW.corner)} (ESR ${formatSi(s.esr?.ohm, 'Ω')}, from its ${s.esr?.from})` : '- Ripple loss: no ESR known (give esr= in its rate line)',
    `- Core temperature: ${formatCelsius(s.coreC?.value)} at ${md(s.coreC?.corner ?? '—')} (${RISE_WORDS[s.riseModel]})`,
  ];
  const e = r.endurance;
  if (s.lifeH && e) {
    lines.push(`- Life estimate: ${formatHours(s.lifeH.value)} at ${md(s.lifeH.corner)}, from ${formatHours(e.value.hours)} at ${formatCelsius(e.value.atC)} doubling per 10 °C cooler (common practice; an estimate, not a guarantee; ${md(describeOrigin(e.origin), Infinity)})`);
  } else lines.push('- Life estimate: none (give endurance=hours@temperature in its rate line)');
  return lines.join('\n');
}
