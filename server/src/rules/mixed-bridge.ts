/**
 * `mixed-bridge` — information when the devices of one rectifier of the same type (diodes among
 * diodes, MOSFETs among MOSFETs) use different models, or when a bridge mixes diodes and MOSFETs
 * in a pattern that is not the hybrid bridge.
 *
 * Why: devices in series or alternating legs share the stress unevenly when their forward drops
 * and ratings differ, and a part swapped in one place only is a common slip. A hybrid bridge's
 * diodes and MOSFETs are different by design and are not flagged for that.
 *
 * Threshold: none; any difference of model name (case-insensitive) is reported.
 */
import type { Finding } from '../findings/index';
import type { RectifierAnalysis } from '../equivalent/index';
import type { Rule } from './registry';

export const mixedBridgeRule: Rule = {
  code: 'mixed-bridge',
  check(input) {
    return input.rectifiers.flatMap((analysis) => {
      const finding = mixedFinding(analysis);
      return finding ? [finding] : [];
    });
  },
};

function mixedFinding(analysis: RectifierAnalysis): Finding | undefined {
  const parts: string[] = [];
  for (const type of ['diode', 'mosfet'] as const) {
    const byModel = new Map<string, string[]>();
    for (const d of analysis.devices.filter((x) => x.ref.type === type)) {
      const name = d.model?.name ?? '(no model)';
      const key = name.toLowerCase();
      byModel.set(key, [...(byModel.get(key) ?? []), `${d.ref.name}`]);
    }
    if (byModel.size > 1) {
      const groups = [...byModel.entries()].map(([, names]) => names);
      const models = [...byModel.keys()];
      parts.push(`${type}s use ${models.length} models: ${groups.map((g, i) => `${g.join(', ')} ${modelLabel(analysis, models[i]!)}`).join('; ')}`);
    }
  }
  if (analysis.rectifier.mixed) parts.push('diodes and MOSFETs are mixed in a pattern other than the hybrid bridge');
  if (parts.length === 0) return undefined;
  return {
    ...analysis.rectifier.anchor, severity: 'info', code: 'mixed-bridge',
    message: `in this ${analysis.rectifier.kind}, ${parts.join('; ')}: they share the stress unevenly unless that is intended`,
  };
}

function modelLabel(analysis: RectifierAnalysis, key: string): string {
  return analysis.devices.find((d) => (d.model?.name ?? '(no model)').toLowerCase() === key)?.model?.name ?? '(no model)';
}
