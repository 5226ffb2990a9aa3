/** Finds the rectifier analyses and devices that belong to a place in a file. */
import type { Span } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import type { DeviceAnalysis, RectifierAnalysis } from '../equivalent/index';

export interface DeviceHit {
  analysis: RectifierAnalysis;
  device: DeviceAnalysis;
  index: number;
}

/** The rectifier devices whose own card (top level) or enclosing X card (inside a subcircuit) covers the span. */
export function devicesAtCard(file: FileAnalysis, card: Span): DeviceHit[] {
  const hits: DeviceHit[] = [];
  for (const analysis of file.rectifiers) {
    analysis.devices.forEach((device, index) => {
      const place = cardPlaceOf(device);
      if (place.uri === file.uri && place.span.start === card.start) hits.push({ analysis, device, index });
    });
  }
  return hits;
}


/**
 * The card a device shows on in the root file: its own card at top level, or the X card that
 * holds it when it sits inside a subcircuit (a packaged bridge).
 */
export function cardPlaceOf(device: DeviceAnalysis): { uri: string; span: Span; inPackage: boolean } {
  const outer = device.ref.origin.chain[0];
  if (outer) return { uri: outer.uri, span: outer.span, inPackage: true };
  return { uri: device.ref.origin.uri, span: device.ref.origin.span, inPackage: false };
}
