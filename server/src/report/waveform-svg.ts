/**
 * Waveform charts of one solved corner: a steady-state period (source and output voltage above,
 * source and device currents below) and the switch-on inrush half-cycle. Each trace carries a
 * stable `data-series` id: `source-voltage`, `output-voltage`, `source-current`,
 * `device-current:<name>`; inrush traces `inrush-source-voltage`, `inrush-output-voltage`,
 * `inrush-current` (the source current) and `inrush-device-current:<name>`.
 */
import { isNominalCorner, type CornerSolution, type Waveform } from '../solve/index';
import { renderTimeChart, TRACE_COLOURS, type ChartSeries } from './chart-svg';

/** Which corner a chart shows, for its title. */
export interface WaveformChartOptions {
  rectifierLabel: string;
  widthPx?: number;
}

/** The steady-state period of a corner as SVG, or undefined when the corner has no waveform. */
export function renderPeriodSvg(corner: CornerSolution, options: WaveformChartOptions): string | undefined {
  return renderWaveform(corner.waveform, options, {
    title: `one steady-state period at ${corner.name}`, chartId: 'period', timeUnit: 'ms', idPrefix: '', outputName: 'output',
  });
}

/** The first half-cycle after switch-on at the crest, capacitors empty, or undefined without one. */
export function renderInrushSvg(corner: CornerSolution, options: WaveformChartOptions): string | undefined {
  return renderWaveform(corner.inrushWaveform, options, {
    title: `switch-on inrush half-cycle at ${corner.name}${corner.inrushCase ? `, ${corner.inrushCase}` : ''}`, chartId: 'inrush', timeUnit: 'ms after switch-on', idPrefix: 'inrush-',
    outputName: 'output (charging)',
  });
}

interface WaveformChartKind {
  title: string;
  chartId: string;
  timeUnit: string;
  /** Prefix of the voltage and device-current series ids. */
  idPrefix: string;
  outputName: string;
}

function renderWaveform(w: Waveform | undefined, options: WaveformChartOptions, kind: WaveformChartKind): string | undefined {
  if (!w || w.tS.length < 2) return undefined;
  const t = relativeMs(w);
  return renderTimeChart({
    title: `${options.rectifierLabel}: ${kind.title}`,
    chartId: kind.chartId,
    timeUnit: kind.timeUnit,
    widthPx: options.widthPx,
    panels: [
      {
        quantity: 'Voltage', unit: 'V',
        series: [
          { id: `${kind.idPrefix}source-voltage`, name: 'source EMF', colour: TRACE_COLOURS.sourceVoltage, t, y: w.sourceV, dashed: true },
          { id: `${kind.idPrefix}output-voltage`, name: kind.outputName, colour: TRACE_COLOURS.outputVoltage, t, y: w.outputV },
        ],
      },
      { quantity: 'Current', unit: 'A', series: currentSeries(w, t, kind.idPrefix) },
    ],
  });
}

/** The source current (mains side) and each device's current. */
function currentSeries(w: Waveform, t: number[], prefix: string): ChartSeries[] {
  const source: ChartSeries = {
    id: prefix ? 'inrush-current' : 'source-current', name: 'source current (mains side)', colour: TRACE_COLOURS.sourceCurrent,
    t, y: w.sourceA, dashed: true,
  };
  // Devices that conduct together (a bridge's diagonal pair) have the same current; each later
  // trace is drawn narrower, so the ones beneath still show at its edges.
  const devices = w.deviceNames.map((name, k): ChartSeries => ({
    id: `${prefix}device-current:${name}`, name, colour: TRACE_COLOURS.devices[k % TRACE_COLOURS.devices.length]!, t, y: w.deviceA[k] ?? [],
    strokeWidthPx: Math.max(1.4, 4.2 - 0.9 * k), hideIdle: true,
  }));
  return [source, ...devices];
}

/** Sample times in milliseconds from the first sample. */
function relativeMs(w: Waveform): number[] {
  const t0 = w.tS[0] ?? 0;
  return w.tS.map((t) => (t - t0) * 1000);
}

/**
 * The corner a period chart shows by default: nominal line at nominal ambient when present (the
 * operating point a designer thinks of first), else the first corner with a waveform.
 */
export function defaultPeriodCorner(corners: readonly CornerSolution[]): CornerSolution | undefined {
  return corners.find((c) => isNominalCorner(c.name) && c.waveform) ?? corners.find((c) => c.waveform);
}

/** The corner an inrush chart shows: the one with the largest inrush peak, else the first with a waveform. */
export function defaultInrushCorner(corners: readonly CornerSolution[]): CornerSolution | undefined {
  const withWave = corners.filter((c) => c.inrushWaveform);
  return withWave.reduce<CornerSolution | undefined>((best, c) => (!best || (c.inrushPeakA ?? 0) > (best.inrushPeakA ?? 0) ? c : best), undefined);
}
