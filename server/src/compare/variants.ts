/**
 * The four constructions of a single-phase bridge that the topology comparison puts side by
 * side, each built from the same equivalent circuit (same source, filter, load and corners):
 * silicon diodes, Schottky diodes, hybrid (two diodes plus two self-driven MOSFETs) and
 * synchronous (four MOSFETs gated by a controller). Only the devices change. Catalog parts are
 * picked by the stress checks under the file's own policy (ratings/stress-checks.ts).
 */
import { displayNumber as trim } from '../../../grammar/src/index';
import {
  DIODE_CATALOG, SCHOTTKY_MAX_VRRM_V, stressVerdict,
  type CatalogDiode, type CatalogSeriesId, type DeratingPolicy, type DiodeRatings, type MosfetRatings, type StressInputs, type StressKind,
} from '../ratings/index';
import { diodeParamsOfForwardModel } from '../equivalent/index';
import {
  DEFAULT_CONTROLLER_VMIN_V, DEFAULT_RDSON_TEMP_EXPONENT, SPICE_DIODE_DEFAULTS,
  type ControllerSupply, type DeviceRole, type DiodeDevice, type DiodeParams, type EquivalentCircuit, type MosfetDevice, type RectifierDevice, type RectifierKind,
} from '../solve/index';

export type VariantId = 'silicon' | 'schottky' | 'hybrid' | 'synchronous';

/** What the variants are built from: the file's circuit, its policy and its worst stresses. */
export interface VariantBasis {
  circuit: EquivalentCircuit;
  /** The file's derating policy: the catalog parts must pass its stress checks. */
  policy: DeratingPolicy;
  /** Worst reverse voltage over devices and corners. */
  pivV: number;
  /** Worst per-device average current over devices and corners. */
  iavgA: number;
  /** The controller's minimum voltage when the file has one. */
  controllerVminV?: number;
  /** The file's own MOSFET ratings (an active or hybrid bridge as drawn), which the MOSFET variants keep. */
  mosfetRatings?: MosfetRatings;
  /** The file's controller's quiescent draw (an active bridge as drawn with `iq` rated), which the synchronous variant keeps. */
  controllerSupply?: ControllerSupply;
}

/** A variant's circuit, or the reason it is not offered. */
export interface VariantPlan {
  id: VariantId;
  label: string;
  /** Its devices in words, e.g. "4 × 1N4004-class silicon (1 A)". */
  construction: string;
  circuit?: EquivalentCircuit;
  /** The ratings of each device of `circuit`, in its order: a catalog part's, the file's MOSFET's, or none (a generic part). */
  ratings?: (DiodeRatings | MosfetRatings | undefined)[];
  notApplicable?: string;
  assumptions: string[];
}

/**
 * Thermal resistance junction-to-ambient given to every variant's devices when the file rates
 * none: 60 K/W, our own assumption for a small leaded or surface-mount part on modest copper.
 */
export const ASSUMED_RTHJA_K_PER_W = 60;

/**
 * On-resistance at 25 °C assumed for the MOSFET variants when the file has no MOSFET, by the
 * reverse voltage they must block. Our own round figures for parts of each voltage class
 * (a higher-voltage channel has more resistance per area); not from any datasheet.
 */
export const ASSUMED_RDSON_BY_VOLTAGE: readonly { upToV: number; rdsOnOhm: number }[] = [
  { upToV: 40, rdsOnOhm: 0.02 },
  { upToV: 120, rdsOnOhm: 0.05 },
  { upToV: 320, rdsOnOhm: 0.15 },
  { upToV: Infinity, rdsOnOhm: 0.3 },
];

/** A device without its place in the bridge. */
type DeviceBody = Omit<DiodeDevice, 'name' | 'role'> | Omit<MosfetDevice, 'name' | 'role'>;

const BRIDGE_ROLES: readonly DeviceRole[] = ['upper-a', 'upper-b', 'lower-a', 'lower-b'];

/** Plans all four variants for a single-phase bridge. */
export function planVariants(basis: VariantBasis): VariantPlan[] {
  const rth = thermalResistance(basis.circuit);
  const rdson = onResistance(basis);
  const silicon = pickSeries(basis, 'silicon');
  const schottky = pickSeries(basis, 'schottky');
  const common = [...rth.assumptions];
  const sync: VariantPlan = planSynchronous(basis, rth.kPerW, rdson, common);
  const fet = basis.mosfetRatings;
  return [
    {
      id: 'silicon', label: 'Silicon bridge', construction: `4 × ${silicon.label}`,
      circuit: withDevices(basis.circuit, 'diode-bridge', () => diode(silicon.entry, rth.kPerW)), ratings: BRIDGE_ROLES.map(() => silicon.entry.ratings),
      assumptions: [...common, silicon.why],
    },
    planSchottky(basis, schottky, rth.kPerW, common),
    {
      id: 'hybrid', label: 'Hybrid bridge', construction: `2 × ${silicon.label} + 2 self-driven MOSFETs (${milliOhm(rdson.ohm)})`,
      circuit: withDevices(basis.circuit, 'hybrid-bridge', (role) => (role.startsWith('upper') ? diode(silicon.entry, rth.kPerW) : mosfet(rdson.ohm, 'self-driven', rth.kPerW))),
      ratings: BRIDGE_ROLES.map((role) => (role.startsWith('upper') ? silicon.entry.ratings : fet)),
      assumptions: [...common, silicon.why, ...rdson.assumptions],
    },
    sync,
  ];
}

function planSchottky(basis: VariantBasis, series: SeriesChoice, rthKPerW: number, common: string[]): VariantPlan {
  const plan: VariantPlan = { id: 'schottky', label: 'Schottky bridge', construction: `4 × ${series.label}`, assumptions: [...common, series.why] };
  if (basis.pivV > SCHOTTKY_MAX_VRRM_V) {
    plan.notApplicable = `reverse voltage ${trim(basis.pivV)} V is beyond the silicon Schottky class (up to ${SCHOTTKY_MAX_VRRM_V} V, common practice)`;
    return plan;
  }
  plan.circuit = withDevices(basis.circuit, 'diode-bridge', () => diode(series.entry, rthKPerW));
  plan.ratings = BRIDGE_ROLES.map(() => series.entry.ratings);
  if (basis.pivV > 40) plan.assumptions.push('forward law of the 40 V Schottky class; a Schottky rated for this voltage drops more, so this variant is optimistic');
  return plan;
}

function planSynchronous(basis: VariantBasis, rthKPerW: number, rdson: { ohm: number; assumptions: string[] }, common: string[]): VariantPlan {
  const vmin = basis.controllerVminV ?? DEFAULT_CONTROLLER_VMIN_V;
  const assumptions = [...common, ...rdson.assumptions];
  if (basis.controllerVminV === undefined) assumptions.push(`controller minimum operating voltage ${vmin} V (common practice); below it only the body diodes conduct`);
  const crestV = basis.circuit.source.vrms * Math.SQRT2;
  if (crestV < vmin) assumptions.push(`the source crest (${trim(crestV)} V nominal) stays below the controller's ${trim(vmin)} V: the channels never turn on`);
  const circuit = withDevices(basis.circuit, 'active-bridge', () => mosfet(rdson.ohm, 'controller', rthKPerW));
  circuit.controllerVminV = vmin;
  if (basis.controllerSupply) circuit.controllerSupply = basis.controllerSupply;
  else assumptions.push('no controller quiescent current (iq) in the file: the controller\'s own draw is not counted, so this variant is optimistic at light load');
  return {
    id: 'synchronous', label: 'Synchronous bridge', construction: `4 MOSFETs (${milliOhm(rdson.ohm)}) + controller (vmin ${vmin} V)`,
    circuit, ratings: BRIDGE_ROLES.map(() => basis.mosfetRatings), assumptions,
  };
}

interface SeriesChoice {
  entry: CatalogDiode;
  label: string;
  why: string;
}

/**
 * The 1 A or the 3 A series of the catalog: the 1 A one when its current rating passes the
 * average-current check at the worst average current under the file's policy, else the 3 A one.
 * Within the series, the lowest VRRM step that passes the reverse-voltage check, else the top.
 */
function pickSeries(basis: VariantBasis, technology: 'silicon' | 'schottky'): SeriesChoice {
  const [smallId, largeId]: CatalogSeriesId[] = technology === 'silicon' ? ['1n4001', '1n5400'] : ['1n5817', '1n5820'];
  const ladderOf = (id: CatalogSeriesId) => DIODE_CATALOG.filter((d) => d.series === id);
  const stress: StressInputs = { worst: { pivV: { value: basis.pivV }, iavgA: { value: basis.iavgA } } };
  const passes = (kind: StressKind) => (d: CatalogDiode) => stressVerdict(kind, stress, d.ratings, basis.policy)?.status === 'pass';
  const small = passes('average-current')(ladderOf(smallId)[0]!);
  const ladder = ladderOf(small ? smallId : largeId);
  const entry = ladder.find(passes('reverse-voltage')) ?? ladder[ladder.length - 1]!;
  const amps = entry.ratings.ifavA?.value ?? 0;
  const label = `${entry.name}-class ${technology === 'schottky' ? 'Schottky' : 'silicon'} (${amps} A)`;
  const why = `${technology} variant: ${amps} A catalog series for a worst average current of ${trim(basis.iavgA)} A per device; forward law fitted to the catalog's generic class points`;
  return { entry, label, why: !passes('average-current')(ladder[0]!) ? `${why}; the current exceeds the largest class in the catalog` : why };
}

function thermalResistance(circuit: EquivalentCircuit): { kPerW: number; assumptions: string[] } {
  const given = circuit.devices.map((d) => d.rthjaKPerW).find((r) => r !== undefined);
  if (given !== undefined) return { kPerW: given, assumptions: [`every variant keeps the file's thermal path, RθJA ${given} K/W per device`] };
  return { kPerW: ASSUMED_RTHJA_K_PER_W, assumptions: [`no RθJA in the file: ${ASSUMED_RTHJA_K_PER_W} K/W per device assumed for every variant (our own assumption)`] };
}

function onResistance(basis: VariantBasis): { ohm: number; assumptions: string[] } {
  const fets = basis.circuit.devices.filter((d): d is MosfetDevice => d.kind === 'mosfet');
  if (fets.length > 0) {
    const ohm = Math.max(...fets.map((f) => f.rdsOn25Ohm));
    return { ohm, assumptions: [`MOSFET on-resistance ${milliOhm(ohm)} at 25 °C from the file's MOSFETs`] };
  }
  const ohm = ASSUMED_RDSON_BY_VOLTAGE.find((c) => basis.pivV <= c.upToV)!.rdsOnOhm;
  return { ohm, assumptions: [`no MOSFET in the file: ${milliOhm(ohm)} at 25 °C assumed for a part blocking ${trim(basis.pivV)} V (our own round figure)`] };
}

/** A copy of the circuit whose devices are rebuilt per bridge role, keeping the file's names. */
function withDevices(circuit: EquivalentCircuit, kind: RectifierKind, make: (role: DeviceRole) => DeviceBody): EquivalentCircuit {
  const devices = BRIDGE_ROLES.map((role, k): RectifierDevice => {
    const existing = circuit.devices.find((d) => d.role === role);
    return { ...make(role), name: existing?.name ?? `Q${k + 1}`, role } as RectifierDevice;
  });
  const { controllerVminV: _dropped, controllerSupply: _alsoDropped, ...rest } = circuit;
  return { ...rest, kind, devices };
}

function diode(entry: CatalogDiode, rthjaKPerW: number): DeviceBody {
  const f = entry.forwardModel;
  const params: DiodeParams = f ? diodeParamsOfForwardModel(f) : { ...SPICE_DIODE_DEFAULTS };
  return { kind: 'diode', params, rthjaKPerW };
}

function mosfet(rdsOn25Ohm: number, gate: MosfetDevice['gate'], rthjaKPerW: number): DeviceBody {
  return { kind: 'mosfet', rdsOn25Ohm, rdsOnTempExponent: DEFAULT_RDSON_TEMP_EXPONENT, body: { ...SPICE_DIODE_DEFAULTS }, gate, rthjaKPerW };
}

function milliOhm(ohm: number): string {
  return `${trim(ohm * 1000)} mΩ`;
}
