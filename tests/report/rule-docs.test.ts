/**
 * A documentation page per finding code (docs/rules/<code>.md), which every published diagnostic
 * links as its `codeDescription`. The pages are written from the code catalog and, for the rules,
 * from the header comment of the rule's own file (when it fires, why, the threshold and its
 * source), so they cannot drift from the code: this test fails when a page differs, and
 * `npm run docs:rules` rewrites them.
 */
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { allCodes, type CodeInfo } from '../../server/src/rules/code-catalog';

const ROOT = join(__dirname, '..', '..');
const DOCS = join(ROOT, 'docs', 'rules');
const WRITE = process.env.RECTILENS_WRITE_DOCS === '1';

const STAGES: Readonly<Record<CodeInfo['stage'], string>> = {
  syntax: 'reading the netlist text',
  circuit: 'building the circuit (includes, subcircuits, parameters)',
  analysis: 'analysing the rectifiers',
};

/** The rule file's header comment, without its comment markers, when the code has a rule of its own. */
function ruleHeader(code: string): string | undefined {
  const file = join(ROOT, 'server', 'src', 'rules', `${code}.ts`);
  if (!existsSync(file)) return undefined;
  const match = /^\/\*\*([\s\S]*?)\*\//.exec(readFileSync(file, 'utf8'));
  // References to our internal design notes mean nothing to a reader of the page.
  return match?.[1]!.split('\n').map((l) => l.replace(/^\s*\* ?/, '')).join('\n').replace(/ ?\(DESIGN\.md §[\d.]+\)|;? ?DESIGN\.md §[\d.]+/g, '').trim();
}

function page(info: CodeInfo): string {
  const header = ruleHeader(info.code);
  return [
    `# \`${info.code}\``,
    '',
    `${info.description[0]!.toUpperCase()}${info.description.slice(1)}.`,
    '',
    `Found while ${STAGES[info.stage]}.`,
    '',
    ...(info.help ? ['## What to do', '', info.help, ''] : []),
    ...(header ? ['## How the rule decides', '', header, ''] : []),
    // `*@ allow` covers judgements about the design (analysis/analyze.ts), not faults of the text itself.
    info.stage === 'analysis' || info.code === 'include-error'
      ? `Accept it where it is intended with \`*@ allow ${info.code}\` on the line before the card (or in the file's leading directives for the whole file).`
      : 'It concerns the netlist text itself, so `*@ allow` does not hide it: correct the text.',
    '',
  ].join('\n');
}

describe('the rule pages', () => {
  const codes = allCodes();
  it('has one page per finding code, as the catalog and the rule files say', () => {
    for (const info of codes) {
      const file = join(DOCS, `${info.code}.md`);
      if (WRITE) writeFileSync(file, page(info));
      expect(existsSync(file), `${file} (npm run docs:rules)`).toBe(true);
      expect(readFileSync(file, 'utf8'), `${info.code}: npm run docs:rules`).toBe(page(info));
    }
  });
  it('has no page for a code that no longer exists', () => {
    expect(readdirSync(DOCS).sort()).toEqual(codes.map((c) => `${c.code}.md`).sort());
  });
});
