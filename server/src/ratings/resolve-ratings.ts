/**
 * Resolution of a part's ratings, value by value, in this order of precedence:
 *
 * 1. a `*@ rate` directive naming the instance;
 * 2. a `*@ rate` directive naming its model;
 * 3. a workspace parts file entry for the model name (first file, first entry wins);
 * 4. the built-in catalog, by model name;
 * 5. `.model … BV=` as VRRM, said so in the origin's note.
 *
 * A source higher up overrides one lower down key by key, so `*@ rate D1 ifsm=50A` on a 1N4007
 * keeps the catalog's VRRM. Among directives for one target, the later one in reading order wins.
 * IFSM and its duration travel together: the duration always comes from the source of the IFSM.
 */
import type { Directive, RateDirective, RatingEntry, Span } from '../../../grammar/src/index';
import { findCatalogDiode, DIODE_CATALOG } from './diode-catalog';
import type { CatalogDiode } from './diode-catalog';
import { fitForwardModel } from './forward-model';
import type { ModelInput } from './model-input';
import type { PartsFile } from './parts-file-format';
import { partsEntryRatings, findPartsEntry } from './parts-file-ratings';
import { BV_FALLBACK_NOTE, DEFAULT_IFSM_DURATION_ORIGIN, DEFAULT_IFSM_DURATION_S } from './rating-origin';
import type { ForwardModel, PartKind, PartRatings, Rated, RatingsOf } from './rating-records';
import { ratingFieldFor } from './rating-fields';

/** A directive with the file it came from (the circuit layer's `PlacedDirective` fits). */
export interface PlacedDirectiveInput {
  uri: string;
  directive: Directive;
}

/** Everything ratings may come from; plain data the adapter has already read. */
export interface RatingSources {
  /** Every directive of every file, in reading order (non-`rate` ones are skipped). */
  directives: readonly PlacedDirectiveInput[];
  /** Validated workspace parts files, in precedence order. */
  partsFiles?: readonly PartsFile[];
  /** Defaults to the built-in {@link DIODE_CATALOG}. */
  catalog?: readonly CatalogDiode[];
}

/** The part whose ratings are wanted. */
export interface RatingQuery<K extends PartKind = PartKind> {
  kind: K;
  /** Instance name as the netlist knows it (`D1`, or `X1.D3` for a flattened element). */
  instanceName?: string;
  /** Model (or, for a controller, subcircuit) name, when there is no model record to pass. */
  modelName?: string;
  /** The element's `.model`, for its name and the BV fallback. */
  model?: ModelInput;
}

/** A `rate` entry that cannot apply to the part it names. */
export interface RatingProblem {
  uri: string;
  span: Span;
  message: string;
}

export interface ResolvedRatings<K extends PartKind = PartKind> {
  ratings: RatingsOf<K>;
  /** For a diode: a SPICE model fitted to the resolved forward points, if there are enough. */
  forwardModel?: ForwardModel;
  problems: RatingProblem[];
}

/**
 * Prepares the sources once (an index of rate directives by lowercase target) and returns a
 * resolver to call per part. Use this when resolving every device of a netlist.
 */
export function createRatingResolver(sources: RatingSources): <K extends PartKind>(query: RatingQuery<K>) => ResolvedRatings<K> {
  const byTarget = new Map<string, { uri: string; directive: RateDirective }[]>();
  for (const placed of sources.directives) {
    const d = placed.directive;
    if (d.keyword !== 'rate' || !d.target) continue;
    const key = d.target.text.toLowerCase();
    byTarget.set(key, [...(byTarget.get(key) ?? []), { uri: placed.uri, directive: d }]);
  }
  const catalog = sources.catalog ?? DIODE_CATALOG;
  const files = sources.partsFiles ?? [];
  return <K extends PartKind>(query: RatingQuery<K>): ResolvedRatings<K> => {
    const problems: RatingProblem[] = [];
    const modelName = query.model?.name ?? query.modelName;
    const layers: Partial<PartRatings>[] = [];
    const fromDirectives = (name: string | undefined, target: 'instance' | 'model'): void => {
      const placed = name === undefined ? [] : (byTarget.get(name.toLowerCase()) ?? []);
      // Later directives win, so they are layered first.
      for (const p of [...placed].reverse()) layers.push(directiveLayer(query.kind, p.uri, p.directive, target, problems));
    };
    fromDirectives(query.instanceName, 'instance');
    fromDirectives(modelName, 'model');
    const entry = modelName === undefined ? undefined : findPartsEntry(files, query.kind, modelName);
    if (entry) layers.push(partsEntryRatings(entry.file, entry.entry));
    const catalogEntry = query.kind === 'diode' && modelName !== undefined ? findCatalogDiode(modelName, catalog) : undefined;
    if (catalogEntry) layers.push(catalogEntry.ratings);
    if (query.kind === 'diode' && query.model) layers.push(modelLayer(query.model));
    const ratings = mergeLayers(query.kind, layers) as RatingsOf<K>;
    return { ratings, forwardModel: suggestForwardModel(ratings), problems };
  };
}

/** Resolves one part's ratings. For many parts, {@link createRatingResolver} indexes once. */
export function resolveRatings<K extends PartKind>(query: RatingQuery<K>, sources: RatingSources): ResolvedRatings<K> {
  return createRatingResolver(sources)(query);
}

function directiveLayer(kind: PartKind, uri: string, d: RateDirective, target: 'instance' | 'model', problems: RatingProblem[]): Partial<PartRatings> {
  const layer: Record<string, Rated<unknown>> = {};
  const targetName = d.target?.text ?? '';
  for (const entry of d.entries) {
    const field = ratingFieldFor(kind, entry.key);
    if (!field) {
      problems.push({ uri, span: entry.span, message: `${entry.key} does not apply to a ${kind}; it is ignored` });
      continue;
    }
    const origin = { kind: 'rate-directive' as const, target, targetName, uri, span: entry.span };
    if (entry.key === 'iq' && entry.points) {
      layer.iqPoints = { value: entry.points, origin };
      continue;
    }
    const value = entryValue(entry);
    if (value === undefined) continue;
    layer[field] = { value, origin };
    if (entry.key === 'ifsm' && entry.durationS !== undefined) layer.ifsmDurationS = { value: entry.durationS, origin };
  }
  return layer as Partial<PartRatings>;
}

function entryValue(entry: RatingEntry): unknown {
  if (entry.key === 'vf') return entry.points && entry.points.length > 0 ? entry.points : undefined;
  if (entry.range) return entry.range;
  if (entry.key === 'endurance') return entry.value === undefined || entry.atC === undefined ? undefined : { hours: entry.value, atC: entry.atC };
  return entry.value;
}

function modelLayer(model: ModelInput): Partial<PartRatings> {
  const bv = model.params.bv;
  if (!(bv !== undefined && bv > 0 && Number.isFinite(bv))) return {};
  const span = model.paramSpans?.bv ?? model.span;
  return {
    kind: 'diode',
    vrrmV: { value: bv, origin: { kind: 'model-param', param: 'bv', modelName: model.name, uri: model.uri, span, note: BV_FALLBACK_NOTE } },
  };
}

/** First layer that has a field wins; IFSM's duration follows the layer that gave IFSM. */
function mergeLayers(kind: PartKind, layers: readonly Partial<PartRatings>[]): PartRatings {
  const merged: Record<string, unknown> = { kind };
  for (const layer of layers) {
    for (const [field, rated] of Object.entries(layer)) {
      if (field === 'kind' || field === 'ifsmDurationS' || rated === undefined || field in merged) continue;
      merged[field] = rated;
      if (field === 'ifsmA') merged.ifsmDurationS = (layer as { ifsmDurationS?: Rated<number> }).ifsmDurationS;
    }
  }
  if (kind === 'diode' && merged.ifsmA && !merged.ifsmDurationS) {
    merged.ifsmDurationS = { value: DEFAULT_IFSM_DURATION_S, origin: DEFAULT_IFSM_DURATION_ORIGIN };
  }
  return merged as unknown as PartRatings;
}

function suggestForwardModel(ratings: PartRatings): ForwardModel | undefined {
  if (ratings.kind !== 'diode' || !ratings.vfPoints) return undefined;
  const technology = ratings.technology?.value ?? 'silicon';
  return fitForwardModel(ratings.vfPoints.value, technology, 'fitted by Rectilens to the resolved vf points');
}
