/** The JSON report of `check --format json` (DESIGN.md §8): stable names, SI units in the names, 1-based lines. */
import type { Snapshot } from '../analysis/analyze';
import type { Finding } from '../findings/index';
import { findingsByFile, findingsOfFile } from '../analysis/findings-by-file';
import { LineIndex } from '../../../grammar/src/index';
import type { CapacitorStress, RectifierAnalysis } from '../equivalent/index';
import type { DeviceSolution, Load, PartVertex } from '../solve/index';

export interface JsonDiagnostic {
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  severity: string;
  code: string;
  message: string;
  /** Other places that belong to it: the inner card of a packaged device, the card that includes this file. */
  related?: JsonPlace[];
  /** Its quick fixes, when the report was asked to carry them (SARIF). */
  fixes?: { title: string; edits: (JsonPlace & { endLine: number; endColumn: number; newText: string })[] }[];
}

export interface JsonPlace {
  path: string;
  line: number;
  column: number;
  message?: string;
}

/** A device's figures at one corner; `inrush…` are its own surge in its worst inrush case (`inrushCase`). */
export type JsonDevice = Pick<DeviceSolution, 'name' | 'pivV' | 'ipkA' | 'iavgA' | 'irmsA' | 'lossW' | 'tjC' | 'inrushPeakA' | 'inrushI2tA2s' | 'inrushCase'>;

/** A filter capacitor's stress: ripple loss, core temperature and life estimate, worst and per corner. */
export interface JsonCapacitor {
  name: string;
  esrOhm?: number;
  /** How the core's rise was found: `thermal-resistance`, `rated-ripple` or `none`. */
  coreRiseModel: string;
  worst: { lossW?: number; coreC?: number; lifeH?: number };
  worstCorner: { lossW?: string; coreC?: string; lifeH?: string };
  corners: { name: string; irmsA: number; lossW?: number; coreC: number; lifeH?: number }[];
}

export interface JsonCorner {
  name: string;
  lineVrms: number;
  ambientC: number;
  /** Line frequency solved at this corner. */
  freqHz?: number;
  /** The load solved at this corner (the directive's, or the drawn parts'); the rectifier's `load.fixed` draws beside it. */
  load?: Load;
  /** The end of a load range: "full" or "light"; absent for a single load. */
  loadLevel?: 'full' | 'light';
  /** The part-tolerance vertex solved; absent: nominal parts. */
  parts?: PartVertex;
  vOutAvgV?: number;
  rippleVpp?: number;
  capRippleIrmsA?: number;
  efficiency?: number;
  sourceIrmsA?: number;
  powerFactor?: number;
  thd?: number;
  harmonicsA?: number[];
  inrushPeakA?: number;
  /** The inrush case of the peak ("hot restart at the negative crest"). */
  inrushCase?: string;
  inrushI2tA2s?: number;
  holdUpS?: number;
  devices: JsonDevice[];
}

export interface JsonRectifier {
  id: string;
  kind: string;
  devices: string[];
  line: number;
  worst: Record<string, number | undefined>;
  worstCorner: Record<string, string | undefined>;
  /** What the load is made of: the directive's (or drawn) load, a range's light end, and the parts drawn beside it. */
  load: JsonLoad;
  /** NTC inrush limiters in the source loop: cold (card) and hot resistance, referred to the rectifier side. */
  inrushLimiter?: { names: string[]; coldROhm: number; hotROhm: number };
  capacitors: JsonCapacitor[];
  corners: JsonCorner[];
}

export interface JsonLoad {
  full: Load;
  light?: Load;
  fromDirective: boolean;
  /** Resistors and current sources across the output that draw beside a directive's load. */
  fixed?: { ohm?: number; a?: number; elements: string[] };
}

export interface JsonFile {
  path: string;
  rectifiers: JsonRectifier[];
  diagnostics: JsonDiagnostic[];
}

export interface JsonReport {
  version: 1;
  files: JsonFile[];
}

/** A file that is not a netlist but has findings: a project configuration, a parts file. */
export interface ReportedFile {
  path: string;
  text: string;
  findings: readonly Finding[];
}

export interface JsonReportOptions {
  /** Configuration and parts files with their findings, listed after the netlists. */
  extra?: readonly ReportedFile[];
  /** Compute each finding's quick fixes into the report (they re-solve; SARIF asks for them). */
  withFixes?: boolean;
}

/**
 * One entry per root netlist, then one per other file with findings (an included file, a
 * configuration, a parts file): a finding is listed under the file that holds its text, once,
 * however many roots include that file.
 */
export function toJsonReport(snapshot: Snapshot, options: JsonReportOptions = {}): JsonReport {
  const texts = new Map<string, string>();
  for (const file of snapshot.files.values()) for (const [uri, netlist] of file.parsed) if (!texts.has(uri) || uri === file.uri) texts.set(uri, netlist.text);
  for (const extra of options.extra ?? []) texts.set(extra.path, extra.text);
  const lineIndexes = new Map<string, LineIndex>();
  const linesOf = (uri: string) => {
    let index = lineIndexes.get(uri);
    if (!index) lineIndexes.set(uri, (index = new LineIndex(texts.get(uri) ?? '')));
    return index;
  };
  const toJson = (f: Finding) => toJsonDiagnostic(f, linesOf, options.withFixes ?? false);
  const roots = [...snapshot.files.values()];
  const byFile = new Map<string, Map<string, Finding[]>>();
  for (const root of roots) {
    for (const [uri, list] of findingsByFile(root)) {
      if (!byFile.has(uri)) byFile.set(uri, new Map());
      byFile.get(uri)!.set(root.uri, list);
    }
  }
  const shown = (uri: string) => findingsOfFile(uri, byFile.get(uri) ?? new Map());
  const files: JsonFile[] = roots.map((file) => ({
    path: file.uri, rectifiers: file.rectifiers.map((r) => toJsonRectifier(r, linesOf(file.uri))), diagnostics: shown(file.uri).map(toJson),
  }));
  const elsewhere = new Map<string, Finding[]>();
  for (const uri of byFile.keys()) {
    const list = snapshot.files.has(uri) ? [] : shown(uri);
    if (list.length) elsewhere.set(uri, list);
  }
  for (const extra of options.extra ?? []) elsewhere.set(extra.path, [...(elsewhere.get(extra.path) ?? []), ...extra.findings]);
  for (const [path, findings] of elsewhere) {
    let entry = files.find((f) => f.path === path);
    if (!entry) files.push((entry = { path, rectifiers: [], diagnostics: [] }));
    const seen = new Set(entry.diagnostics.map(diagnosticKey));
    for (const d of findings.map(toJson)) {
      if (seen.has(diagnosticKey(d))) continue;
      seen.add(diagnosticKey(d));
      entry.diagnostics.push(d);
    }
  }
  return { version: 1, files };
}

function diagnosticKey(d: JsonDiagnostic): string {
  return `${d.line}:${d.column}:${d.endLine}:${d.endColumn}:${d.code}:${d.message}`;
}

export function toJsonDiagnostic(f: Finding, linesOf: (uri: string) => LineIndex, withFixes: boolean): JsonDiagnostic {
  const lines = linesOf(f.uri);
  const start = lines.positionAt(f.span.start);
  const end = lines.positionAt(f.span.end);
  const d: JsonDiagnostic = {
    line: start.line + 1, column: start.character + 1, endLine: end.line + 1, endColumn: end.character + 1,
    severity: f.severity, code: f.code, message: f.message,
  };
  const place = (uri: string, offset: number) => {
    const at = linesOf(uri).positionAt(offset);
    return { path: uri, line: at.line + 1, column: at.character + 1 };
  };
  if (f.related?.length) d.related = f.related.map((r) => ({ ...place(r.uri, r.span.start), message: r.message }));
  if (withFixes && f.fixes?.length) {
    d.fixes = f.fixes.map((fix) => ({
      title: fix.title,
      edits: fix.edits.map((e) => {
        const stop = linesOf(e.uri).positionAt(e.span.end);
        return { ...place(e.uri, e.span.start), endLine: stop.line + 1, endColumn: stop.character + 1, newText: e.newText };
      }),
    }));
  }
  return d;
}

const WORST_FIGURES = ['vOutAvgV', 'vOutMaxV', 'rippleVpp', 'efficiency', 'powerFactor', 'inrushPeakA', 'capRippleIrmsA', 'thd', 'inrushI2tA2s', 'holdUpS'] as const;

export function toJsonRectifier(analysis: RectifierAnalysis, lines: LineIndex): JsonRectifier {
  const { rectifier, solution } = analysis;
  const worst: Record<string, number | undefined> = {};
  const worstCorner: Record<string, string | undefined> = {};
  for (const figure of WORST_FIGURES) {
    worst[figure] = solution.worst[figure]?.value;
    worstCorner[figure] = solution.worst[figure]?.corner;
  }
  return {
    id: rectifier.id,
    kind: rectifier.kind,
    devices: rectifier.devices.map((d) => d.name),
    line: lines.positionAt(rectifier.anchor.span.start).line + 1,
    worst,
    worstCorner,
    load: jsonLoad(analysis),
    ...(analysis.circuit.inrushLimiter ? { inrushLimiter: analysis.circuit.inrushLimiter } : {}),
    capacitors: analysis.capacitors.flatMap((c) => (c.stress ? [jsonCapacitor(c.name, c.stress)] : [])),
    corners: solution.corners.map((c) => ({
      name: c.name, lineVrms: c.lineVrms, ambientC: c.ambientC, freqHz: c.freqHz, load: c.load, loadLevel: c.loadLevel, parts: c.parts, vOutAvgV: c.vOutAvgV, rippleVpp: c.rippleVpp,
      capRippleIrmsA: c.capRippleIrmsA, efficiency: c.efficiency, sourceIrmsA: c.sourceIrmsA, powerFactor: c.powerFactor, thd: c.thd,
      harmonicsA: c.harmonicsA, inrushPeakA: c.inrushPeakA, inrushCase: c.inrushCase, inrushI2tA2s: c.inrushI2tA2s, holdUpS: c.holdUpS,
      devices: c.devices.map((d) => ({
        name: d.name, pivV: d.pivV, ipkA: d.ipkA, iavgA: d.iavgA, irmsA: d.irmsA, lossW: d.lossW, tjC: d.tjC,
        inrushPeakA: d.inrushPeakA, inrushI2tA2s: d.inrushI2tA2s, inrushCase: d.inrushCase,
      })),
    })),
  };
}

function jsonCapacitor(name: string, s: CapacitorStress): JsonCapacitor {
  return {
    name, esrOhm: s.esr?.ohm, coreRiseModel: s.riseModel,
    worst: { lossW: s.lossW?.value, coreC: s.coreC?.value, lifeH: s.lifeH?.value },
    worstCorner: { lossW: s.lossW?.corner, coreC: s.coreC?.corner, lifeH: s.lifeH?.corner },
    corners: s.corners.map((c) => ({ name: c.corner, irmsA: c.irmsA, lossW: c.lossW, coreC: c.coreC, lifeH: c.lifeH })),
  };
}

function jsonLoad(analysis: RectifierAnalysis): JsonLoad {
  const { kind, elements: _elements, fromDirective, light, fixed, ...amounts } = analysis.rectifier.surroundings.load;
  const out: JsonLoad = { full: { kind, ...amounts } as Load, fromDirective };
  if (light) out.light = light;
  if (fixed) out.fixed = fixed;
  return out;
}
