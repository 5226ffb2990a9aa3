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

// Named through the analysis: the server's room does not import the equivalent room.
type Rectifier = FileAnalysis['rectifiers'][number];
type DeviceAnalysis = Rectifier['devices'][number];

/** A rectifier as posted: whole, or pointing at the rectifier of the base analysis whose solution it shares. */
export type PostedRectifier =
  | Rectifier
  | (Omit<Rectifier, 'solution' | 'devices'> & {
    /** Index of the base analysis's rectifier with the same solution. */
    sameSolutionAs: number;
    /** A device without figures has those of the same device of that rectifier. */
    devices: (Omit<DeviceAnalysis, 'figures'> & { figures?: DeviceAnalysis['figures'] })[];
  });

/** An analysis as posted: without the root's parse and text when the main thread has the same text, and with rectifiers it already holds pointed at. */
export type PostedAnalysis = Omit<FileAnalysis, 'netlist' | 'text' | 'rectifiers'> & { netlist?: Netlist; text?: string; rectifiers: PostedRectifier[] };

/**
 * `mainThreadText`: the text of the root as the main thread sent it, when it sent it; `base`: the
 * worker's own copy of the analysis the main thread holds for this root, when it still has it.
 */
export function postedForm(file: FileAnalysis, mainThreadText: string | undefined, base?: FileAnalysis): PostedAnalysis {
  const held = new Map(base?.rectifiers.map((r, j) => [r.solution, j]));
  const compact = { ...file, flat: postedFlat(file), rectifiers: file.rectifiers.map((r) => postedRectifier(r, held, base)) };
  // A parse cut at a limit holds less than the text (limits.ts), and a root that includes itself
  // has its include-role parse in `parsed`: only a whole parse in its one role is left out.
  if (mainThreadText === undefined || file.netlist.text !== mainThreadText || file.parsed.get(file.uri) !== file.netlist) return compact;
  const { netlist: _parsedByTheMainThread, text: _sentByTheMainThread, ...rest } = compact;
  return { ...rest, parsed: new Map([...file.parsed].filter(([uri]) => uri !== file.uri)) };
}

function postedRectifier(analysis: Rectifier, held: ReadonlyMap<unknown, number>, base: FileAnalysis | undefined): PostedRectifier {
  const j = held.get(analysis.solution);
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
 * The main thread's parse of a root's text, made while the worker analyses it: from the previous
 * parse of the same root, so that only the changed cards are parsed again.
 */
export function mainThreadParse(text: string | undefined, previous: Netlist | undefined): Netlist | undefined {
  return text === undefined ? undefined : parseNetlist(text, { previous });
}

/**
 * The analysis as the main thread keeps it: the posted form with the root's text and parse put
 * back (the parse first), and the solutions and figures it pointed at taken from `held`, the
 * analysis the main thread had when it asked (the one the worker was told of).
 */
export function restoredForm(posted: PostedAnalysis, here: { text: string | undefined; parsed: Netlist | undefined; held: FileAnalysis | undefined }): FileAnalysis {
  const rectifiers = posted.rectifiers.map((r) => restoredRectifier(r, here.held));
  if (posted.netlist && posted.text !== undefined) return { ...posted, text: posted.text, netlist: posted.netlist, rectifiers };
  const text = posted.text ?? here.text ?? '';
  const netlist = here.parsed?.text === text ? here.parsed : parseNetlist(text);
  return { ...posted, text, netlist, rectifiers, parsed: new Map([[posted.uri, netlist], ...posted.parsed]) };
}

function restoredRectifier(posted: PostedRectifier, held: FileAnalysis | undefined): Rectifier {
  if (!('sameSolutionAs' in posted)) return posted;
  const { sameSolutionAs: j, ...rest } = posted;
  const same = held?.rectifiers[j];
  // The worker points only into the analysis the request named, which the caller passes here.
  if (!same) throw new Error(`posted analysis points at rectifier ${j} of an analysis the main thread does not hold`);
  const devices = posted.devices.map((d, k): DeviceAnalysis => (d.figures ? (d as DeviceAnalysis) : { ...d, figures: same.devices[k]!.figures }));
  return { ...rest, solution: same.solution, devices };
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
