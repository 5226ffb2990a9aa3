/**
 * Quick fixes in two steps (issue 17, item 6): a fix that needs trial solves is offered by a plan
 * (a title, no edit, no solve) and computed by `codeAction/resolve` when chosen. In-process, the
 * solution cache counts the solves; over stdio, the real server plans, resolves, refuses a resolve
 * after an edit, and computes every edit up front for an editor that does not resolve.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CodeActionRequest, CodeActionResolveRequest, type CodeAction, type Diagnostic, type ShowMessageParams,
} from 'vscode-languageserver-protocol/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { analyze } from '../../server/src/analysis/analyze';
import { isFixPlan, offeredFixes, verifyOffer } from '../../server/src/findings/index';
import type { SolutionCache } from '../../server/src/solve/index';
import { bridge } from '../rules/fixtures';
import { startTestClient, type TestClient } from './protocol-client';
import { PACKAGED_BRIDGE } from './packaged-bridge';

// The packaged 230 V bridge of tests/lsp/code-actions.test.ts: its 440 V diodes lack margin at
// high line (PIV 358 V > 0.8 × 440 V = 352 V there), and the part swap that answers it is 1N5405.
const TEXT = PACKAGED_BRIDGE;

/** An editor that resolves a code action's edit later and shows disabled actions (VS Code does both). */
const RESOLVING = { textDocument: { codeAction: { dataSupport: true, resolveSupport: { properties: ['edit'] }, disabledSupport: true } } };

describe('fix plans in-process: no trial solve until one is verified', () => {
  it('plans the part swap without solving, and solves when it is verified', () => {
    const cache: SolutionCache = new Map();
    const uri = 'file:///w/inprocess.cir';
    const file = analyze({ roots: [uri], readText: (u) => (u === uri ? TEXT : undefined), solutionCache: cache }).files.get(uri)!;
    const piv = file.findings.find((f) => f.code === 'piv-margin')!;
    const analysed = cache.size;
    const offers = offeredFixes(piv);
    const plan = offers.find(isFixPlan)!;
    expect(plan.title).toMatch(/^Find a part that passes every stress check for XB\.D1, XB\.D2, XB\.D3, XB\.D4 \(re-solved; first candidate 1N5405, /);
    expect(cache.size).toBe(analysed); // planning ran no solve
    const verified = verifyOffer(plan);
    expect(cache.size).toBeGreaterThan(analysed); // the swap's re-solve went through the memoised solver
    expect(verified.fix?.title).toMatch(/^Use 1N5405 /);
    expect(piv.fixes?.map((f) => f.title)).toContain(verified.fix?.title);
  });
});

describe('every fix that re-solves is planned without solving', () => {
  // The fixtures of tests/rules/fixes.test.ts, whose fixes that test applies and re-analyses.
  const cases: [string, string, RegExp][] = [
    ['cap-ripple', bridge({ cap: 'vrated=450V iripple=0.1A esr=2ohm' }), /^Make CB a bank of \d+ in parallel/],
    ['surge-rating', bridge({ rs: '1', diode: 'vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=80' }), /^Insert RINRUSH [\d.]+ Ω \(E12/],
    ['missing-rating', bridge({ diode: '' }), /^Insert a rate line for DR \(vrrm=\S+ ifav=\S+ ifsm=\S+ tjmax=150C rthja=\d+;/],
  ];
  it.each(cases)('%s', (code, text, verifiedTitle) => {
    const cache: SolutionCache = new Map();
    const uri = 'file:///w/plans.cir';
    const file = analyze({ roots: [uri], readText: (u) => (u === uri ? text : undefined), solutionCache: cache }).files.get(uri)!;
    const finding = file.findings.find((f) => f.code === code)!;
    const analysed = cache.size;
    const plans = offeredFixes(finding).filter(isFixPlan);
    expect(plans.length).toBeGreaterThan(0);
    expect(cache.size).toBe(analysed);
    const titles = plans.map((p) => verifyOffer(p).fix?.title);
    expect(titles).toContainEqual(expect.stringMatching(verifiedTitle));
    expect(cache.size).toBeGreaterThan(analysed);
    // What the command line reads (`fixes`) is the verified plans, the same fixes.
    expect(finding.fixes!.map((f) => f.title)).toEqual(expect.arrayContaining(titles.filter((t) => t !== undefined)));
  });
});

describe('codeAction/resolve over the protocol', () => {
  let client: TestClient;
  const messages: ShowMessageParams[] = [];
  beforeAll(async () => {
    client = await startTestClient({ capabilities: RESOLVING });
    client.connection.onNotification('window/showMessage', (m: ShowMessageParams) => { messages.push(m); });
  });
  afterAll(async () => {
    await client.close();
  });

  const actionsFor = async (uri: string, diagnostics: Diagnostic[]) => (await client.connection.sendRequest(CodeActionRequest.type, {
    textDocument: { uri }, range: diagnostics[0]!.range, context: { diagnostics },
  })) as CodeAction[];

  it('offers the swap without an edit, resolves its edit, and the edit answers the finding', async () => {
    const uri = 'file:///w/resolve.cir';
    const piv = (await client.open(uri, TEXT)).filter((d) => d.code === 'piv-margin');
    expect(piv).toHaveLength(4);
    const actions = await actionsFor(uri, piv);
    expect(actions.filter((a) => a.isPreferred).length).toBeLessThanOrEqual(1);
    const planned = actions.filter((a) => a.data !== undefined);
    expect(planned.map((a) => a.title)).toEqual([expect.stringMatching(/^Find a part that passes every stress check .*\(re-solved; first candidate 1N5405/)]);
    expect(planned[0]!.edit).toBeUndefined();
    expect(planned[0]!.diagnostics).toHaveLength(4);

    const resolved = await client.connection.sendRequest(CodeActionResolveRequest.type, planned[0]!);
    expect(resolved.title).toMatch(/^Use 1N5405 \(/);
    expect(resolved.disabled).toBeUndefined();
    const edits = resolved.edit?.changes?.[uri] ?? [];
    expect(edits.length).toBeGreaterThan(0);
    const fixed = TextDocument.applyEdits(TextDocument.create(uri, 'netlist', 1, TEXT), edits);
    const after = await client.change(uri, 2, [{ text: fixed }]);
    expect(after.filter((d) => d.code === 'piv-margin')).toEqual([]);
  });

  it('refuses a resolve after the file changed, and says why', async () => {
    const uri = 'file:///w/stale.cir';
    const piv = (await client.open(uri, TEXT)).filter((d) => d.code === 'piv-margin');
    const planned = (await actionsFor(uri, piv)).find((a) => a.data !== undefined)!;
    await client.change(uri, 2, [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, text: 'edited ' }]);
    const refused = await client.connection.sendRequest(CodeActionResolveRequest.type, planned);
    expect(refused.edit).toBeUndefined();
    expect(refused.title).toMatch(/not applied, the file changed since the fix was offered/);
    expect(refused.disabled?.reason).toMatch(/the file changed/);
    expect(messages.some((m) => /did not apply/.test(m.message))).toBe(true);
  });
});

describe('an editor that does not resolve code actions', () => {
  it('gets the swap with its edit in the code-action answer', async () => {
    const client = await startTestClient();
    try {
      const uri = 'file:///w/eager.cir';
      const piv = (await client.open(uri, TEXT)).filter((d) => d.code === 'piv-margin');
      const actions = (await client.connection.sendRequest(CodeActionRequest.type, {
        textDocument: { uri }, range: piv[0]!.range, context: { diagnostics: piv },
      })) as CodeAction[];
      const swap = actions.find((a) => a.title.startsWith('Use 1N5405'));
      expect(swap?.edit?.changes?.[uri]?.length).toBeGreaterThan(0);
      expect(actions.every((a) => a.data === undefined && a.edit !== undefined)).toBe(true);
    } finally {
      await client.close();
    }
  });
});
