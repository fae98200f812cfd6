/** Geometry of the response plot: a log frequency axis and dB / degree axes in a 1000-wide box. */
export const PLOT_WIDTH = 1000;
export const F_MIN = 10;
export const F_MAX = 24_000;

const SPAN = Math.log10(F_MAX / F_MIN);

export const xOf = (hz: number) => (PLOT_WIDTH * Math.log10(hz / F_MIN)) / SPAN;

/** Bold lines at each decade. */
export const DECADES = [10, 100, 1000, 10_000];

/** Fine lines at the octave-band centres (ISO 266 nominal labels), labelled one per octave. */
export const OCTAVE_CENTRES = [31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000, 16_000];

export const AXIS_LABELS = [10, ...OCTAVE_CENTRES];

export interface DbRange {
  top: number;
  bottom: number;
  step: number;
}

/**
 * A range that always shows ±12 dB around 0 and grows in 6 dB steps to fit the curve, down to
 * −60 dB: deeper stop bands are clipped, since nobody tunes by what happens 60 dB down.
 */
export function dbRange(values: readonly number[]): DbRange {
  const finite = values.filter(Number.isFinite);
  const max = finite.length ? Math.max(...finite) : 0;
  const min = finite.length ? Math.min(...finite) : 0;
  const top = Math.min(30, Math.max(12, Math.ceil((max + 1) / 6) * 6));
  const bottom = Math.max(-60, Math.min(-12, Math.floor((min - 1) / 6) * 6));
  return { top, bottom, step: top - bottom > 48 ? 12 : 6 };
}

export function ticks(from: number, to: number, step: number): number[] {
  const list: number[] = [];
  for (let v = Math.ceil(from / step) * step; v <= to + 1e-9; v += step) list.push(v);
  return list;
}

/** An SVG path through (x(f), y(v)); a jump of more than 180° in phase is drawn as a break, not a wall. */
export function curvePath(freqs: readonly number[], values: readonly number[], yOf: (v: number) => number, wrapAt?: number): string {
  let d = '';
  values.forEach((v, i) => {
    const jump = wrapAt !== undefined && i > 0 && Math.abs(v - values[i - 1]) > wrapAt;
    d += `${d === '' || jump ? 'M' : 'L'}${xOf(freqs[i]).toFixed(1)} ${yOf(v).toFixed(1)}`;
  });
  return d;
}

export function hzLabel(hz: number): string {
  return hz >= 1000 ? `${hz / 1000}k` : String(hz);
}
