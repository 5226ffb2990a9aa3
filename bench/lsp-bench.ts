/**
 * The language server measured as an editor uses it (issue 18): the real server over stdio, a
 * generated netlist with 50 bridges, edits sent as incremental changes; after each edit the inlay
 * hints of a visible range are requested, and the edit counts as answered once the diagnostics
 * published for THAT version have arrived and a hint answer describes the new text (see
 * `EditedText`: stale answers are counted and asked again). Typing bursts: five edits 30 ms apart,
 * timed from the last. Values typed into cards: a new capacitance in a rectifier (solved each time)
 * and a new resistance in a filler card, apart from the comment lines, which change no card. The first edit after open
 * and a 1 s pause, on fresh servers. Memory: the server's VmRSS on 100,000 lines after open and after 20 edits.
 */
import { generateNetlist } from './generate-netlist';
import { EditedText, hintsAreFresh, startSession, type LspSession } from './lsp-session';
import { percentile, type BenchFigure } from './measure';

const URI = 'file:///bench/large.cir';
/** Where the edits go: below the title, directives and the subcircuit, above every rectifier. */
const EDIT_LINE = 9;
/** Stale hint answers asked again per edit before the edit is given up as never fresh. */
const MAX_ASKS = 50;

/** A netlist of `lines` lines with `rectifiers` bridges spread evenly through it. */
export function netlistWith(lines: number, rectifiers: number): string {
  const blocks = Math.ceil(lines / 7);
  return generateNetlist(lines, Math.max(1, Math.floor(blocks / rectifiers)));
}

export interface Round {
  firstMs: number;
  /** Server CPU (both threads) over the single edits, per edit: a figure a loaded machine disturbs less than wall time. */
  cpuPerEditMs: number;
  editMs: number[];
  burstMs: number[];
  /** A new capacitance typed into the middle rectifier (every edit a new value, so every one is solved). */
  rectifierValueMs: number[];
  /** A new resistance typed into a filler card (no rectifier's inputs change). */
  fillerValueMs: number[];
  stale: number;
  neverFresh: number;
}

/** A window of about 60 lines around the middle rectifier, as an editor would show it. */
function visibleRange(text: EditedText): [number, number] {
  const starts = text.lines.flatMap((l, i) => (l.startsWith('* rectifier ') ? [i] : []));
  const mid = starts[Math.floor(starts.length / 2)] ?? 0;
  return [mid - 20, mid + 40];
}

/** Sends nothing; waits until `version`'s diagnostics are out and a hint answer is fresh. Returns the stale answers seen. */
async function untilFresh(session: LspSession, text: EditedText, first: Promise<unknown>): Promise<{ stale: number; fresh: boolean }> {
  const [from, to] = visibleRange(text);
  const expected = text.expectedHints(from, to);
  let answer = (await Promise.all([first, session.diagnosticsFor(URI, text.version)]))[0] as Awaited<ReturnType<LspSession['hints']>>;
  let stale = 0;
  for (let ask = 0; !hintsAreFresh(answer, expected); ask++) {
    stale++;
    if (ask === MAX_ASKS) return { stale, fresh: false };
    answer = await session.hints(URI, from, to);
  }
  return { stale, fresh: true };
}

const sinceMs = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A fresh server with the `lines`-line netlist open, once its first diagnostics are out. */
async function openedSession(lines: number): Promise<{ session: LspSession; text: EditedText; firstMs: number }> {
  const session = await startSession();
  const text = new EditedText(netlistWith(lines, 50), EDIT_LINE);
  const openStart = process.hrtime.bigint();
  await session.open(URI, text.text);
  await session.diagnosticsFor(URI, 1);
  return { session, text, firstMs: sinceMs(openStart) };
}

type Change = Parameters<LspSession['change']>[2][number];

/** Sends one edit (made when sent) and waits until the answers are fresh, timed from the send. */
async function editUntilFresh(session: LspSession, text: EditedText, edit: () => Change): Promise<{ stale: number; fresh: boolean; ms: number }> {
  const start = process.hrtime.bigint();
  await session.change(URI, text.version + 1, [edit()]);
  const [from, to] = visibleRange(text);
  const outcome = await untilFresh(session, text, session.hints(URI, from, to));
  return { ...outcome, ms: sinceMs(start) };
}

export async function round(lines: number, edits: number, bursts: number, valueEdits = 0): Promise<Round> {
  const { session, text, firstMs } = await openedSession(lines);
  const result: Round = { firstMs, cpuPerEditMs: 0, editMs: [], burstMs: [], rectifierValueMs: [], fillerValueMs: [], stale: 0, neverFresh: 0 };
  const record = (outcome: { stale: number; fresh: boolean; ms: number }, into: number[]) => {
    result.stale += outcome.stale;
    if (outcome.fresh) into.push(outcome.ms);
    else result.neverFresh++;
  };
  const cpuBefore = session.cpuMs();
  for (let e = 0; e < edits; e++) record(await editUntilFresh(session, text, () => text.shiftEdit()), result.editMs);
  result.cpuPerEditMs = (session.cpuMs() - cpuBefore) / Math.max(1, edits);
  for (let b = 0; b < bursts; b++) {
    // Open a comment line (every hint below moves), type into it, then answer the last keystroke.
    if (text.hasInsertedLine) await session.change(URI, text.version + 1, [text.shiftEdit()]);
    await session.change(URI, text.version + 1, [text.shiftEdit()]);
    for (let k = 0; k < 4; k++) {
      await pause(30);
      await session.change(URI, text.version + 1, [text.typeEdit('abcd'[k]!)]);
    }
    const start = process.hrtime.bigint();
    const [from, to] = visibleRange(text);
    record({ ...(await untilFresh(session, text, session.hints(URI, from, to))), ms: sinceMs(start) }, result.burstMs);
  }
  // Values typed into cards: the same length each time, so the hints stay where they are and
  // freshness is the version of the diagnostics.
  const capacitor = text.lines.findIndex((l, i) => i > visibleRange(text)[0] && /^C\d+ p\d+ m\d+ \d{3}u$/.test(l));
  const filler = text.lines.findIndex((l, i) => i > EDIT_LINE && /^R\d+ x\d+ y\d+ 4\.\dk /.test(l));
  for (let k = 0; k < valueEdits; k++) {
    for (const [line, pattern, by, into] of [
      [capacitor, /\d{3}u$/, `${101 + (k % 899)}u`, result.rectifierValueMs],
      [filler, /4\.\dk/, `4.${k % 10}k`, result.fillerValueMs],
    ] as const) record(await editUntilFresh(session, text, () => text.replaceOnLine(line, pattern, by)), into);
  }
  await session.stop();
  return result;
}

/**
 * The first edit after a file opens and its reader pauses for a second (as one does before typing):
 * a fresh server each time, the edit timed to fresh diagnostics and hints.
 */
async function firstEditsAfterPause(sessions: number): Promise<number[]> {
  const times: number[] = [];
  for (let s = 0; s < sessions; s++) {
    const { session, text } = await openedSession(5000);
    await pause(1000);
    const edit = await editUntilFresh(session, text, () => text.shiftEdit());
    if (edit.fresh) times.push(edit.ms);
    await session.stop();
  }
  return times;
}

/** VmRSS of the server on a 100,000-line netlist right after its first diagnostics, and after 20 fresh edits. */
async function memoryAt100k(): Promise<{ open: number; edited: number }> {
  const session = await startSession();
  const text = new EditedText(generateNetlist(100_000), EDIT_LINE);
  await session.open(URI, text.text);
  await session.diagnosticsFor(URI, 1);
  const open = session.rssMb();
  for (let e = 0; e < 20; e++) {
    await session.change(URI, text.version + 1, [text.shiftEdit()]);
    await session.diagnosticsFor(URI, text.version);
  }
  const edited = session.rssMb();
  await session.stop();
  return { open, edited };
}

export async function runLspBench(): Promise<BenchFigure[]> {
  const rounds: Round[] = [];
  for (let r = 0; r < 3; r++) rounds.push(await round(5000, 50, 10, 10));
  const edits = rounds.flatMap((r) => r.editMs);
  const bursts = rounds.flatMap((r) => r.burstMs);
  const rectifierValues = rounds.flatMap((r) => r.rectifierValueMs);
  const fillerValues = rounds.flatMap((r) => r.fillerValueMs);
  const large = await round(50_000, 20, 0);
  const p50 = percentile(edits, 50);
  const p50Large = percentile(large.editMs, 50);
  const memory = await memoryAt100k();
  const stale = rounds.reduce((s, r) => s + r.stale, 0);
  const neverFresh = rounds.reduce((s, r) => s + r.neverFresh, 0) + large.neverFresh;
  const firsts = rounds.map((r) => r.firstMs);
  const afterPause = await firstEditsAfterPause(3);
  return [
    { name: 'edit → fresh diagnostics + hints p50', value: p50, unit: 'ms', note: `5,000 lines, 50 bridges, ${edits.length} edits in 3 rounds` },
    { name: 'edit → fresh diagnostics + hints p95', value: percentile(edits, 95), unit: 'ms', target: '≤ 50 ms', met: percentile(edits, 95) <= 50 },
    { name: 'typing burst, last edit → fresh p95', value: percentile(bursts, 95), unit: 'ms', target: '≤ 50 ms', met: percentile(bursts, 95) <= 50, note: `${bursts.length} bursts of 5 edits 30 ms apart` },
    {
      name: 'value typed in a rectifier → fresh p50', value: percentile(rectifierValues, 50), unit: 'ms',
      note: `p95 ${percentile(rectifierValues, 95).toFixed(0)} ms; ${rectifierValues.length} edits, each a new capacitance, so each is solved`,
    },
    { name: 'value typed in a filler card → fresh p50', value: percentile(fillerValues, 50), unit: 'ms', note: `p95 ${percentile(fillerValues, 95).toFixed(0)} ms; ${fillerValues.length} edits` },
    { name: 'server CPU per edit, both threads', value: rounds.reduce((s, r) => s + r.cpuPerEditMs, 0) / rounds.length, unit: 'ms', note: `50,000 lines: ${large.cpuPerEditMs.toFixed(0)} ms` },
    { name: 'stale hint answers asked again', value: stale, unit: '', note: `${neverFresh} edits never fresh after ${MAX_ASKS} asks` },
    { name: 'first diagnostics after open, worst', value: Math.max(...firsts), unit: 'ms', note: `rounds: ${firsts.map((f) => f.toFixed(0)).join(', ')} ms` },
    {
      name: 'first edit after open and a 1 s pause → fresh, median', value: percentile(afterPause, 50), unit: 'ms',
      note: `${afterPause.map((f) => f.toFixed(0)).join(', ')} ms; without the pause, each round's first edit: ${rounds.map((r) => r.editMs[0]?.toFixed(0) ?? '–').join(', ')} ms`,
    },
    { name: 'edit → fresh p50, 50,000 lines', value: p50Large, unit: 'ms', note: `${large.editMs.length} edits; first diagnostics ${large.firstMs.toFixed(0)} ms` },
    { name: 'edit p50, 50,000 ÷ 5,000 lines', value: p50Large / p50, unit: '×', target: '≤ 2×', met: p50Large / p50 <= 2 },
    { name: 'server RSS, 100,000 lines, after open', value: memory.open, unit: 'MB', target: '≤ 150 MB', met: memory.open <= 150 },
    { name: 'server RSS, 100,000 lines, 20 edits', value: memory.edited, unit: 'MB', target: '≤ 150 MB', met: memory.edited <= 150 },
  ];
}
