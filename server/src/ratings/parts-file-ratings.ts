/**
 * Parts-file entries as rating records with origins, and as candidates for the part-swap fix.
 */
import { fitForwardModel } from './forward-model';
import type { PartsFile, PartsFileEntry } from './parts-file-format';
import type { DiodePart, DiodeRatings, PartKind, PartRatings, RatingOrigin } from './rating-records';

/**
 * The first entry of the given kind whose name or alias is `name` (case-insensitive), searching
 * the files in order.
 */
export function findPartsEntry(
  files: readonly PartsFile[],
  kind: PartKind,
  name: string,
): { file: PartsFile; entry: PartsFileEntry } | undefined {
  const wanted = name.toLowerCase();
  for (const file of files) {
    const entry = file.entries.find((e) => e.kind === kind && [e.name, ...e.aliases].some((n) => n.toLowerCase() === wanted));
    if (entry) return { file, entry };
  }
  return undefined;
}

/** An entry's ratings, each value pointing at its field in the file. */
export function partsEntryRatings(file: PartsFile, entry: PartsFileEntry): PartRatings {
  const origin = (field: string): RatingOrigin => ({
    kind: 'parts-file',
    uri: file.uri,
    partName: entry.name,
    pointer: `/parts/${entry.index}/${field}`,
  });
  const record: Record<string, unknown> = { kind: entry.kind };
  for (const [field, value] of Object.entries(entry.values)) record[field] = { value, origin: origin(field) };
  if (entry.technology) record.technology = { value: entry.technology, origin: origin('technology') };
  if (entry.vfPoints) record.vfPoints = { value: entry.vfPoints, origin: origin('vfPoints') };
  return record as unknown as PartRatings;
}

/** Every diode of the files as a candidate part, with a forward model when it gives points. */
export function diodePartsFromFiles(files: readonly PartsFile[]): DiodePart[] {
  return files.flatMap((file) =>
    file.entries
      .filter((entry) => entry.kind === 'diode')
      .map((entry) => {
        const ratings = partsEntryRatings(file, entry) as DiodeRatings;
        const points = entry.vfPoints;
        const forwardModel = points
          ? fitForwardModel(points, entry.technology ?? 'silicon', `fitted by Rectilens to the vfPoints of ${entry.name}`)
          : undefined;
        return forwardModel ? { name: entry.name, ratings, forwardModel } : { name: entry.name, ratings };
      }),
  );
}
