/** Inlay hints at the end of each rectifier device's card: worst PIV against its rating, loss, Tj. */
import type { FileAnalysis } from '../analysis/analyze';
import type { DeviceAnalysis, RectifierAnalysis } from '../equivalent/index';
import type { DeviceWorst } from '../solve/index';
import { formatCelsius, formatSi, trim } from '../presentation/format';
import { cardPlaceOf } from './rectifier-lookup';

export interface InlayHint {
  /** Offset the hint is drawn at (the end of the card's last line). */
  offset: number;
  label: string;
  tooltip: string;
}

export type HintDetail = 'off' | 'brief' | 'full';

export function inlayHintsOf(file: FileAnalysis, detail: HintDetail = 'brief'): InlayHint[] {
  if (detail === 'off') return [];
  const byCard = new Map<number, { end: number; parts: string[] }>();
  for (const analysis of file.rectifiers) {
    for (const device of analysis.devices) {
      const place = cardPlaceOf(device);
      if (place.uri !== file.uri) continue;
      const worst = device.figures.worst;
      if (!worst) continue;
      const entry = byCard.get(place.span.start) ?? { end: place.span.end, parts: [] };
      entry.parts.push(describe(device, worst, analysis, detail, place.inPackage));
      byCard.set(place.span.start, entry);
    }
  }
  return [...byCard.values()].map(({ end, parts }) => ({
    offset: end,
    label: parts.length > 1 ? worstOfPackage(parts) : parts[0]!,
    tooltip: parts.join('\n'),
  }));
}

function describe(device: DeviceAnalysis, worst: DeviceWorst, analysis: RectifierAnalysis, detail: HintDetail, inPackage: boolean): string {
  const r = device.ratings.ratings;
  const ratedV = r.kind === 'diode' ? r.vrrmV?.value : r.vdsV?.value;
  const piv = worst.pivV ? `PIV ${trim(worst.pivV.value)}${ratedV ? `/${trim(ratedV)}` : ''} V` : 'PIV —';
  const parts = [piv, formatSi(worst.lossW?.value, 'W')];
  if (detail === 'full') parts.push(`Ipk ${formatSi(worst.ipkA?.value, 'A')}`, `Iavg ${formatSi(worst.iavgA?.value, 'A')}`);
  if (worst.thermalRunaway) parts.push('Tj runaway');
  else if (detail === 'full' || device.ratings.ratings.rthjaKPerW) parts.push(`Tj ${formatCelsius(worst.tjC?.value)}`);
  void analysis;
  return inPackage ? `${device.ref.name.split('.').pop()}: ${parts.join(' · ')}` : parts.join(' · ');
}

/** A packaged bridge gets one hint: its most stressed device, named. */
function worstOfPackage(parts: string[]): string {
  return `${parts[0]} (+${parts.length - 1} more)`;
}

/** The hints whose place lies in `[from, to]` (the range an editor asks for). */
export function inlayHintsIn(file: FileAnalysis, detail: HintDetail, from: number, to: number): InlayHint[] {
  return inlayHintsOf(file, detail).filter((h) => h.offset >= from && h.offset <= to);
}
