/**
 * The real server process in an untrusted workspace, watched as it runs: includes, libraries and
 * parts files that leave the workspace — by tabs inside `..` (which URL conversion drops), by a
 * symbolic link to a file or to a folder, by a `file://` URL — are each refused with an
 * `untrusted-file` finding, and the files they name are never opened. Two witnesses record every
 * open: strace (openat, across all threads) where it runs, and an fs spy preloaded into the server
 * and its worker. A trusted run of the same workspace is the control: it opens those same files,
 * so a witness that saw nothing would fail it.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Diagnostic } from 'vscode-languageserver-protocol/node';
import { startTestClient } from '../lsp/protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-opens-')));
const ws = join(base, 'ws');
const SECRET = join(base, 'secret.cir');
const SECRET_LIB = join(base, 'outside-folder', 'lib.cir');
const SECRET_PARTS = join(base, 'secret.rectilens-parts.json');
/** Every path by which the workspace leads outside: the outside files themselves and the links to them. */
const WAYS_OUT = [
  SECRET, SECRET_LIB, SECRET_PARTS, '/etc/passwd',
  join(ws, 'link.cir'), join(ws, 'linked', 'lib.cir'), join(ws, 'linked.rectilens-parts.json'),
];
const leadsOut = (path: string) => WAYS_OUT.includes(path);
const TAB_DOTS = '.\t./';

mkdirSync(ws);
mkdirSync(join(base, 'outside-folder'));
writeFileSync(SECRET, 'RSECRET s 0 1\n');
writeFileSync(SECRET_LIB, '.lib low\nRLOW l 0 1\n.endl\n');
writeFileSync(SECRET_PARTS, JSON.stringify({ version: 1, parts: [{ name: 'DSECRET', kind: 'diode', vrrmV: 600 }] }));
symlinkSync(SECRET, join(ws, 'link.cir'));
symlinkSync(join(base, 'outside-folder'), join(ws, 'linked'));
symlinkSync(SECRET_PARTS, join(ws, 'linked.rectilens-parts.json'));

const INCLUDES = [
  `.include "${TAB_DOTS.repeat(12)}etc/passwd"`,
  `.include "${TAB_DOTS}secret.cir"`,
  '.include "link.cir"',
  '.lib "linked/lib.cir" low',
  `.include "${pathToFileURL(SECRET).href}"`,
];
const MAIN = ['untrusted probes', ...INCLUDES, 'R1 a 0 1k', ''].join('\n');
const mainUri = pathToFileURL(join(ws, 'main.cir')).href;
const PARTS_SETTING = ['linked.rectilens-parts.json', `${pathToFileURL(ws).href}/${TAB_DOTS}secret.rectilens-parts.json`];
const partsUris = [pathToFileURL(join(ws, 'linked.rectilens-parts.json')).href, PARTS_SETTING[1]!];

const straceRuns = spawnSync('strace', ['-V']).status === 0;
const SPY = resolve(__dirname, 'open-spy.cjs');

interface Run {
  includeDiagnostics: Diagnostic[];
  partsDiagnostics: Diagnostic[][];
  /** Paths opened, by witness. */
  opened: { strace?: string[]; spy: string[] };
}

/** Runs the server on the workspace, opens the netlist, applies the parts-file setting, and collects what was opened. */
async function probe(trusted: boolean): Promise<Run> {
  const tag = trusted ? 'trusted' : 'untrusted';
  const straceLog = join(base, `strace-${tag}.log`);
  const spyLog = join(base, `spy-${tag}.log`);
  const client = await startTestClient({
    workspaceFolder: pathToFileURL(ws).href,
    initializationOptions: { trusted },
    wrap: straceRuns ? ['strace', '-f', '-qq', '-s', '4096', '-e', 'trace=open,openat,openat2', '-o', straceLog] : [],
    nodeArgs: ['--require', SPY],
    env: { RECTILENS_OPEN_LOG: spyLog },
  });
  try {
    const includeDiagnostics = await client.open(mainUri, MAIN);
    const partsPublished = partsUris.map((uri) => client.nextDiagnostics(uri));
    await client.connection.sendNotification('workspace/didChangeConfiguration', { settings: { rectilens: { partsFiles: PARTS_SETTING } } });
    const partsDiagnostics = await Promise.all(partsPublished);
    // One more analysis after the setting, so that every read the server would make has been made.
    await client.change(mainUri, 2, [{ text: `${MAIN}* again\n` }]);
    return { includeDiagnostics, partsDiagnostics, opened: { spy: [], strace: undefined } };
  } finally {
    await client.close();
  }
}

function openedPaths(straceLog: string | undefined, spyLog: string): Run['opened'] {
  const strace = straceLog && existsSync(straceLog)
    ? [...readFileSync(straceLog, 'utf8').matchAll(/open(?:at2?)?\((?:AT_FDCWD|\d+), "((?:[^"\\]|\\.)*)"/g)].map((m) => m[1]!)
    : undefined;
  return { strace, spy: existsSync(spyLog) ? readFileSync(spyLog, 'utf8').split('\n').filter(Boolean) : [] };
}

const runs = new Map<boolean, Run>();
beforeAll(async () => {
  for (const trusted of [false, true]) {
    const run = await probe(trusted);
    const tag = trusted ? 'trusted' : 'untrusted';
    run.opened = openedPaths(straceRuns ? join(base, `strace-${tag}.log`) : undefined, join(base, `spy-${tag}.log`));
    runs.set(trusted, run);
  }
}, 120_000);
afterAll(() => rmSync(base, { recursive: true, force: true }));

const lines = MAIN.split('\n');
const onCard = (diagnostics: Diagnostic[]) =>
  diagnostics.filter((d) => d.severity === 1).map((d) => [lines[d.range.start.line], d.code]);

describe('an untrusted workspace, watched with strace and an fs spy', () => {
  it('refuses every escaping include and library with an untrusted-file finding on its card', () => {
    // A netlist path is a path, not a URL: `.<tab>.` names a folder of that name inside the
    // workspace (the resolver encodes the tab), so the tabbed probes lead nowhere, trusted or not.
    const [tabbedDeep, tabbedSecret, ...escaping] = INCLUDES;
    expect(onCard(runs.get(false)!.includeDiagnostics)).toEqual([
      [tabbedDeep, 'missing-include'], [tabbedSecret, 'missing-include'], ...escaping.map((card) => [card, 'untrusted-file']),
    ]);
    const messages = runs.get(false)!.includeDiagnostics.map((d) => d.message);
    expect(messages[2]).toContain(`leads through a symbolic link to ${SECRET}`);
  });

  it('refuses both parts files with a finding on the parts file', () => {
    const [linked, tabbed] = runs.get(false)!.partsDiagnostics;
    expect(linked!.map((d) => [d.code, d.message])).toEqual([['untrusted-file', expect.stringContaining(`leads through a symbolic link to ${SECRET_PARTS}`)]]);
    expect(tabbed!.map((d) => [d.code, d.message])).toEqual([['untrusted-file', expect.stringContaining(`the workspace is untrusted and ${SECRET_PARTS} lies outside its folders`)]]);
  });

  it.runIf(straceRuns)('strace saw no open of any file outside the workspace', () => {
    const { strace } = runs.get(false)!.opened;
    expect(strace!.length).toBeGreaterThan(10); // node opened its own files, so the trace is live
    expect(strace!.filter(leadsOut)).toEqual([]);
  });

  it('the fs spy saw no open of any file outside the workspace', () => {
    expect(runs.get(false)!.opened.spy.filter(leadsOut)).toEqual([]);
  });

  it('control: trusted, the same workspace reads those files, and both witnesses see it', () => {
    const trusted = runs.get(true)!;
    expect(onCard(trusted.includeDiagnostics).filter(([, code]) => code === 'untrusted-file')).toEqual([]);
    expect(trusted.partsDiagnostics).toEqual([[], []]);
    // Trusted, links are opened as written (the secret library only through its link); the tabbed
    // probes name folders inside the workspace, so /etc/passwd is never opened.
    const expected = WAYS_OUT.filter((p) => p !== SECRET_LIB && p !== '/etc/passwd');
    expect(trusted.opened.spy).not.toContain('/etc/passwd');
    expect(expected.filter((p) => !trusted.opened.spy.includes(p))).toEqual([]);
    if (trusted.opened.strace) expect(expected.filter((p) => !trusted.opened.strace!.includes(p))).toEqual([]);
  });
});
