/**
 * Keeps the promise of solution.ts that no figure is NaN or infinite. Extreme inputs (a value
 * near the floating-point range, a degenerate circuit) can still drive a computation out of range;
 * such a figure is removed rather than shown, and a note names it so the analysis can report it.
 */
import type { CornerSolution } from './solution';

/** Start of the note that lists omitted figures (the analysis turns it into a finding). */
export const NON_FINITE_NOTE = 'figures omitted because they are not finite';

/** Removes every optional figure of a corner (and of its devices) that holds a non-finite number. */
export function dropNonFiniteFigures(solution: CornerSolution): void {
  const dropped = dropFrom(solution as unknown as Record<string, unknown>, OPTIONAL_KEYS, '');
  solution.devices.forEach((device) => dropped.push(...dropFrom(device as unknown as Record<string, unknown>, DEVICE_KEYS, `${device.name}.`)));
  if (dropped.length) solution.notes.push(`${NON_FINITE_NOTE}: ${dropped.join(', ')}`);
}

/** Whether any number reachable from `value` is NaN or infinite. */
export function holdsNonFinite(value: unknown): boolean {
  if (typeof value === 'number') return !Number.isFinite(value);
  if (Array.isArray(value)) {
    // Plain loops: a corner's waveforms hold a few thousand numbers.
    for (let k = 0; k < value.length; k++) {
      const x: unknown = value[k];
      if (typeof x === 'number' ? !Number.isFinite(x) : holdsNonFinite(x)) return true;
    }
    return false;
  }
  if (value && typeof value === 'object') {
    for (const key in value) if (holdsNonFinite((value as Record<string, unknown>)[key])) return true;
  }
  return false;
}

// Required fields (name, lineScale, lineVrms, ambientC, counters) come from the inputs and stay.
const OPTIONAL_KEYS = [
  'vOutAvgV', 'vOutRmsV', 'vOutMinV', 'vOutMaxV', 'rippleVpp', 'capRippleIrmsA', 'capacitorIrmsA', 'outputPowerW', 'rectifierLossW', 'controllerLossW',
  'inputPowerW', 'efficiency', 'sourceIrmsA', 'powerFactor', 'displacementPowerFactor', 'thd', 'harmonicsA', 'iecClassA', 'iecClassD',
  'inrushPeakA', 'inrushI2tA2s', 'holdUpS', 'waveform', 'inrushWaveform',
];
const DEVICE_KEYS = ['pivV', 'ipkA', 'iavgA', 'irmsA', 'lossW', 'tjC', 'inrushI2tA2s', 'inrushPeakA'];

function dropFrom(record: Record<string, unknown>, keys: readonly string[], prefix: string): string[] {
  const dropped: string[] = [];
  for (const key of keys) {
    if (record[key] === undefined || !holdsNonFinite(record[key])) continue;
    delete record[key];
    dropped.push(prefix + key);
  }
  return dropped;
}
