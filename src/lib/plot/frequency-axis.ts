/**
 * Geometry shared by every response plot (read view, editor, calculator, history): a log frequency
 * axis from 20 Hz to 20 kHz in a box PLOT_WIDTH units wide, and dB / degree axes.
 */
export const PLOT_WIDTH = 1000;
export const F_MIN = 20;
export const F_MAX = 20_000;

const SPAN = Math.log10(F_MAX / F_MIN);

/** x of a frequency, 0 at F_MIN and PLOT_WIDTH at F_MAX; outside the range it runs off the box. */
export const xOf = (hz: number) => (PLOT_WIDTH * Math.log10(hz / F_MIN)) / SPAN;

/** Heavier lines at the decades. */
export const DECADES = [100, 1000, 10_000];

/** Labelled gridlines: the 1-2-5 steps an engineer reads a log axis by. */
export const AXIS_LABELS = [20, 50, 100, 200, 500, 1000, 2000, 5000, 10_000, 20_000];

/** Fine unlabelled lines between the labels (the other whole multiples of each decade). */
export const MINOR_LINES = [30, 40, 60, 70, 80, 90, 300, 400, 600, 700, 800, 900, 3000, 4000, 6000, 7000, 8000, 9000];

export interface DbRange {
  top: number;
  bottom: number;
  step: number;
}

/**
 * A range that always shows ±12 dB around 0 and grows in 6 dB steps to fit the curves, down to
 * −60 dB: deeper stop bands are clipped, since nobody tunes by what happens 60 dB down.
 */
export function dbRange(values: readonly number[]): DbRange {
  let max = 0;
  let min = 0;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v > max) max = v;
    if (v < min) min = v;
  }
  const top = Math.min(30, Math.max(12, Math.ceil((max + 1) / 6) * 6));
  const bottom = Math.max(-60, Math.min(-12, Math.floor((min - 1) / 6) * 6));
  return { top, bottom, step: top - bottom > 48 ? 12 : 6 };
}

export function ticks(from: number, to: number, step: number): number[] {
  const list: number[] = [];
  for (let v = Math.ceil(from / step) * step; v <= to + 1e-9; v += step) list.push(v);
  return list;
}

/** y of a value in a box `height` tall showing top…bottom; values past the range are held just outside it. */
export function yScale(top: number, bottom: number, height: number): (v: number) => number {
  const margin = (top - bottom) * 0.2;
  return (v) => ((top - Math.min(top + margin, Math.max(bottom - margin, v))) / (top - bottom)) * height;
}

/**
 * An SVG path through (x(f), y(v)). A null value (no phase where there is no signal) breaks the
 * line, and so does a jump of more than `wrapAt` (a wrapped phase), instead of drawing a wall.
 */
export function curvePath(freqs: readonly number[], values: readonly (number | null)[], yOf: (v: number) => number, wrapAt?: number): string {
  let d = '';
  let previous: number | null = null;
  values.forEach((v, i) => {
    if (v === null || !Number.isFinite(v)) {
      previous = null;
      return;
    }
    const jump = wrapAt !== undefined && previous !== null && Math.abs(v - previous) > wrapAt;
    d += `${previous === null || jump ? 'M' : 'L'}${xOf(freqs[i]!).toFixed(1)} ${yOf(v).toFixed(1)}`;
    previous = v;
  });
  return d;
}

export function hzLabel(hz: number): string {
  return hz >= 1000 ? `${hz / 1000}k` : String(hz);
}
