/**
 * What the worker posts of an analysis to the main thread: only what the main thread answers
 * from (findings, the rectifiers' figures for hints, hovers and lenses, the parse for outline,
 * navigation and completion). The waveforms are left out (the views that draw them are rendered
 * in the worker, on its own copy), and of the flat circuit only the rectifiers' filter capacitors
 * stay (the capacitor hover looks its card up there). Structured clone copies every number of what
 * it is given, so at 50 bridges the waveforms alone were most of each edit's message, and the main
 * thread kept a second copy of them.
 *
 * The root's parse is not posted either when the main thread has the same text: it parses that
 * text itself while the worker analyses (from its previous parse, so only the changed cards), which
 * `parseNetlist` guarantees equal to the worker's parse; a tree is the costliest thing to clone.
 * The text itself stays behind then too.
 *
 * Nor is what the main thread already holds: the request names the analysis the main thread has
 * (`base`), and a rectifier whose solution is the very object of one in that analysis (the solution
 * cache hands back the same object when the inputs are the same) crosses without its solution and
 * without the device figures that are the same objects too (equivalent/rectifier-analysis.ts makes
 * them once per solution); the main thread takes both from its copy of that rectifier. At 50
 * bridges that was most of an edit's message again.
 */
import { parseNetlist, type Netlist } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import type { FlatCircuit } from '../circuit/index';
import { movedByEdit, movedInPlaceMatches, moveInPlace, rootEditBetween, type RootEdit } from './root-edit';

// Named through the analysis: the server's room does not import the equivalent room.
type Rectifier = FileAnalysis['rectifiers'][number];
type DeviceAnalysis = Rectifier['devices'][number];

/** A rectifier as posted: whole, pointing at the base analysis's rectifier that it is but for the edit's move of offsets, or at the one whose solution it shares. */
export type PostedRectifier =
  | Rectifier
  | { movedFrom: number }
  | (Omit<Rectifier, 'solution' | 'devices'> & {
    /** Index of the base analysis's rectifier with the same solution. */
    sameSolutionAs: number;
    /** A device without figures has those of the same device of that rectifier. */
    devices: (Omit<DeviceAnalysis, 'figures'> & { figures?: DeviceAnalysis['figures'] })[];
  });

/**
 * An analysis as posted: without the root's parse and text when the main thread has the same text,
 * and with rectifiers it already holds pointed at (`rootEdit`: the edit from the base's text, for
 * the rectifiers posted as `movedFrom`).
 */
export type PostedAnalysis = Omit<FileAnalysis, 'netlist' | 'text' | 'rectifiers'> & { netlist?: Netlist; text?: string; rectifiers: PostedRectifier[]; rootEdit?: RootEdit };

/** A rectifier's solver data, the same objects in both analyses when its inputs are the same (never offsets). */
const SOLVER_DATA: ReadonlySet<string> = new Set(['solution', 'figures']);

/**
 * What the worker keeps of a posted analysis, to point into with the next one: the root's text and
 * the rectifiers as the main thread holds them. Detached from the trees (`postedBaseOf`): the next
 * parse moves the cards of this one in place, and with them every offset an analysis shares with
 * its tree.
 */
export interface PostedBase {
  text: string;
  rectifiers: readonly Rectifier[];
}

/** A detached copy of what the main thread will hold of `file`'s rectifiers. */
export function postedBaseOf(file: FileAnalysis): PostedBase {
  return { text: file.text, rectifiers: file.rectifiers.map(detached) };
}

/**
 * `mainThreadText`: the text of the root as the main thread sent it, when it sent it; `base`: what
 * the worker kept of the analysis the main thread holds for this root, when it still has it (left
 * as it is: this form is for callers that keep using it).
 */
export function postedForm(file: FileAnalysis, mainThreadText: string | undefined, base?: PostedBase): PostedAnalysis {
  return postedWithBase(file, mainThreadText, base && { text: base.text, rectifiers: base.rectifiers.map(detached) }).posted;
}

/**
 * The posted form and what to keep of it for the next one, for the worker. `base` is used up: its
 * rectifiers are moved in place to the new text, and those that match are kept as the next base.
 */
export function postedWithBase(file: FileAnalysis, mainThreadText: string | undefined, base?: PostedBase): { posted: PostedAnalysis; next: PostedBase } {
  const held = new Map(base?.rectifiers.map((r, j) => [r.solution, j]));
  const rootEdit = base ? rootEditBetween(file.uri, base.text, file.text) : undefined;
  const next: Rectifier[] = [];
  const moved = new Set<number>();
  const rectifiers = file.rectifiers.map((r) => {
    const j = held.get(r.solution);
    // An edit elsewhere moves the rectifier's offsets and nothing else: proven here (once per held
    // rectifier, as it moves that one in place), and the main thread makes the same move.
    if (j !== undefined && rootEdit && !moved.has(j)) {
      moved.add(j);
      if (movedInPlaceMatches(base!.rectifiers[j], r, rootEdit, SOLVER_DATA)) {
        next.push(base!.rectifiers[j]!);
        return { movedFrom: j };
      }
    }
    next.push(detached(r));
    return postedRectifier(r, j, base);
  });
  const compact = { ...file, flat: postedFlat(file), rectifiers, ...(rootEdit ? { rootEdit } : {}) };
  const keep = { text: file.text, rectifiers: next };
  // A parse cut at a limit holds less than the text (limits.ts), and a root that includes itself
  // has its include-role parse in `parsed`: only a whole parse in its one role is left out.
  if (mainThreadText === undefined || file.netlist.text !== mainThreadText || file.parsed.get(file.uri) !== file.netlist) return { posted: compact, next: keep };
  const { netlist: _parsedByTheMainThread, text: _sentByTheMainThread, ...rest } = compact;
  return { posted: { ...rest, parsed: new Map([...file.parsed].filter(([uri]) => uri !== file.uri)) }, next: keep };
}

/** A copy that shares no offsets with the trees (solver data shared, never copied). */
function detached(r: Rectifier): Rectifier {
  return movedByEdit(r, { uri: '', from: Infinity, delta: 0 }, SOLVER_DATA);
}

/** A rectifier posted whole, or without the solution and figures of base rectifier `j` that it shares. */
function postedRectifier(analysis: Rectifier, j: number | undefined, base: PostedBase | undefined): PostedRectifier {
  if (j === undefined) return withoutWaveforms(analysis);
  const before = base!.rectifiers[j]!.devices;
  const { solution: _held, ...rest } = analysis;
  const devices = analysis.devices.map((d, k) => {
    if (before[k]?.figures !== d.figures) return d;
    const { figures: _alsoHeld, ...ratings } = d;
    return ratings;
  });
  return { ...rest, sameSolutionAs: j, devices };
}

/**
 * The main thread's parse of a root's text, made once the worker's answer is in: from the parse of
 * the analysis it replaces, which it consumes (that tree's cards move into this one), so that only
 * the changed cards are parsed and nothing is copied.
 */
export function mainThreadParse(text: string | undefined, replaced: Netlist | undefined): Netlist | undefined {
  return text === undefined ? undefined : parseNetlist(text, { previous: replaced, consumePrevious: replaced !== undefined });
}

/**
 * The analysis as the main thread keeps it: the posted form with the root's text and parse put
 * back, and the solutions and figures it pointed at taken from `held`, the analysis the main
 * thread had when it asked (the one the worker was told of). `held` is used up: a rectifier posted
 * as moved is the held one with its offsets moved in place (as the worker moved its own copy), so
 * nothing of it is copied.
 *
 * The root's parse (`mainThreadParse` from `here.movable`) is made when the analysis's `netlist`
 * or `parsed` is first read, not here: diagnostics and inlay hints need only the text, the findings
 * and the rectifiers, so an edit's answers go out before the main thread spends its re-parse (the
 * scheduler reads the tree once the reader pauses). Read then or later, it is the same parse. An
 * analysis replaced before its tree was read hands the tree it would have moved from on to the
 * next one (`takeMovableTree`), so edits typed faster than the pause cost no parse at all.
 */
export interface RootTree {
  /** The text the posted analysis was made from, when the main thread sent it. */
  text: string | undefined;
  /** A tree the parse may move cards from and consume: an earlier text's, or this very text's own (used as it is). */
  movable?: Netlist;
  /** How the tree is made (`mainThreadParse` unless a test counts the parses). */
  parse?: (text: string, movable: Netlist | undefined) => Netlist | undefined;
  held: FileAnalysis | undefined;
}

export function restoredForm(posted: PostedAnalysis, here: RootTree): FileAnalysis {
  const rectifiers = posted.rectifiers.map((r) => restoredRectifier(r, here.held, posted.rootEdit));
  if (posted.netlist && posted.text !== undefined) return { ...posted, text: posted.text, netlist: posted.netlist, rectifiers };
  const text = posted.text ?? here.text ?? '';
  const file = { ...posted, text, rectifiers } as Omit<FileAnalysis, 'netlist' | 'parsed'>;
  const parse = here.parse ?? mainThreadParse;
  let movable = here.movable;
  let tree: { netlist: Netlist; parsed: ReadonlyMap<string, Netlist> } | undefined;
  const made = () => {
    if (!tree) {
      const from = movable;
      movable = undefined;
      const own = from?.text === text ? from : parse(text, from);
      const netlist = own?.text === text ? own : parseNetlist(text);
      tree = { netlist, parsed: new Map([[posted.uri, netlist], ...posted.parsed]) };
    }
    return tree;
  };
  const restored = Object.defineProperties(file, {
    netlist: { get: () => made().netlist, enumerable: true, configurable: true },
    parsed: { get: () => made().parsed, enumerable: true, configurable: true },
  }) as FileAnalysis;
  parsedUris.set(restored, [posted.uri, ...posted.parsed.keys()]);
  // Handing over leaves this analysis a whole parse of its own text, should a late reader ask.
  handOvers.set(restored, () => {
    if (tree) return tree.netlist;
    const from = movable;
    movable = undefined;
    return from;
  });
  return restored;
}

const handOvers = new WeakMap<FileAnalysis, () => Netlist | undefined>();

/**
 * The tree the analysis replacing `file` may move its root's cards from, taken from `file` (which no
 * reader may use after): its own tree once made, else the one it had been given to move from. No parse.
 */
export function takeMovableTree(file: FileAnalysis | undefined): Netlist | undefined {
  if (!file) return undefined;
  const handOver = handOvers.get(file);
  return handOver ? handOver() : file.netlist;
}

const parsedUris = new WeakMap<FileAnalysis, readonly string[]>();

/** The files an analysis parsed, the root first (its `parsed` keys), without making a parse put off until read. */
export function filesParsedBy(file: FileAnalysis): Iterable<string> {
  return parsedUris.get(file) ?? file.parsed.keys();
}

function restoredRectifier(posted: PostedRectifier, held: FileAnalysis | undefined, edit: RootEdit | undefined): Rectifier {
  if ('movedFrom' in posted) {
    const moved = heldRectifier(held, posted.movedFrom);
    if (!edit) throw new Error('posted analysis moves a rectifier without saying by which edit');
    moveInPlace(moved, edit, SOLVER_DATA);
    return moved;
  }
  if (!('sameSolutionAs' in posted)) return posted;
  const { sameSolutionAs: j, ...rest } = posted;
  const same = heldRectifier(held, j);
  const devices = posted.devices.map((d, k): DeviceAnalysis => (d.figures ? (d as DeviceAnalysis) : { ...d, figures: same.devices[k]!.figures }));
  return { ...rest, solution: same.solution, devices };
}

/** The worker points only into the analysis the request named, which the caller passes here. */
function heldRectifier(held: FileAnalysis | undefined, j: number): Rectifier {
  const same = held?.rectifiers[j];
  if (!same) throw new Error(`posted analysis points at rectifier ${j} of an analysis the main thread does not hold`);
  return same;
}

function postedFlat(file: FileAnalysis): FlatCircuit {
  const filters = new Set(file.rectifiers.flatMap((a) => a.capacitors.map((c) => c.name.toLowerCase())));
  const { flat } = file;
  return {
    rootUri: flat.rootUri,
    elements: flat.elements.filter((e) => e.kind === 'capacitor' && filters.has(e.key)),
    instances: [],
    models: new Map(),
    directives: flat.directives,
    globalParams: new Map(),
    dependencies: flat.dependencies,
    diagnostics: [],
  };
}

function withoutWaveforms(analysis: Rectifier): Rectifier {
  const corners = analysis.solution.corners.map(({ waveform: _w, inrushWaveform: _i, ...figures }) => figures);
  return { ...analysis, solution: { ...analysis.solution, corners } };
}
