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

/** The scopes of the token that covers `needle` in `line`, a line after the title. */
function scopesAt(grammar: textmate.IGrammar, line: string, needle: string): string[] {
  const afterTitle = grammar.tokenizeLine('a title', textmate.INITIAL).ruleStack;
  const { tokens } = grammar.tokenizeLine(line, afterTitle);
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

describe('TextMate grammar: the title line and source functions', () => {
  it('scopes the first line as the title, never as a card (SPICE reads line 1 as the title)', async () => {
    const g = await loadGrammar();
    const first = g.tokenizeLine('R1 bridge on the bench', textmate.INITIAL);
    expect(first.tokens.flatMap((t) => t.scopes)).not.toContain('storage.type.element.netlist');
    expect(first.tokens[0]!.scopes).toContain('markup.heading.title.netlist');
    const second = g.tokenizeLine('R1 a b 10k', first.ruleStack);
    expect(second.tokens.flatMap((t) => t.scopes)).toContain('storage.type.element.netlist');
    expect(second.tokens.flatMap((t) => t.scopes)).not.toContain('markup.heading.title.netlist');
  });
  it('colours SIN, PULSE and PWL sources outside braces too', async () => {
    const g = await loadGrammar();
    expect(scopesAt(g, 'V1 a 0 SIN(0 325 50)', 'SIN')).toContain('support.function.source.netlist');
    expect(scopesAt(g, 'V2 a 0 PULSE(0 5 0 1n 1n 1m 2m)', 'PULSE')).toContain('support.function.source.netlist');
    expect(scopesAt(g, 'I1 a 0 pwl(0 0 1m 1)', 'pwl')).toContain('support.function.source.netlist');
    expect(scopesAt(g, 'R1 sin 0 1k', 'sin')).not.toContain('support.function.source.netlist');
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
