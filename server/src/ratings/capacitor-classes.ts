/**
 * Standard rated-voltage classes of aluminium electrolytic capacitors, for the fix that raises a
 * capacitor's rating to the next class.
 */

/**
 * Rated voltages offered across the trade (common practice; no standard is cited for the list as
 * a whole). Many are R10 preferred numbers of ISO 3 (6.3, 10, 16, 25, 63, 100, 160, 250, 400 —
 * from memory); the others (35, 50, 200, 350, 450) are established trade classes.
 */
export const ALUMINIUM_ELECTROLYTIC_VOLTAGE_CLASSES_V: readonly number[] = [
  6.3, 10, 16, 25, 35, 50, 63, 100, 160, 200, 250, 350, 400, 450,
];

/** The origin text a hint shows beside a class from this list. */
export const CAPACITOR_CLASS_SOURCE = 'standard aluminium-electrolytic voltage classes (common practice)';

/**
 * The lowest class whose rated voltage is at least `requiredV` (a value exactly on a class is
 * that class). Undefined above the highest class, where no single electrolytic will do and the
 * fix must propose something else (two in series, another technology).
 */
export function nextCapacitorVoltageClass(
  requiredV: number,
  classesV: readonly number[] = ALUMINIUM_ELECTROLYTIC_VOLTAGE_CLASSES_V,
): number | undefined {
  if (!Number.isFinite(requiredV)) return undefined;
  // A relative tolerance keeps 0.8·rating round trips (e.g. 280 V / 0.8 = 350.00000000000006)
  // on the class they came from.
  return classesV.find((classV) => classV >= requiredV * (1 - 1e-9));
}
