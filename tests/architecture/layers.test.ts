/**
 * The layer lint over the tree, and proof that it bites: the rooms table of DEVELOPERS.md is the
 * rule (scripts/check-layers.mjs reads it), so a wrong arrow fails `npm test`.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
// @ts-expect-error -- a plain ES module of the scripts folder, without type declarations
import { checkImports, checkRepository, readRooms, sourceFiles } from '../../scripts/check-layers.mjs';

const ROOT = join(__dirname, '..', '..');
const rooms = readRooms(readFileSync(join(ROOT, 'DEVELOPERS.md'), 'utf8'));
const tree: { path: string; text: string }[] = sourceFiles(ROOT, rooms);

describe('the layer lint', () => {
  it('passes on the tree', () => {
    expect(checkRepository(ROOT)).toEqual([]);
  });

  it('reads every room of the table, and every source file lies in one', () => {
    expect(rooms.map((r: { name: string }) => r.name)).toEqual(expect.arrayContaining(['grammar', 'findings', 'solve', 'rules', 'analysis', 'editor', 'report', 'lsp', 'cli', 'client']));
    expect(tree.length).toBeGreaterThan(150);
    expect(checkImports(rooms, [{ path: 'server/src/stray/loose.ts', text: '' }])).toEqual([
      { file: 'server/src/stray/loose.ts', line: 1, specifier: '', message: 'lies in no room of the table' },
    ]);
  });

  it('fails on a rule that imports the orchestrator (the cycle this layering removed)', () => {
    const wrong = { path: 'server/src/rules/wrong-way.ts', text: "import type { FileAnalysis } from '../analysis/analyze';\nexport type X = FileAnalysis;\n" };
    expect(checkImports(rooms, [...tree, wrong])).toEqual([
      { file: 'server/src/rules/wrong-way.ts', line: 1, specifier: '../analysis/analyze', message: 'rules may not import analysis' },
    ]);
  });

  it('fails on the core reaching an adapter, the ground floor reaching up, and a package a room may not use', () => {
    const found = checkImports(rooms, [
      { path: 'server/src/solve/x.ts', text: "export { startServer } from '../lsp/server';" },
      { path: 'server/src/findings/x.ts', text: "\n\nimport { elaborate } from '../circuit/index';" },
      { path: 'server/src/ratings/x.ts', text: "import { readFileSync } from 'node:fs';" },
      { path: 'client/src/x.ts', text: "const m = await import('../../server/src/analysis/analyze');" },
    ]);
    expect(found.map((v: { file: string; line: number; message: string }) => `${v.file}:${v.line} ${v.message}`)).toEqual([
      'server/src/solve/x.ts:1 solve may not import lsp',
      'server/src/findings/x.ts:3 findings may not import circuit',
      'server/src/ratings/x.ts:1 ratings may not import the package node:fs',
      'client/src/x.ts:1 client may not import analysis',
    ]);
  });

  it('allows what the table lists: a room its own files, a package subpath, Node built-ins where listed', () => {
    expect(checkImports(rooms, [
      { path: 'server/src/rules/x.ts', text: "import { RULES } from './registry';\nimport type { Finding } from '../findings/index';" },
      { path: 'server/src/lsp/x.ts', text: "import { createConnection } from 'vscode-languageserver/node';\nimport { Worker } from 'node:worker_threads';" },
    ])).toEqual([]);
  });
});
