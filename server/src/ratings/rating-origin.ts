/**
 * Origins in words, for hovers and finding messages, and the defaults that stand in when a part
 * says nothing.
 */
import type { Confidence, RatingOrigin } from './rating-records';

/**
 * IFSM is rated for one half-sine of 8.3 ms (a 60 Hz half-cycle, "superimposed on rated load,
 * JEDEC method") unless the part states 10 ms (a 50 Hz half-cycle). REFERENCES.md §5 (C for the
 * 8.3 ms wording); DESIGN.md §5.
 */
export const DEFAULT_IFSM_DURATION_S = 0.0083;

/** The origin attached to {@link DEFAULT_IFSM_DURATION_S} when a part gives no duration. */
export const DEFAULT_IFSM_DURATION_ORIGIN: RatingOrigin = {
  kind: 'default',
  text: 'IFSM taken as rated for one 8.3 ms half-sine (JEDEC method) because the part gives no duration',
};

/** Why `.model BV` is only a fallback: it is a breakdown voltage, not a repetitive rating. */
export const BV_FALLBACK_NOTE =
  'BV of the .model used as VRRM because no rating was given; BV is the breakdown voltage, ' +
  'not a repetitive reverse rating, so add a rate directive with vrrm';

/** A short phrase for a confidence level. */
export function describeConfidence(confidence: Confidence): string {
  switch (confidence) {
    case 'confirmed':
      return 'confirmed in a published source';
    case 'weak':
      return 'weakly sourced';
    case 'from-memory':
      return 'typical class value, from memory, not a check value';
    case 'chosen':
      return 'generic class value of our own choosing';
  }
}

/**
 * Says where a rating came from, in a sentence fragment for a hint: "rate directive for D1",
 * "parts file lib.rectilens-parts.json, part DMAIN", "catalog 1N4007 (…)", or the BV note.
 */
export function describeOrigin(origin: RatingOrigin): string {
  switch (origin.kind) {
    case 'rate-directive':
      return `rate directive for ${origin.target} ${origin.targetName}`;
    case 'parts-file':
      return `parts file ${baseName(origin.uri)}, part ${origin.partName}`;
    case 'catalog':
      return `built-in catalog ${origin.partName} (${origin.source}; ${describeConfidence(origin.confidence)})`;
    case 'model-param':
      return `.model ${origin.modelName} ${origin.param.toUpperCase()}: ${origin.note}`;
    case 'default':
      return origin.text;
  }
}

/** Whether a value may be shown as a checked fact rather than a typical or assumed one. */
export function isCheckGrade(origin: RatingOrigin): boolean {
  if (origin.kind === 'catalog') return origin.confidence === 'confirmed';
  return origin.kind === 'rate-directive' || origin.kind === 'parts-file';
}

function baseName(uri: string): string {
  const cut = Math.max(uri.lastIndexOf('/'), uri.lastIndexOf('\\'));
  return cut >= 0 ? uri.slice(cut + 1) : uri;
}
