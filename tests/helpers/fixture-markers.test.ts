/**
 * The fixture markers the tests are written in: the `$0`/`$1` cursor (cursor.ts) and the caret
 * annotations (annotations.ts), including the strict comparison of tests/rules/annotated/check.ts,
 * which must fail on a caret one column off, a wrong severity or fragment, and a finding too many.
 */
import { describe, expect, it } from 'vitest';
import { expectAnnotated } from '../rules/annotated/check';
import { readAnnotations, withoutAnnotations } from './annotations';
import { readCursor, selected } from './cursor';

describe('readCursor', () => {
  it('takes the markers out and gives their offsets in the text that remains', () => {
    expect(readCursor('R1 a$0 0 1k')).toEqual({ text: 'R1 a 0 1k', offset: 4 });
    const both = readCursor('R1 $1a 0$0 1k');
    expect(both).toEqual({ text: 'R1 a 0 1k', offset: 6, second: 3 });
    expect(selected(both)).toBe('a 0');
  });

  it('refuses a fixture without `$0` or with a marker twice', () => {
    expect(() => readCursor('R1 a 0 1k')).toThrow(/no \$0/);
    expect(() => readCursor('$0R1 $0a')).toThrow(/two \$0/);
  });
});

describe('readAnnotations', () => {
  const text = 'title\nRL1 out 0 4k7\n*^^ warning duplicate-name: first\n*        ^^^ warning value-notation: read as 4700\n';

  it('reads carets after a blank from their own columns, and carets touching the `*` from column 0', () => {
    const line = text.indexOf('RL1');
    expect(readAnnotations(text)).toEqual([
      { start: line, end: line + 3, severity: 'warning', code: 'duplicate-name', fragment: 'first' },
      { start: line + 9, end: line + 12, severity: 'warning', code: 'value-notation', fragment: 'read as 4700' },
    ]);
  });

  it('strips the annotation lines for a passing twin', () => {
    expect(withoutAnnotations(text)).toBe('title\nRL1 out 0 4k7\n');
  });
});

describe('expectAnnotated is strict', () => {
  // 72.2 V peak is 51.05 V rms (D), above the 50 V a.c. band of IEC 61140 (REFERENCES.md §6).
  const fixture = (annotation: string) => `standalone source\nV1 a 0 SIN(0 72.2 50)\n${annotation}\nR1 a 0 1k\n`;

  it('passes on the exact span, severity, code and a fragment of the message', () => {
    expect(expectAnnotated(fixture('*^ info hazardous-voltage: V1: 51.1 V rms'), 'hazardous-voltage')).toHaveLength(1);
  });

  it('fails on a wider or shifted caret, another severity, a fragment the message lacks, none or one too many', () => {
    for (const wrong of ['*^^ info hazardous-voltage: V1', '* ^ info hazardous-voltage: V1', '*^ warning hazardous-voltage: V1',
      '*^ info hazardous-voltage: V2', '* no annotation', '*^ info hazardous-voltage: V1\n*^ info hazardous-voltage: V1']) {
      expect(() => expectAnnotated(fixture(wrong), 'hazardous-voltage'), wrong).toThrow();
    }
  });
});
