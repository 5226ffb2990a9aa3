import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { COMMANDS } from '../../server/src/protocol/custom-protocol';
import { allCodes } from '../../server/src/rules/code-catalog';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(__dirname, '../..');
const manifest = JSON.parse(readFileSync(resolve(ROOT, 'package.json'), 'utf8'));

describe('extension manifest', () => {
  it('targets VS Code 1.91 and no newer API (types pinned to match)', () => {
    expect(manifest.engines.vscode).toBe('^1.91.0');
    expect(manifest.devDependencies['@types/vscode']).toBe('1.91.0');
  });

  it('contributes the language, grammar, snippets, commands, parts-file schema and settings', () => {
    const c = manifest.contributes;
    // Netlists, and the include and library files they read (so an open include is synced to the server).
    expect(c.languages[0].extensions).toEqual(['.cir', '.net', '.sp', '.spi', '.ckt', '.inc', '.lib']);
    expect(c.grammars[0].scopeName).toBe('source.netlist');
    expect(c.snippets[0].language).toBe('netlist');
    // The command ids are declared once, for the client and the server's code lenses.
    expect(c.commands.map((x: { command: string }) => x.command)).toEqual(Object.values(COMMANDS));
    expect(c.jsonValidation[0].url).toBe('./server/src/ratings/parts-file.schema.json');
    for (const [name, setting] of Object.entries(c.configuration.properties) as [string, { description?: string }][]) {
      expect((setting.description ?? "").split(/\s+/).length, name).toBeGreaterThan(5);
    }
  });

  it('scopes every analysis setting per folder (resource) and declares the protocol trace the client reads', () => {
    const props = manifest.contributes.configuration.properties;
    for (const key of Object.keys(props).filter((k) => k !== 'rectilens.trace.server')) expect(props[key].scope, key).toBe('resource');
    // vscode-languageclient reads `<client id>.trace.server`; the client id is 'rectilens' (client/src/extension.ts).
    expect(props['rectilens.trace.server']).toMatchObject({ scope: 'window', enum: ['off', 'messages', 'verbose'], default: 'off' });
  });

  it('leaves derating settings null by default, so the editor never sends an unset limit as 0', () => {
    const props = manifest.contributes.configuration.properties;
    for (const key of Object.keys(props).filter((k) => k.startsWith('rectilens.derating.'))) {
      expect(props[key].default, key).toBeNull();
      expect(props[key].type, key).toContain('null');
    }
  });
});

describe('npm run package', () => {
  it('builds an installable .vsix with the bundles, grammar, snippets and schema, and no sources or tests', () => {
    const result = spawnSync('npm', ['run', '--silent', 'package'], { cwd: ROOT, encoding: 'utf8' });
    expect(result.status, result.stderr).toBe(0);
    const listing = execFileSync('unzip', ['-Z1', resolve(ROOT, 'rectilens.vsix')], { encoding: 'utf8' }).trim().split('\n');
    const files = listing.filter((f) => f.startsWith('extension/')).map((f) => f.slice('extension/'.length)).sort();
    // The rule pages the diagnostics link (docs/rules/<code>.md), one per finding code.
    const pages = files.filter((f) => f.startsWith('docs/rules/'));
    expect(pages.sort()).toEqual(allCodes().map((c) => `docs/rules/${c.code}.md`).sort());
    expect(files.filter((f) => !f.startsWith('docs/rules/'))).toEqual([
      'LICENSE.txt',
      'client/snippets/netlist.json',
      'dist/analysis-worker.js',
      'dist/client.js',
      'dist/server.js',
      'grammar/language-configuration.json',
      'grammar/syntaxes/netlist.tmLanguage.json',
      'package.json',
      'readme.md',
      'server/src/ratings/parts-file.schema.json',
      'server/src/ratings/project-config.schema.json',
    ]);
  });
});
