/** Finds the rectifier analyses and devices that belong to a place in a file. */
import type { Span } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import type { DeviceAnalysis, RectifierAnalysis } from '../analysis/rectifier-analysis';

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
      const origin = device.ref.origin;
      const outer = origin.chain[0];
      const place = outer ? { uri: outer.uri, span: outer.span } : { uri: origin.uri, span: origin.span };
      if (place.uri === file.uri && place.span.start === card.start) hits.push({ analysis, device, index });
    });
  }
  return hits;
}

