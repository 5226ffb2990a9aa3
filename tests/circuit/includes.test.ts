/** `.include` and `.lib` across files: paths, sections, dependencies. */
import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { collectDependencies, listIncludeTargets, resolveIncludePath } from '../../server/src/circuit/index';
import { flatten, ROOT, wiring } from './check';

describe('resolveIncludePath', () => {
  it.each([
    ['file:///work/root.cir', 'parts.cir', 'file:///work/parts.cir'],
    ['file:///work/root.cir', 'lib/parts.cir', 'file:///work/lib/parts.cir'],
    ['file:///work/lib/parts.cir', '../common/m.lib', 'file:///work/common/m.lib'],
    ['file:///work/lib/parts.cir', './x/../y.cir', 'file:///work/lib/y.cir'],
    ['file:///work/root.cir', '/abs/m.lib', 'file:///abs/m.lib'],
    ['file:///work/root.cir', 'lib\\win.cir', 'file:///work/lib/win.cir'],
    ['/home/u/root.cir', 'm.lib', '/home/u/m.lib'],
    ['rel/root.cir', '../m.lib', 'm.lib'],
  ])('%s + %s → %s', (from, written, to) => {
    expect(resolveIncludePath(from, written)).toBe(to);
  });
});

describe('splicing', () => {
  const files = {
    'lib/parts.cir': '.include "../common.cir"\nR2 b c 2\n',
    'common.cir': '.param rc=5\nR3 c 0 {rc}\n',
    'models.lib': '.lib slow\nR5 s 0 50\n.endl\n.lib fast\nR4 f 0 4\n.endl\n',
  };
  const root = 'inc\nR1 a b 1\n.include "lib/parts.cir"\n.lib "models.lib" fast\n';
  const flat = flatten(root, files);
  it('reads nested includes relative to the including file and only the chosen library section', () => {
    expect(wiring(flat)).toEqual(['R1: a b', 'R3: c 0', 'R2: b c', 'R4: f 0']);
    expect(flat.diagnostics).toEqual([]);
  });
  it('takes a .param from an included file as global', () => {
    expect(flat.globalParams.get('rc')).toBe(5);
  });
  it('lists targets for the adapter and the dependency closure', () => {
    const targets = listIncludeTargets(ROOT, parseNetlist(root));
    expect(targets.map((t) => [t.uri, t.section])).toEqual([
      ['file:///work/lib/parts.cir', undefined],
      ['file:///work/models.lib', 'fast'],
    ]);
    const parsed = new Map([[ROOT, parseNetlist(root)], ...Object.entries(files).map(([p, t]) => [`file:///work/${p}`, parseNetlist(t, { titleLine: false })] as const)]);
    expect(collectDependencies(ROOT, parsed)).toEqual({
      files: [ROOT, 'file:///work/lib/parts.cir', 'file:///work/models.lib', 'file:///work/common.cir'],
      missing: [],
    });
    expect(flat.dependencies).toEqual([ROOT, 'file:///work/lib/parts.cir', 'file:///work/common.cir', 'file:///work/models.lib']);
  });
  it('reports a missing library section on the section name', () => {
    const text = 'inc\n.lib "models.lib" typical\n';
    const d = flatten(text, files).diagnostics;
    expect(d.map((x) => [x.code, text.slice(x.span.start, x.span.end)])).toEqual([['missing-lib-section', 'typical']]);
  });
});
