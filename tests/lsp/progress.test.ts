/**
 * The busy state as standard protocol progress (LSP 3.15+ `window/workDoneProgress/create` and
 * `$/progress`): any editor that announces `window.workDoneProgress` can show it; one that does not
 * is sent nothing it did not ask for.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { generateNetlist } from '../../bench/generate-netlist';
import { startTestClient, type TestClient } from './protocol-client';

let client: TestClient | undefined;
afterEach(async () => {
  await client?.close();
  client = undefined;
});

describe('analysis progress', () => {
  it('begins and ends one progress around an analysis, titled for the tool', async () => {
    // A delay of 1 ms, so the test does not depend on how long the analysis takes on this machine.
    client = await startTestClient({ capabilities: { window: { workDoneProgress: true } }, env: { RECTILENS_PROGRESS_DELAY_MS: '1' } });
    const created: unknown[] = [];
    const kinds: string[] = [];
    const titles: string[] = [];
    client.connection.onRequest('window/workDoneProgress/create', (p: { token: unknown }) => { created.push(p.token); return null; });
    const ended = new Promise<void>((resolve) => {
      client!.connection.onNotification('$/progress', (p: { token: unknown; value: { kind: string; title?: string } }) => {
        expect(created).toContain(p.token);
        kinds.push(p.value.kind);
        if (p.value.title) titles.push(p.value.title);
        if (p.value.kind === 'end') resolve();
      });
    });
    await client.open('file:///w/heavy.cir', generateNetlist(1000, 100));
    await ended;
    expect(created).toHaveLength(1);
    expect(kinds[0]).toBe('begin');
    expect(kinds.at(-1)).toBe('end');
    expect(titles).toEqual(['Rectilens']);
  });

  it('sends no progress to an editor that does not announce it', async () => {
    client = await startTestClient({ env: { RECTILENS_PROGRESS_DELAY_MS: '1' } });
    let asked = 0;
    client.connection.onRequest('window/workDoneProgress/create', () => { asked++; return null; });
    await client.open('file:///w/heavy.cir', generateNetlist(1000, 100));
    expect(asked).toBe(0);
  });
});
