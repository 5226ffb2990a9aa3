import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import * as oniguruma from 'vscode-oniguruma';
import * as textmate from 'vscode-textmate';

// The TextMate grammar is checked with the same tokenizer library and regex engine VS Code uses
// (vscode-textmate + vscode-oniguruma from the registry), not with our own parser.
const require = createRequire(import.meta.url);
const grammarPath = new URL('../../grammar/syntaxes/netlist.tmLanguage.json', import.meta.url);

async function loadGrammar(): Promise<textmate.IGrammar> {
  const wasm = readFileSync(require.resolve('vscode-oniguruma/release/onig.wasm'));
  await oniguruma.loadWASM(wasm.buffer.slice(wasm.byteOffset, wasm.byteOffset + wasm.byteLength));
  const registry = new textmate.Registry({
    onigLib: Promise.resolve({ createOnigScanner: (p) => new oniguruma.OnigScanner(p), createOnigString: (s) => new oniguruma.OnigString(s) }),
    loadGrammar: async () => textmate.parseRawGrammar(readFileSync(grammarPath, 'utf8'), grammarPath.pathname),
  });
  return (await registry.loadGrammar('source.netlist'))!;
}

/** The scopes of the token that covers `needle` in `line`. */
function scopesAt(grammar: textmate.IGrammar, line: string, needle: string): string[] {
  const { tokens } = grammar.tokenizeLine(line, textmate.INITIAL);
  const at = line.indexOf(needle);
  return tokens.find((t) => t.startIndex <= at && at < t.endIndex)!.scopes;
}

describe('TextMate grammar (TextMate naming conventions)', () => {
  it('scopes comments, directives, cards, numbers and expressions', async () => {
    const g = await loadGrammar();
    expect(scopesAt(g, '* a comment', 'comment')).toContain('comment.line.asterisk.netlist');
    expect(scopesAt(g, 'R1 a b 10k ; trailing', 'trailing')).toContain('comment.line.semicolon.netlist');
    expect(scopesAt(g, '*@ rate DMAIN vrrm=600V', 'rate')).toContain('keyword.other.directive.netlist');
    expect(scopesAt(g, '*@ rate DMAIN vrrm=600V', 'vrrm')).toContain('variable.parameter.netlist');
    expect(scopesAt(g, '.subckt BRIDGE a b p n', '.subckt')).toContain('keyword.control.netlist');
    expect(scopesAt(g, '.subckt BRIDGE a b p n', 'BRIDGE')).toContain('entity.name.type.netlist');
    expect(scopesAt(g, '.model DMAIN D(IS=1n)', 'DMAIN')).toContain('entity.name.type.netlist');
    expect(scopesAt(g, 'D1 ac1 out DMAIN', 'D')).toContain('storage.type.element.netlist');
    expect(scopesAt(g, 'C1 out 0 100uF', '100uF')).toContain('constant.numeric.netlist');
    expect(scopesAt(g, 'R1 out 0 {sqrt(2)*r0}', 'sqrt')).toContain('support.function.netlist');
    expect(scopesAt(g, '+ N=1.9', '+')).toContain('punctuation.separator.continuation.netlist');
  });
});

describe('language configuration', () => {
  it('folds .subckt blocks and comments with *', () => {
    const config = JSON.parse(readFileSync(new URL('../../grammar/language-configuration.json', import.meta.url), 'utf8'));
    expect(config.comments.lineComment).toBe('*');
    const start = new RegExp(config.folding.markers.start.replace('(?i:subckt)', '(?:subckt|SUBCKT)'));
    expect(start.test('.subckt BR a b p n')).toBe(true);
    expect(start.test('.SUBCKT BR a b p n')).toBe(true);
  });
});
