/**
 * A cursor written inside a fixture: `$0` marks the place an editor request is made at, and `$1`
 * an optional second place (a selection's end, a rename's target). The markers are taken out, so
 * the text is the netlist the editor would hold and the offsets point into it:
 *
 *     D1 A P D$0R      → offset of the `R` of `DR`
 *     D1 $0A P$1 DR    → a selection over `A P`
 *
 * `$` has no meaning in the netlist language, so a marker never clashes with fixture text.
 */
export interface Cursor {
  /** The fixture without its markers. */
  text: string;
  /** Where `$0` stood. */
  offset: number;
  /** Where `$1` stood, when the fixture has one. */
  second?: number;
}

const MARKER = /\$([01])/g;

/** Reads the `$0` (required, once) and `$1` (optional, once) markers of a fixture. */
export function readCursor(fixture: string): Cursor {
  const places: Partial<Record<'0' | '1', number>> = {};
  let removed = 0;
  const text = fixture.replace(MARKER, (marker, which: '0' | '1', at: number) => {
    if (places[which] !== undefined) throw new Error(`the fixture has two $${which} markers`);
    places[which] = at - removed;
    removed += marker.length;
    return '';
  });
  if (places['0'] === undefined) throw new Error('the fixture has no $0 cursor');
  return places['1'] === undefined ? { text, offset: places['0'] } : { text, offset: places['0'], second: places['1'] };
}

/** The text between the two markers (`$0` … `$1`, in either order): what a selection covers. */
export function selected(cursor: Cursor): string {
  if (cursor.second === undefined) return '';
  return cursor.text.slice(Math.min(cursor.offset, cursor.second), Math.max(cursor.offset, cursor.second));
}
