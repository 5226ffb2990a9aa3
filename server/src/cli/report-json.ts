/** The JSON report of `check --format json` (DESIGN.md §8): stable names, SI units in the names, 1-based lines. */
import type { FileAnalysis, Snapshot } from '../analysis/analyze';
import { LineIndex } from '../../../grammar/src/index';
import type { RectifierAnalysis } from '../equivalent/index';
import type { DeviceSolution } from '../solve/index';

export interface JsonDiagnostic {
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  severity: string;
  code: string;
  message: string;
}

export type JsonDevice = Pick<DeviceSolution, 'name' | 'pivV' | 'ipkA' | 'iavgA' | 'irmsA' | 'lossW' | 'tjC'>;

export interface JsonCorner {
  name: string;
  lineVrms: number;
  ambientC: number;
  vOutAvgV?: number;
  rippleVpp?: number;
  capRippleIrmsA?: number;
  efficiency?: number;
  sourceIrmsA?: number;
  powerFactor?: number;
  thd?: number;
  harmonicsA?: number[];
  inrushPeakA?: number;
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
  corners: JsonCorner[];
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

export function toJsonReport(snapshot: Snapshot): JsonReport {
  return { version: 1, files: [...snapshot.files.values()].map(toJsonFile) };
}

function toJsonFile(file: FileAnalysis): JsonFile {
  const lines = new LineIndex(file.text);
  const diagnostics = file.findings
    .filter((f) => f.uri === file.uri)
    .map((f) => {
      const start = lines.positionAt(f.span.start);
      const end = lines.positionAt(f.span.end);
      return {
        line: start.line + 1, column: start.character + 1, endLine: end.line + 1, endColumn: end.character + 1,
        severity: f.severity, code: f.code, message: f.message,
      };
    });
  return { path: file.uri, rectifiers: file.rectifiers.map((r) => toJsonRectifier(r, lines)), diagnostics };
}

const WORST_FIGURES = ['vOutAvgV', 'rippleVpp', 'efficiency', 'powerFactor', 'inrushPeakA', 'capRippleIrmsA', 'thd', 'inrushI2tA2s', 'holdUpS'] as const;

function toJsonRectifier(analysis: RectifierAnalysis, lines: LineIndex): JsonRectifier {
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
    corners: solution.corners.map((c) => ({
      name: c.name, lineVrms: c.lineVrms, ambientC: c.ambientC, vOutAvgV: c.vOutAvgV, rippleVpp: c.rippleVpp,
      capRippleIrmsA: c.capRippleIrmsA, efficiency: c.efficiency, sourceIrmsA: c.sourceIrmsA, powerFactor: c.powerFactor, thd: c.thd,
      harmonicsA: c.harmonicsA, inrushPeakA: c.inrushPeakA, inrushI2tA2s: c.inrushI2tA2s, holdUpS: c.holdUpS,
      devices: c.devices.map((d) => ({ name: d.name, pivV: d.pivV, ipkA: d.ipkA, iavgA: d.iavgA, irmsA: d.irmsA, lossW: d.lossW, tjC: d.tjC })),
    })),
  };
}
