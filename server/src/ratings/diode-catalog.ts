/**
 * The built-in catalog: JEDEC-registered generic rectifier diodes, each value with its source.
 *
 * Only the VRRM ladders and the average-current classes are sourced (REFERENCES.md §7). No
 * non-manufacturer source exists for IFSM, VF, Tjmax or the package's thermal resistance, and
 * makers disagree with one another, so those are typical class values from memory, marked as
 * such, never check values. The forward
 * points are generic class values of our own choosing, and the SPICE model is our own fit to them.
 * No manufacturer's datasheet or model was used.
 */
import { fitForwardModel } from './forward-model';
import type { Confidence, DiodePart, DiodeRatings, DiodeTechnology, ForwardPoint, Rated } from './rating-records';

/** A catalog diode: a part with its series and the source of its ladder. */
export interface CatalogDiode extends DiodePart {
  series: CatalogSeriesId;
  /** Package outline named with the series in the source. */
  packageName: CatalogPackage;
}

export type CatalogSeriesId = '1n4001' | '1n5400' | '1n5817' | '1n5820';

/**
 * Source of the 1N400x and 1N540x ladders (REFERENCES.md §7, C). These strings reach users in
 * hovers and messages, so they name the published source itself, never our reference notes.
 */
export const SOURCE_1N400X_LADDER =
  'Wikipedia, "1N400x rectifier diodes" (JEDEC registration, 1963)';
/** Source of the 1N5817–19 ladder (REFERENCES.md §7: only a non-authoritative page besides makers). */
export const SOURCE_1N5817_LADDER =
  '20/30/40 V at 1 A: common practice, found only on makers\' sheets and one non-authoritative web page';
/** The 3 A Schottky series has no source in REFERENCES.md. */
export const SOURCE_1N5820_LADDER = 'from memory (no published source found)';
/** IFSM, its duration and Tjmax of every entry. */
export const SOURCE_TYPICAL = 'typical class value, from memory, not a check value';
/** The forward points of every entry. */
export const SOURCE_CLASS_POINTS = 'generic forward points of our own choosing for the class, not measured';

/** The packages of the catalog. */
export type CatalogPackage = 'DO-41' | 'DO-201AD';

/**
 * Default junction-to-ambient thermal resistance per package, K/W: typical values, from memory
 * (no published source found), for a part on a circuit board with leads of about 10 mm in still
 * air. A `*@ rate … rthja=` line or a parts file overrides it, as for any catalog value.
 */
export const PACKAGE_RTHJA_K_PER_W: Readonly<Record<CatalogPackage, number>> = { 'DO-41': 50, 'DO-201AD': 20 };

/** The source of {@link PACKAGE_RTHJA_K_PER_W}, as hovers and messages show it. */
export function packageRthjaSource(packageName: CatalogPackage): string {
  return `typical RθJA of the ${packageName} package on a board with about 10 mm leads, from memory, not a check value`;
}

interface SeriesSpec {
  id: CatalogSeriesId;
  technology: DiodeTechnology;
  packageName: CatalogPackage;
  ladder: readonly (readonly [partNumber: string, vrrmV: number])[];
  ladderSource: string;
  ladderConfidence: Confidence;
  ifavA: number;
  /** From memory; the lower of the figures commonly seen, because makers disagree. */
  ifsmA: number;
  tjmaxC: number;
  vfPoints: readonly ForwardPoint[];
}

const SERIES: readonly SeriesSpec[] = [
  {
    id: '1n4001',
    technology: 'silicon',
    packageName: 'DO-41',
    ladder: [['1N4001', 50], ['1N4002', 100], ['1N4003', 200], ['1N4004', 400], ['1N4005', 600], ['1N4006', 800], ['1N4007', 1000]],
    ladderSource: SOURCE_1N400X_LADDER,
    ladderConfidence: 'confirmed',
    ifavA: 1,
    ifsmA: 30,
    tjmaxC: 150,
    vfPoints: [{ vV: 0.65, iA: 0.01 }, { vV: 0.78, iA: 0.1 }, { vV: 0.95, iA: 1 }],
  },
  {
    id: '1n5400',
    technology: 'silicon',
    packageName: 'DO-201AD',
    ladder: [
      ['1N5400', 50], ['1N5401', 100], ['1N5402', 200], ['1N5403', 300], ['1N5404', 400],
      ['1N5405', 500], ['1N5406', 600], ['1N5407', 800], ['1N5408', 1000],
    ],
    ladderSource: SOURCE_1N400X_LADDER,
    ladderConfidence: 'confirmed',
    ifavA: 3,
    ifsmA: 200,
    tjmaxC: 150,
    vfPoints: [{ vV: 0.7, iA: 0.1 }, { vV: 0.82, iA: 1 }, { vV: 0.95, iA: 3 }],
  },
  {
    id: '1n5817',
    technology: 'schottky',
    packageName: 'DO-41',
    ladder: [['1N5817', 20], ['1N5818', 30], ['1N5819', 40]],
    ladderSource: SOURCE_1N5817_LADDER,
    ladderConfidence: 'weak',
    ifavA: 1,
    ifsmA: 25,
    tjmaxC: 125,
    vfPoints: [{ vV: 0.25, iA: 0.01 }, { vV: 0.34, iA: 0.1 }, { vV: 0.5, iA: 1 }],
  },
  {
    id: '1n5820',
    technology: 'schottky',
    packageName: 'DO-201AD',
    ladder: [['1N5820', 20], ['1N5821', 30], ['1N5822', 40]],
    ladderSource: SOURCE_1N5820_LADDER,
    ladderConfidence: 'from-memory',
    ifavA: 3,
    ifsmA: 80,
    tjmaxC: 125,
    vfPoints: [{ vV: 0.28, iA: 0.1 }, { vV: 0.38, iA: 1 }, { vV: 0.48, iA: 3 }],
  },
];

/** Every catalog diode, ladder order within each series. */
export const DIODE_CATALOG: readonly CatalogDiode[] = SERIES.flatMap((spec) => spec.ladder.map(([name, vrrmV]) => buildEntry(spec, name, vrrmV)));

/**
 * Finds a catalog diode by a `.model` name: case-insensitive, and also with the leading `D` that
 * netlist libraries commonly put before a part number (`D1N4007`), which is common practice.
 */
export function findCatalogDiode(modelName: string, catalog: readonly CatalogDiode[] = DIODE_CATALOG): CatalogDiode | undefined {
  const wanted = modelName.trim().toUpperCase();
  const bare = /^D1N\d/.test(wanted) ? wanted.slice(1) : wanted;
  return catalog.find((entry) => entry.name.toUpperCase() === bare);
}

function buildEntry(spec: SeriesSpec, name: string, vrrmV: number): CatalogDiode {
  const cite = (value: number, source: string, confidence: Confidence): Rated<number> => ({
    value,
    origin: { kind: 'catalog', partName: name, source, confidence },
  });
  const ratings: DiodeRatings = {
    kind: 'diode',
    vrrmV: cite(vrrmV, spec.ladderSource, spec.ladderConfidence),
    ifavA: cite(spec.ifavA, spec.ladderSource, spec.ladderConfidence),
    ifsmA: cite(spec.ifsmA, SOURCE_TYPICAL, 'from-memory'),
    // The 8.3 ms half-sine is the JEDEC-method convention (REFERENCES.md §5, C); that these
    // parts are rated on it is recalled, not sourced.
    ifsmDurationS: cite(0.0083, `${SOURCE_TYPICAL}; 8.3 ms is the half-sine of the "JEDEC method" that makers' sheets name`, 'from-memory'),
    tjmaxC: cite(spec.tjmaxC, SOURCE_TYPICAL, 'from-memory'),
    rthjaKPerW: cite(PACKAGE_RTHJA_K_PER_W[spec.packageName], packageRthjaSource(spec.packageName), 'from-memory'),
    vfPoints: { value: spec.vfPoints, origin: { kind: 'catalog', partName: name, source: SOURCE_CLASS_POINTS, confidence: 'chosen' } },
    technology: {
      value: spec.technology,
      origin: { kind: 'catalog', partName: name, source: spec.ladderSource, confidence: spec.ladderConfidence },
    },
  };
  const note = `Rectilens fit to ${SOURCE_CLASS_POINTS} (${name} class)`;
  return { name, series: spec.id, packageName: spec.packageName, ratings, forwardModel: fitForwardModel(spec.vfPoints, spec.technology, note) };
}
