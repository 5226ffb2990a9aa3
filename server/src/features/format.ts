/** Display formatting at the edge: SI values to short strings with engineering prefixes. */

const PREFIXES: [number, string][] = [[1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n']];

/** `formatSi(0.0142, 'W')` → `14.2 mW`; three significant figures, no trailing zeros. */
export function formatSi(value: number | undefined, unit: string): string {
  if (value === undefined || !Number.isFinite(value)) return '—';
  const magnitude = Math.abs(value);
  if (magnitude === 0) return `0 ${unit}`;
  const [factor, prefix] = PREFIXES.find(([f]) => magnitude >= f * 0.9995) ?? PREFIXES[PREFIXES.length - 1]!;
  return `${trim(value / factor)} ${prefix}${unit}`;
}

/** A plain number with three significant figures (≥ 100 shown whole). */
export function trim(value: number): string {
  if (Math.abs(value) >= 100) return Math.round(value).toString();
  return Number(value.toPrecision(3)).toString();
}

export function formatPercent(fraction: number | undefined): string {
  if (fraction === undefined || !Number.isFinite(fraction)) return '—';
  return `${trim(fraction * 100)} %`;
}

export function formatCelsius(value: number | undefined): string {
  if (value === undefined || !Number.isFinite(value)) return '—';
  return `${Math.round(value)} °C`;
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
