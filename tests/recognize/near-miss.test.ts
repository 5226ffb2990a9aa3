/** Would-be bridges with one reversed device: an error naming it, and a fix that makes a bridge. */
import { describe, expect, it } from 'vitest';
import type { TextEdit } from '../../server/src/findings/index';
import { build, PACKAGE, recognize, type Form } from './check';
import { NEAR_MISSES } from './fixtures';

function applyEdits(text: string, edits: readonly TextEdit[]): string {
  return [...edits].sort((a, b) => b.span.start - a.span.start).reduce((t, e) => t.slice(0, e.span.start) + e.newText + t.slice(e.span.end), text);
}

describe.each(NEAR_MISSES)('$name', (fixture) => {
  it.each<Form>(['flat', 'wrapped'])('is a reversed-device error with a swap fix (%s)', (form) => {
    const text = build(fixture, form);
    const { result } = recognize(text);
    expect(result.rectifiers).toEqual([]);
    expect(result.nearMisses).toHaveLength(1);
    const errors = result.diagnostics.filter((d) => d.code === 'reversed-device');
    expect(errors).toHaveLength(1);
    const error = errors[0]!;
    const name = form === 'flat' ? fixture.reversed : `${PACKAGE}.${fixture.reversed}`;
    expect(error.severity).toBe('error');
    expect(error.message).toContain(`${name} is reversed`);
    // The finding sits on the device's card at top level, on the package's X card when wrapped.
    expect(text.slice(error.span.start, error.span.end)).toBe(form === 'flat' ? fixture.reversed : PACKAGE);
    const edits = error.fixes![0]!.edits;
    const pins = fixture.swap.map((n) => (form === 'flat' ? n : `pin${fixture.ports.indexOf(n)}`));
    expect(edits.map((e) => text.slice(e.span.start, e.span.end))).toEqual(pins);
    expect(edits.map((e) => e.newText)).toEqual([...pins].reverse());
    // After the fix the bridge is whole and the error is gone.
    const fixed = recognize(applyEdits(text, edits)).result;
    expect(fixed.nearMisses).toEqual([]);
    expect(fixed.diagnostics.filter((d) => d.code === 'reversed-device')).toEqual([]);
    expect(fixed.rectifiers.map((r) => r.kind)).toEqual([fixture.name.startsWith('active') ? 'active-bridge' : 'diode-bridge']);
  });
});
