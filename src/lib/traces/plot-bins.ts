/**
 * Thins a trace for drawing: a 100,000-point measurement drawn point by point would make an SVG
 * of megabytes for a plot a few hundred pixels wide. Points are grouped into bins of equal width
 * on the log-frequency axis and each bin is drawn at its power-average level and mean coherence.
 */
import type { Trace } from './parse-trace';

export interface PlotPoint {
  hz: number;
  db: number;
  coherence?: number;
}

export function binForPlot(trace: Trace, fromHz: number, toHz: number, bins = 480): PlotPoint[] {
  const logFrom = Math.log(fromHz);
  const span = Math.log(toHz) - logFrom;
  const power = new Float64Array(bins);
  const logHz = new Float64Array(bins);
  const coh = new Float64Array(bins);
  const count = new Uint32Array(bins);
  for (let i = 0; i < trace.freqHz.length; i++) {
    const hz = trace.freqHz[i];
    if (hz < fromHz || hz > toHz) continue;
    const b = Math.min(bins - 1, Math.floor(((Math.log(hz) - logFrom) / span) * bins));
    power[b] += 10 ** (trace.magnitudeDb[i] / 10);
    logHz[b] += Math.log(hz);
    if (trace.coherence) coh[b] += trace.coherence[i];
    count[b] += 1;
  }
  const out: PlotPoint[] = [];
  for (let b = 0; b < bins; b++) {
    if (count[b] === 0) continue;
    const point: PlotPoint = { hz: Math.exp(logHz[b] / count[b]), db: 10 * Math.log10(power[b] / count[b]) };
    if (trace.coherence) point.coherence = coh[b] / count[b];
    out.push(point);
  }
  return out;
}
