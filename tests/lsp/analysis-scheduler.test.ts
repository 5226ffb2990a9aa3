/**
 * Regression: a throw while handling an analysis (outside any rule) became an unhandled promise
 * rejection in the scheduler, which ends a Node process. Now the file gets an internal-error
 * stop and the scheduler keeps serving the next edit.
 */
import { describe, expect, it, vi } from 'vitest';
import { analyze } from '../../server/src/analysis/analyze';
import { AnalysisScheduler, type AnalysisRunner } from '../../server/src/lsp/analysis-scheduler';
import type { AnalysisStop } from '../../server/src/lsp/analysis-worker-host';

describe('the analysis scheduler', () => {
  it('turns a throw into a stopped file and keeps serving', async () => {
    let calls = 0;
    const runner: AnalysisRunner = {
      analyse: async (uri, open) => {
        calls++;
        if (calls === 1) throw new Error('a fault outside the rules');
        const file = analyze({ roots: [uri], readText: (u) => open.get(u) }).files.get(uri);
        return { kind: 'analysed', file, sequence: calls };
      },
      fixes: async () => [],
      view: async () => null,
      forget: () => {},
    };
    const stops: { uri: string; stop: AnalysisStop }[] = [];
    let analysed: (uri: string) => void = () => {};
    const done = new Promise<string>((resolve) => (analysed = resolve));
    const unhandled: unknown[] = [];
    const onUnhandled = (reason: unknown) => unhandled.push(reason);
    process.on('unhandledRejection', onUnhandled);
    const scheduler = new AnalysisScheduler(runner, {
      openDocuments: () => [{ uri: 'file:///a.cir', version: 1, text: 'a\nR1 x 0 1k\n' }],
      settings: () => ({}),
      partsFiles: () => [],
      onAnalysed: (file) => analysed(file.uri),
      onStopped: (uri, _version, stop) => {
        stops.push({ uri, stop });
        scheduler.schedule([uri]); // the next edit
      },
    }, 0);
    scheduler.schedule(['file:///a.cir']);
    expect(await done).toBe('file:///a.cir');
    process.off('unhandledRejection', onUnhandled);
    expect(stops).toEqual([{ uri: 'file:///a.cir', stop: { cause: 'fault', reason: expect.stringMatching(/a fault outside the rules/) } }]);
    expect(unhandled).toEqual([]);
    expect(scheduler.get('file:///a.cir')?.uri).toBe('file:///a.cir');
  });

  it('starts at once when idle, and gathers the edits that arrive while an analysis runs', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
    try {
      let calls = 0;
      let release: () => void = () => {};
      const gate = new Promise<void>((r) => (release = r));
      const runner: AnalysisRunner = {
        analyse: async (uri, open) => {
          calls++;
          if (calls === 1) await gate; // the first analysis is still running when the next edits come
          const file = analyze({ roots: [uri], readText: (u) => open.get(u) }).files.get(uri);
          return { kind: 'analysed', file, sequence: calls };
        },
        fixes: async () => [],
        view: async () => null,
        forget: () => {},
      };
      const versions: (number | undefined)[] = [];
      let version = 1;
      const uri = 'file:///a.cir';
      const scheduler = new AnalysisScheduler(runner, {
        openDocuments: () => [{ uri, version, text: 'a\nR1 x 0 1k\n' }],
        settings: () => ({}),
        partsFiles: () => [],
        onAnalysed: (_file, v) => versions.push(v),
        onStopped: () => {},
      }, 1000);
      scheduler.schedule([uri]);
      await vi.advanceTimersByTimeAsync(0); // idle: no debounce
      expect(calls).toBe(1);
      for (version = 2; version <= 4; version++) scheduler.schedule([uri]);
      version = 4;
      release();
      await vi.advanceTimersByTimeAsync(999); // busy when they came: they wait for the debounce
      expect(calls).toBe(1);
      await vi.advanceTimersByTimeAsync(1);
      await vi.waitFor(() => expect(versions).toEqual([1, 4]));
      // The three edits typed during the first analysis were analysed once, at the newest version.
      expect(calls).toBe(2);
    } finally {
      vi.useRealTimers();
    }
  });
});
