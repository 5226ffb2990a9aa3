/**
 * The hover table of a rectifier device: nominal and worst values with the corner that produced
 * each, the rating and how much of it is used, where each rating came from, the assumptions, and
 * the caution for mains-connected designs.
 */
import type { FileAnalysis } from '../analysis/analyze';
import type { RectifierAnalysis } from '../equivalent/index';
import { describeOrigin, isAboveExtraLowVoltage, MAINS_CAUTION, stressVerdict, type DeratingPolicy, type Rated } from '../ratings/index';
import { isNominalCorner, type DeviceAtCorner, type WorstValue } from '../solve/index';
import { formatCelsius, formatPercent, formatSi, KIND_NAMES, trim } from '../presentation/format';
import { escapeMarkdown as md, markdownCode as code } from '../presentation/markup';
import { conditionSpanText, cornerConditionsText, loadCompositionText } from '../presentation/operating-conditions';
import { hoverAt, type HoverResult } from './hover';
import { capacitorHover } from './capacitor-hover';
import { surgeComparison, surgeWhen } from '../rules/surge-rating';
import { devicesAtCard, type DeviceHit } from './rectifier-lookup';


/** Where a device sits, in words (DeviceRole in solve/equivalent-circuit.ts). */
const ROLE_WORDS: Readonly<Record<string, string>> = {
  'upper-a': 'from the first AC line to DC+', 'upper-b': 'from the second AC line to DC+', 'upper-c': 'from the third AC line to DC+',
  'lower-a': 'from DC− to the first AC line', 'lower-b': 'from DC− to the second AC line', 'lower-c': 'from DC− to the third AC line',
  series: 'in series with the load', 'winding-a': 'on the first half-winding', 'winding-b': 'on the second half-winding',
  d1: 'charging the first capacitor', d2: 'charging the second capacitor',
};

interface Row {
  label: string;
  key: 'pivV' | 'ipkA' | 'iavgA' | 'irmsA' | 'lossW' | 'tjC';
  unit: string;
  rating?: (hit: DeviceHit) => { symbol: string; rated?: Rated<number> } | undefined;
}

const ROWS: Row[] = [
  { label: 'PIV', key: 'pivV', unit: 'V', rating: (h) => h.device.ratings.ratings.kind === 'diode' ? { symbol: 'VRRM', rated: h.device.ratings.ratings.vrrmV } : { symbol: 'VDS', rated: h.device.ratings.ratings.vdsV } },
  { label: 'Peak current', key: 'ipkA', unit: 'A' },
  { label: 'Average current', key: 'iavgA', unit: 'A', rating: (h) => h.device.ratings.ratings.kind === 'diode' ? { symbol: 'IF(AV)', rated: h.device.ratings.ratings.ifavA } : { symbol: 'ID', rated: h.device.ratings.ratings.idA } },
  { label: 'RMS current', key: 'irmsA', unit: 'A' },
  { label: 'Loss', key: 'lossW', unit: 'W' },
  { label: 'Junction temperature', key: 'tjC', unit: '°C', rating: (h) => ({ symbol: 'Tjmax', rated: h.device.ratings.ratings.tjmaxC }) },
];

/** Markdown for the devices under a card (one device, or every device of a packaged bridge). */
export function stressHover(file: FileAnalysis, hits: readonly DeviceHit[]): string {
  const sections = hits.map((hit) => deviceSection(hit, file.policy));
  const analysis = hits[0]?.analysis;
  if (!analysis) return '';
  sections.unshift(rectifierSummary(analysis));
  const assumptions = file.findings.filter((f) => (f.code === 'assumed-condition' || f.code === 'default-model') && f.span.start === analysis.rectifier.anchor.span.start);
  if (assumptions.length) sections.push(`**Assumed:** ${assumptions.map((f) => md(f.message, Infinity)).join('; ')}`);
  if (isAboveExtraLowVoltage({ acRmsV: analysis.circuit.source.mainsVrms })) sections.push(`⚠ ${MAINS_CAUTION}`);
  return sections.join('\n\n');
}

function rectifierSummary(analysis: RectifierAnalysis): string {
  const worst = analysis.solution.worst;
  const kind = KIND_NAMES[analysis.rectifier.kind] ?? analysis.rectifier.kind;
  const parts = [
    `output ${formatSi(worst.vOutAvgV?.value, 'V')}`,
    `ripple ${formatSi(worst.rippleVpp?.value, 'V')} p-p`,
    `efficiency ${formatPercent(worst.efficiency?.value)}`,
    `inrush ${formatSi(worst.inrushPeakA?.value, 'A')}${inrushCaseOf(analysis) ? ` (${inrushCaseOf(analysis)})` : ''}`,
  ];
  const span = conditionSpanText(analysis.solution.corners, analysis.rectifier.surroundings.source.mains, analysis.rectifier.surroundings.load);
  return [
    `**${kind}** (${analysis.rectifier.devices.map((d) => md(d.name)).join(', ')}): ${parts.join(' · ')}`,
    `Load: ${md(loadCompositionText(analysis.rectifier.surroundings.load), Infinity)}${span ? ` · corners over ${md(span, Infinity)}` : ''}`,
  ].join('\n\n');
}

/** The conditions of the corners named in a device's worst column, each once. */
function worstCornerLines(analysis: RectifierAnalysis, names: readonly (string | undefined)[]): string[] {
  const seen = [...new Set(names.filter((n): n is string => n !== undefined))];
  return seen.flatMap((name) => {
    const corner = analysis.solution.corners.find((c) => c.name === name);
    return corner ? [`- ${md(name)}: ${md(cornerConditionsText(corner), Infinity)}`] : [];
  });
}

function deviceSection(hit: DeviceHit, policy: DeratingPolicy): string {
  const { device } = hit;
  const name = device.ref.name;
  const nominal = device.figures.corners.find((c) => isNominalCorner(c.corner)) ?? device.figures.corners[0];
  const worst = device.figures.worst;
  const lines = [
    `**${md(name)}** (${device.ref.type}${device.model ? ` ${code(device.model.name)}` : ''}) — ${ROLE_WORDS[device.ref.role] ?? device.ref.role}`,
    '',
    '| | nominal | worst | at corner | rating | used |',
    '|---|---|---|---|---|---|',
  ];
  const origins: string[] = [];
  const worstCorners: (string | undefined)[] = [];
  for (const row of ROWS) {
    const nominalValue = deviceValue(nominal, row.key);
    const worstValue = worst?.[row.key] as WorstValue | undefined;
    worstCorners.push(worstValue?.corner);
    const rating = row.rating?.(hit);
    const ratedText = rating?.rated ? `${rating.symbol} ${row.unit === '°C' ? formatCelsius(rating.rated.value) : formatSi(rating.rated.value, row.unit)}` : rating ? `${rating.symbol} not rated` : '';
    const used = rating?.rated && worstValue && row.unit !== '°C' ? formatPercent(worstValue.value / rating.rated.value) : '';
    if (rating?.rated) origins.push(`${rating.symbol}: ${describeOrigin(rating.rated.origin)}`);
    const show = (v: number | undefined) => (row.unit === '°C' ? formatCelsius(v) : formatSi(v, row.unit));
    lines.push(`| ${row.label} | ${show(nominalValue)} | ${show(worstValue?.value)} | ${worstValue?.corner ?? ''} | ${ratedText} | ${used} |`);
  }
  const surge = surgeLine(hit, policy);
  if (surge) lines.push('', surge);
  const conditions = worstCornerLines(hit.analysis, worstCorners);
  if (conditions.length) lines.push('', '**Worst corners:**', ...conditions);
  if (worst?.thermalRunaway) lines.push('', '**Thermal runaway:** the junction temperature does not settle at the hottest corner.');
  const rth = device.ratings.ratings.rthjaKPerW;
  if (rth) origins.push(`RθJA ${formatSi(rth.value, 'K/W')}: ${describeOrigin(rth.origin)}`);
  else lines.push('', '**No RθJA:** the junction temperature is taken as the ambient and was not checked.');
  if (origins.length) lines.push('', `Ratings from ${origins.map((o) => md(o, Infinity)).join('; ')}.`);
  return lines.join('\n');
}

/** The device's own switch-on surge, its case and, when rated, which of peak and I²t binds (rules/surge-rating.ts words it). */
function surgeLine(hit: DeviceHit, policy: DeratingPolicy): string | undefined {
  const surge = hit.device.figures.surge;
  if (!surge) return undefined;
  const verdict = stressVerdict('surge', hit.device.figures, hit.device.ratings.ratings, policy);
  const judged = verdict?.surge ? surgeComparison(verdict.surge) : `peak ${formatSi(surge.peakA, 'A')}, I²t ${trim(surge.i2tA2s)} A²s (no IFSM rated)`;
  // Our own sentences, whose one netlist name (an NTC's) surgeWhen already clips.
  return `**Surge:** ${md(surgeWhen(surge, hit.analysis), Infinity)}: ${md(judged, Infinity)}.`;
}

/** The case of the rectifier's largest inrush peak, at its worst corner. */
function inrushCaseOf(analysis: RectifierAnalysis): string | undefined {
  const corner = analysis.solution.worst.inrushPeakA?.corner;
  return analysis.solution.corners.find((c) => c.name === corner)?.inrushCase;
}

function deviceValue(corner: DeviceAtCorner | undefined, key: Row['key']): number | undefined {
  const value = corner?.figures?.[key];
  return typeof value === 'number' ? value : undefined;
}

/** The hover at an offset of an analysed file: the card's description, with the stress table of any rectifier device on it. */
export function hoverInFile(file: FileAnalysis, offset: number): HoverResult | undefined {
  return hoverAt(file.netlist, offset, (card) => {
    const hits = devicesAtCard(file, card.span);
    return hits.length ? stressHover(file, hits) : capacitorHover(file, card.span);
  });
}
