/**
 * Whether a construction of the comparison passes the file's own policy: every device's
 * worst-case figures against its part's ratings through the one stress judge
 * (ratings/stress-checks.ts), each failure named by the rule `check` would report it under. A
 * device with no part behind it (the comparison's generic MOSFET) cannot be judged: the row says
 * what ratings its part would need instead of passing.
 */
import { displayNumber as trim } from '../../../grammar/src/index';
import { leastPassingRatings, stressVerdicts, type DeratingPolicy, type DiodeRatings, type MosfetRatings, type StressKind, type StressVerdict } from '../ratings/index';
import { RULE_OF_STRESS, RUNAWAY_RULE } from '../rules/stress-codes';
import type { DeviceFigures } from '../solve/index';

export interface RowFailure {
  /** The devices that fail it alike (a bridge's four usually do). */
  devices: string[];
  /** The finding code `check` would report it under. */
  code: string;
  /** In plain words, with the figure, the limit and the rating. */
  text: string;
}

export interface RowVerdict {
  /** `pass`: every device judged and every stress within the policy; `unjudged`: some device has no part to judge. */
  status: 'pass' | 'fail' | 'unjudged';
  failures: RowFailure[];
  /** Devices with no part behind them, and the least ratings their part would need. */
  unrated: { devices: string[]; needs: string }[];
}

export interface JudgedDevice {
  name: string;
  kind: 'diode' | 'mosfet';
  figures: DeviceFigures;
  ratings?: DiodeRatings | MosfetRatings;
}

const UNITS: Readonly<Record<StressKind, string>> = {
  'reverse-voltage': 'V', vds: 'V', 'average-current': 'A', 'drain-current': 'A', surge: 'A', 'junction-temperature': '°C',
};

const WORDS: Readonly<Record<StressKind, string>> = {
  'reverse-voltage': 'reverse voltage', vds: 'blocking voltage', 'average-current': 'average current', 'drain-current': 'RMS current',
  surge: 'switch-on surge', 'junction-temperature': 'junction temperature',
};

export function judgeRow(devices: readonly JudgedDevice[], policy: DeratingPolicy): RowVerdict {
  const failures = new Map<string, RowFailure>();
  const unrated = new Map<string, RowVerdict['unrated'][number]>();
  const fail = (device: string, code: string, text: string) => {
    const id = `${code}\u0000${text}`;
    const known = failures.get(id);
    if (known) known.devices.push(device);
    else failures.set(id, { devices: [device], code, text });
  };
  for (const d of devices) {
    if (d.figures.worst?.thermalRunaway) fail(d.name, RUNAWAY_RULE, 'its junction temperature does not settle (thermal runaway)');
    if (!d.ratings) {
      const text = needs(d, policy);
      const known = unrated.get(text);
      if (known) known.devices.push(d.name);
      else unrated.set(text, { devices: [d.name], needs: text });
      continue;
    }
    for (const v of stressVerdicts(d.figures, d.ratings, policy)) {
      if (v.status !== 'pass' && v.status !== 'runaway') fail(d.name, RULE_OF_STRESS[v.stress], failureText(v));
    }
  }
  const status = failures.size ? 'fail' : unrated.size ? 'unjudged' : 'pass';
  return { status, failures: [...failures.values()], unrated: [...unrated.values()] };
}

function failureText(v: StressVerdict): string {
  const unit = UNITS[v.stress];
  const what = `${WORDS[v.stress]} ${trim(v.figure)} ${unit}`;
  if (v.status === 'unrated') return `${what}, not rated by its part`;
  return `${what} against a limit of ${trim(v.limit!)} ${unit} (rating ${trim(v.rating!)} ${unit})`;
}

/** The least ratings a part in this place would need, in words. */
function needs(device: JudgedDevice, policy: DeratingPolicy): string {
  const least = leastPassingRatings(device.figures, policy);
  const at = (label: string, value: number | undefined, unit: string) => (value !== undefined ? `${label} ≥ ${trim(value)} ${unit}` : undefined);
  const parts = (device.kind === 'mosfet'
    ? [at('VDS', least.vdsV, 'V'), at('ID', least.idA, 'A')]
    : [at('VRRM', least.vrrmV, 'V'), at('IF(AV)', least.ifavA, 'A')]
  ).filter((p): p is string => p !== undefined);
  return parts.join(', ') || 'ratings for the stresses it sees';
}

/** A verdict in a few words, for a table cell: passes, the rules it fails, or that its parts are not rated. */
export function verdictSummary(v: RowVerdict): string {
  if (v.status === 'pass') return 'passes';
  if (v.status === 'fail') return `fails ${[...new Set(v.failures.map((f) => f.code))].join(', ')}`;
  return 'parts not rated';
}
