/** Every topology of DESIGN.md §4, flat and wrapped in a `.subckt` package. */
import { describe, expect, it } from 'vitest';
import { elaborate } from '../../server/src/circuit/index';
import { recognizeRectifiers } from '../../server/src/recognize/index';
import { rateRectifier, toEquivalentCircuit } from '../../server/src/equivalent/index';
import { createRatingResolver } from '../../server/src/ratings/index';
import { parseNetlist } from '../../grammar/src/index';
import { build, expected, PACKAGE, recognize, summarize, type Form } from './check';
import { TOPOLOGIES } from './fixtures';

const FORMS: Form[] = ['flat', 'wrapped'];

describe.each(TOPOLOGIES)('$name', (fixture) => {
  it.each(FORMS)('is recognised (%s)', (form) => {
    const text = build(fixture, form);
    const { result } = recognize(text);
    expect(result.nearMisses).toEqual([]);
    expect(result.rectifiers.map(summarize)).toEqual([expected(fixture, form)]);
    // Code lenses go on the first device's card, or on the package's X card in the root file.
    const { anchor } = result.rectifiers[0]!;
    const under = text.slice(anchor.span.start, anchor.span.end);
    if (form === 'wrapped') expect(under).toBe(PACKAGE);
    else expect(Object.keys(fixture.expect.devices)).toContain(under);
  });

  it.each(FORMS)('survives truncation at every line (%s)', (form) => {
    const text = build(fixture, form);
    const cuts = [...text.matchAll(/\n/g)].map((m) => m.index);
    for (const cut of cuts) {
      const flat = elaborate('file:///t.cir', new Map([['file:///t.cir', parseNetlist(text.slice(0, cut))]]));
      const found = recognizeRectifiers(flat);
      const resolve = createRatingResolver({ directives: flat.directives, partsFiles: [] });
      for (const r of found.rectifiers) toEquivalentCircuit(r, flat.models, rateRectifier(r, flat, resolve).parts);
    }
  });
});
