/**
 * One edit of a root file as a move of offsets, for the posted analysis (posted-analysis.ts): a
 * rectifier that an edit elsewhere left alone is the one the main thread holds with the root's
 * offsets after the edit moved. The worker proves that, value by value, before it posts the
 * pointer instead of the rectifier; the main thread makes the same move on its copy.
 */
import { isDeepStrictEqual } from 'node:util';

/** Offsets of `uri` at or after `from` (in the old text) moved by `delta`. */
export interface RootEdit {
  uri: string;
  from: number;
  delta: number;
}

/** The edit between two texts of a root: where they stop agreeing from the end, and the change in length. */
export function rootEditBetween(uri: string, before: string, after: string): RootEdit {
  const delta = after.length - before.length;
  const limit = Math.min(before.length, after.length);
  let same = 0;
  // Compared a block at a time from the end (a block compare is a memcmp), then character by character.
  const block = 4096;
  while (same + block <= limit && before.slice(before.length - same - block, before.length - same) === after.slice(after.length - same - block, after.length - same)) same += block;
  while (same < limit && before.charCodeAt(before.length - 1 - same) === after.charCodeAt(after.length - 1 - same)) same++;
  return { uri, from: before.length - same, delta };
}

/**
 * A copy of `value` with the offsets (`start`/`end`) of the edited root moved. An object's offsets
 * belong to the file its own `uri` names, else to its nearest owner's; the fields named in `shared`
 * are kept as the same objects (solver data, which holds no offsets). Anything but plain objects
 * and arrays is kept as it is: a proof by `sameAfterEdit` fails if that was wrong.
 */
export function movedByEdit<T>(value: T, edit: RootEdit, shared: ReadonlySet<string>, inRoot = false): T {
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map((item) => movedByEdit(item, edit, shared, inRoot)) as T;
  if (Object.getPrototypeOf(value) !== Object.prototype) return value;
  const fields = value as Record<string, unknown>;
  const owner = typeof fields.uri === 'string' ? fields.uri === edit.uri : inRoot;
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(fields)) {
    const field = fields[key];
    if (shared.has(key)) out[key] = field;
    else if (typeof field === 'number') out[key] = owner && (key === 'start' || key === 'end') ? movedOffset(field, key, fields.start, edit) : field;
    else out[key] = movedByEdit(field, edit, shared, owner);
  }
  return out as T;
}

/**
 * Moves the root's offsets in `value` in place, as `movedByEdit` would in a copy: for a value no
 * one reads at its old offsets any more (the main thread's held analysis as it is replaced). Only
 * the set of objects already moved is allocated, so that an object reached twice (a structured
 * clone keeps shared objects shared) moves once.
 */
export function moveInPlace(value: unknown, edit: RootEdit, shared: ReadonlySet<string>, inRoot = false, moved = new Set<object>()): void {
  if (value === null || typeof value !== 'object' || moved.has(value)) return;
  moved.add(value);
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) moveInPlace(value[i], edit, shared, inRoot, moved);
    return;
  }
  if (Object.getPrototypeOf(value) !== Object.prototype) return;
  const fields = value as Record<string, unknown>;
  const owner = typeof fields.uri === 'string' ? fields.uri === edit.uri : inRoot;
  // Both offsets are read before either is moved: where an end moves depends on its start.
  const start = fields.start;
  for (const key in fields) {
    const field = fields[key];
    if (typeof field === 'number') {
      // Stored only when it moves: a store through a key read in a walk over mixed shapes is slow.
      if (owner && (key === 'start' || key === 'end')) {
        const offset = movedOffset(field, key, start, edit);
        if (offset !== field) fields[key] = offset;
      }
    } else if (field !== null && typeof field === 'object' && !shared.has(key)) moveInPlace(field, edit, shared, owner, moved);
  }
}

/**
 * Text inserted at `from` comes after a range that ends there (ends are exclusive) and before one
 * that starts there; an empty range there moves with its start.
 */
function movedOffset(offset: number, key: 'start' | 'end', rangeStart: unknown, edit: RootEdit): number {
  const moves = key === 'start' || offset === rangeStart ? offset >= edit.from : offset > edit.from;
  return moves ? offset + edit.delta : offset;
}

/**
 * Moves the root's offsets in `before` by the edit, in place, and says whether it then equals `now`
 * (the fields in `shared` compared as objects, by identity). Stops at the first difference, so a
 * `before` that does not match is left part moved and must be dropped. Compared as it walks, with
 * nothing allocated: this runs for every rectifier on every edit.
 */
export function movedInPlaceMatches(before: unknown, now: unknown, edit: RootEdit, shared: ReadonlySet<string>, inRoot = false): boolean {
  if (before === null || typeof before !== 'object' || now === null || typeof now !== 'object') return Object.is(before, now);
  if (Array.isArray(before)) {
    if (!Array.isArray(now) || before.length !== now.length) return false;
    for (let i = 0; i < before.length; i++) if (!movedInPlaceMatches(before[i], now[i], edit, shared, inRoot)) return false;
    return true;
  }
  if (Object.getPrototypeOf(before) !== Object.prototype) return isDeepStrictEqual(before, now);
  if (Object.getPrototypeOf(now) !== Object.prototype) return false;
  const fields = before as Record<string, unknown>;
  const other = now as Record<string, unknown>;
  const owner = typeof fields.uri === 'string' ? fields.uri === edit.uri : inRoot;
  // Keys counted with for-in rather than listed: no array per object (plain objects have no inherited enumerable keys).
  let count = 0;
  for (const _ in other) count++;
  // Both offsets are read before either is moved: where an end moves depends on its start.
  const start = fields.start;
  for (const key in fields) {
    count--;
    const field = fields[key];
    const theirs = other[key];
    if (theirs === undefined && !(key in other)) return false;
    if (typeof field === 'number') {
      if (owner && (key === 'start' || key === 'end')) {
        // Stored only when it moves: a store through a key read in a walk over mixed shapes is slow.
        const offset = movedOffset(field, key, start, edit);
        if (offset !== field) fields[key] = offset;
        if (offset !== theirs) return false;
      } else if (!Object.is(field, theirs)) return false;
    } else if (field === null || typeof field !== 'object') {
      if (!Object.is(field, theirs)) return false;
    } else if (shared.has(key)) {
      if (field !== theirs) return false;
    } else if (!movedInPlaceMatches(field, theirs, edit, shared, owner)) return false;
  }
  return count === 0;
}
