/**
 * What an adapter hands the core for a file: its text, or a refusal saying why it was not read.
 * The adapter does the reading (and the trust, file-kind and size checks); the core only turns a
 * refusal into a finding on the card that asked for the file.
 */
import type { Severity } from '../../../grammar/src/index';

/** Why a file's text was not handed over. */
export type ReadRefusalReason =
  /** The workspace is untrusted and the file's real path lies outside its folders. */
  | 'untrusted-outside'
  /** A folder, device, named pipe or socket. */
  | 'not-a-regular-file'
  /** Larger than the file-size limit; refused by its size, not read. */
  | 'too-large'
  /** Permission, a URI that names no local file, or another system error. */
  | 'unreadable'
  /** No such file. */
  | 'missing';

export interface ReadRefusal {
  refused: ReadRefusalReason;
  /** A clause saying what was refused and why, e.g. "it is a named pipe, not a regular file". */
  reason: string;
}

/** Text, a refusal, or undefined (the adapter has no such file and says no more). */
export type FileText = string | ReadRefusal | undefined;

export function isRefusal(value: unknown): value is ReadRefusal {
  return typeof value === 'object' && value !== null && 'refused' in value && 'reason' in value;
}

/**
 * The finding code of a refusal. One mapping for includes, libraries and parts files, so the same
 * refusal reads the same wherever the gate stopped it; `missingCode` names the absent file's code
 * in the caller's terms (`missing-include` for a card).
 */
export function refusalCode(refusal: ReadRefusal | undefined, missingCode: string): string {
  switch (refusal?.refused) {
    case 'untrusted-outside':
      return 'untrusted-file';
    case 'not-a-regular-file':
    case 'unreadable':
      return 'unreadable-file';
    case 'too-large':
      return 'limit-exceeded';
    default:
      return missingCode;
  }
}

/** Every refusal is an error: the analysis lacks what the file would have given it. */
export const REFUSAL_SEVERITY: Severity = 'error';
