/** Display formatting at the edge: SI values to short strings with engineering prefixes. */
import { displayNumber, NO_NUMBER } from '../../../grammar/src/index';

const PREFIXES: [number, string][] = [[1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n']];

/** `formatSi(0.0142, 'W')` → `14.2 mW`; three significant figures, no trailing zeros. */
export function formatSi(value: number | undefined, unit: string): string {
  if (value === undefined || !Number.isFinite(value)) return NO_NUMBER;
  const magnitude = Math.abs(value);
  if (magnitude === 0) return `0 ${unit}`;
  const [factor, prefix] = PREFIXES.find(([f]) => magnitude >= f * 0.9995) ?? PREFIXES[PREFIXES.length - 1]!;
  return `${trim(value / factor)} ${prefix}${unit}`;
}

/** A plain number with three significant figures (≥ 100 shown whole): the one formatter, grammar/src/display.ts. */
export const trim = displayNumber;

export function formatPercent(fraction: number | undefined): string {
  if (fraction === undefined || !Number.isFinite(fraction * 100)) return NO_NUMBER;
  return `${trim(fraction * 100)} %`;
}

export function formatCelsius(value: number | undefined): string {
  if (value === undefined || !Number.isFinite(value)) return NO_NUMBER;
  return `${trim(Math.round(value))} °C`;
}

/** A figure with a fixed number of decimals (power factor 0.950, cost 12.50); the exponent form past a million. */
export function formatFixed(value: number | undefined, decimals: number): string {
  if (value === undefined || !Number.isFinite(value)) return NO_NUMBER;
  return Math.abs(value) < 1e6 ? value.toFixed(decimals) : displayNumber(value);
}

/** Hours as a plain number ("89400 h"): a capacitor life is read in hours, not kilo-hours. */
export function formatHours(value: number | undefined): string {
  return value === undefined || !Number.isFinite(value) ? NO_NUMBER : `${displayNumber(value)} h`;
}

/** Human names of the rectifier kinds. */
export const KIND_NAMES: Readonly<Record<string, string>> = {
  'diode-bridge': 'diode bridge',
  'active-bridge': 'synchronous MOSFET bridge',
  'hybrid-bridge': 'hybrid bridge',
  'half-wave': 'half-wave rectifier',
  'centre-tap': 'centre-tapped full-wave rectifier',
  doubler: 'voltage doubler',
  'three-phase-bridge': 'three-phase bridge',
};
