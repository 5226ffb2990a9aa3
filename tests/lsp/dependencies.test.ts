import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestClient, type TestClient } from './protocol-client';

// Dependency tracking: an edit to an included file re-analyses the files that include it.
const MAIN = 'file:///work/deps/main.cir';
const PARTS = 'file:///work/deps/parts.inc';

let client: TestClient;
beforeAll(async () => {
  client = await startTestClient();
});
afterAll(async () => {
  await client.close();
});

describe('included files', () => {
  it('re-analyses the including file when the included one changes', async () => {
    await client.open(PARTS, '* parts of our own\n.model DX D(IS=2n N=1.8)\n');
    const first = await client.open(MAIN, 'Main (our own)\n.include "parts.inc"\nV1 a 0 SIN(0 17 50)\nD1 a b DX\nR1 b 0 100\n');
    expect(first.filter((d) => d.code === 'unknown-model' || d.code === 'missing-include')).toEqual([]);
    // Renaming the model in the include leaves D1 without one: main.cir must say so, unprompted.
    const mainAgain = client.nextDiagnostics(MAIN);
    await client.change(PARTS, 2, [{ text: '* parts of our own\n.model DY D(IS=2n N=1.8)\n' }]);
    const after = await mainAgain;
    expect(after.map((d) => d.code)).toContain('unknown-model');
  });
});
