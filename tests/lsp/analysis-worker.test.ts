/**
 * The analysis runs in a worker thread: requests are answered while a heavy file is analysed, a
 * worker that dies is replaced and its file gets a finding, and an analysis that outlasts the
 * editor's patience is stopped and says so. Each test talks to the real server over stdio.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { DocumentSymbolRequest, HoverRequest } from 'vscode-languageserver-protocol/node';
import { generateNetlist } from '../../bench/generate-netlist';
import { startTestClient, type TestClient } from './protocol-client';

const SMALL = `Small bridge (a fixture of our own)
*@ mains 230V 50Hz
V1 a b SIN(0 325 50)
D1 a p DX
D2 b p DX
D3 n a DX
D4 n b DX
C1 p n 100u
R1 p n 4.7k
.model DX D(IS=1n N=1.8)
`;

let client: TestClient | undefined;
afterEach(async () => {
  await client?.close();
  client = undefined;
});

describe('the analysis worker', () => {
  it('answers a request on one file while another file is being analysed', async () => {
    client = await startTestClient({ capabilities: { window: { workDoneProgress: true } }, env: { RECTILENS_PROGRESS_DELAY_MS: '1' } });
    await client.open('file:///w/small.cir', SMALL);
    const events: string[] = [];
    client.connection.onRequest('window/workDoneProgress/create', () => null);
    const started = new Promise<void>((resolve) => {
      client!.connection.onNotification('$/progress', (p: { value: { kind: string } }) => { if (p.value.kind === 'begin') resolve(); });
    });
    // 40 bridges: seconds of solving, during which a single-threaded server could answer nothing.
    const heavy = client.open('file:///w/heavy.cir', generateNetlist(4000, 100)).then(() => events.push('heavy analysed'));
    await started;
    const symbols = await client.connection.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri: 'file:///w/small.cir' } });
    events.push('symbols answered');
    await heavy;
    expect(symbols?.length).toBeGreaterThan(0);
    expect(events).toEqual(['symbols answered', 'heavy analysed']);
  });

  it('replaces a worker that runs out of memory; the file gets an internal-error finding and the server carries on', async () => {
    client = await startTestClient({ env: { RECTILENS_WORKER_HEAP_MB: '48' } });
    const big = await client.open('file:///w/big.cir', generateNetlist(60_000, 100));
    expect(big.map((d) => d.code)).toEqual(['internal-error']);
    expect(big[0]!.message).toMatch(/not checked: the analysis worker/);
    const small = await client.open('file:///w/small.cir', SMALL);
    expect(small.some((d) => d.code === 'internal-error')).toBe(false);
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri: 'file:///w/small.cir' }, position: { line: 3, character: 1 } });
    expect(JSON.stringify(hover)).toMatch(/PIV/);
  });

  it('stops an analysis that outlasts the editor\'s patience, and says what was not checked', async () => {
    client = await startTestClient({ env: { RECTILENS_EDITOR_PATIENCE_MS: '5' } });
    const diagnostics = await client.open('file:///w/heavy.cir', generateNetlist(2000, 100));
    expect(diagnostics.map((d) => [d.code, d.severity])).toEqual([['limit-exceeded', 1]]);
    expect(diagnostics[0]!.message).toMatch(/not checked: the editor stopped it after .* to stay responsive.*rectilens check/);
  });
});
