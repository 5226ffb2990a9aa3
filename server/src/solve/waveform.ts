/**
 * Uniformly sampled waveforms of a record, for plotting: source voltage, output voltage, the
 * mains-referred source current and each device's current.
 */
/** What sampling reads of a record (the one-path record and the overlap solver's alike). */
export interface WaveformSource {
  count: number;
  t: number[];
  vLoadV: number[];
  net: { devices: readonly { name: string }[] };
  sourceCurrentA(k: number): number;
  sourceVoltageV(t: number): number;
  deviceCurrentA(k: number, d: number): number;
}

/** Sampled waveforms; every array has the length of tS. */
export interface Waveform {
  tS: number[];
  sourceV: number[];
  outputV: number[];
  /** Source current referred to the mains side (times the turns ratio). */
  sourceA: number[];
  /** One array per device, in the order of `deviceNames`. */
  deviceA: number[][];
  deviceNames: string[];
}

/** Samples a record at `points` uniform instants from its first to its last point. */
export function sampleWaveform(rec: WaveformSource, points: number, mainsScale: number): Waveform {
  const n = rec.count;
  const t0 = rec.t[0]!;
  const t1 = rec.t[n - 1]!;
  const nd = rec.net.devices.length;
  const w: Waveform = {
    tS: [], sourceV: [], outputV: [], sourceA: [], deviceA: rec.net.devices.map(() => []),
    deviceNames: rec.net.devices.map((d) => d.name),
  };
  let k = 0;
  for (let p = 0; p < points; p++) {
    const t = points > 1 ? t0 + ((t1 - t0) * p) / (points - 1) : t0;
    while (k < n - 2 && rec.t[k + 1]! < t) k++;
    const span = rec.t[k + 1]! - rec.t[k]!;
    const a = span > 0 ? Math.min(Math.max((t - rec.t[k]!) / span, 0), 1) : 0;
    const b = 1 - a;
    w.tS.push(t);
    w.sourceV.push(rec.sourceVoltageV(t));
    w.outputV.push(b * rec.vLoadV[k]! + a * rec.vLoadV[k + 1]!);
    w.sourceA.push(mainsScale * (b * rec.sourceCurrentA(k) + a * rec.sourceCurrentA(k + 1)));
    for (let d = 0; d < nd; d++) w.deviceA[d]!.push(b * rec.deviceCurrentA(k, d) + a * rec.deviceCurrentA(k + 1, d));
  }
  return w;
}
