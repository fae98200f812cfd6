/** The ways of a crossover (sub / low / high …), each with its own edges, gain, polarity and delay, and their electrical sum. */
import { LIMITS } from './limits';
import { formatNumber, requireArray, requireInRange, requireOneOf } from './guards';
import { requireBelowNyquist, requireSampleRate, type BiquadCoefficients } from './biquad';
import { sectionComplexResponse, toDbAndDegrees, type Complex } from './biquad-response';
import { crossoverSections, type CrossoverFamily } from './crossover';

export const POLARITIES = ['normal', 'inverted'] as const;
export type Polarity = (typeof POLARITIES)[number];

/** One edge of a way: a high-pass (the way's bottom) or a low-pass (its top). */
export interface CrossoverEdge {
  family: CrossoverFamily;
  /** dB/octave; the family decides which slopes exist (LIMITS.crossoverSlopesDbPerOctave). */
  slope: number;
  freq: number;
}

export interface CrossoverWay {
  /** The way's bottom edge; absent for the lowest way (a sub without a subsonic filter). */
  highPass?: CrossoverEdge | null;
  /** The way's top edge; absent for the highest way. */
  lowPass?: CrossoverEdge | null;
  gainDb?: number;
  polarity?: Polarity;
  delayMs?: number;
}

/** Most ways one crossover has (sub, low, mid, high). */
export const MAX_WAYS = 4;

function edgeSections(edge: CrossoverEdge, side: 'low' | 'high', fs: number, label: string): BiquadCoefficients[] {
  if (typeof edge !== 'object' || edge === null) throw new RangeError(`${label} must have a family, a slope and a freq (Hz).`);
  try {
    return crossoverSections(side, edge.family, edge.slope, edge.freq, fs);
  } catch (error) {
    if (error instanceof RangeError) throw new RangeError(`${label}: ${error.message}`);
    throw error;
  }
}

/** Sections of one way: its high-pass then its low-pass (Butterworth / Linkwitz-Riley via `crossoverSections`). */
export function waySections(way: CrossoverWay, sampleRateHz: number, label = 'The way'): BiquadCoefficients[] {
  if (typeof way !== 'object' || way === null) throw new RangeError(`${label} must be an object with its edges, gain, polarity and delay.`);
  const fs = requireSampleRate(sampleRateHz);
  return [
    ...(way.highPass ? edgeSections(way.highPass, 'high', fs, `${label}, high-pass`) : []),
    ...(way.lowPass ? edgeSections(way.lowPass, 'low', fs, `${label}, low-pass`) : []),
  ];
}

interface CheckedWay {
  sections: BiquadCoefficients[];
  scale: number;
  delaySeconds: number;
}

function checkWay(way: CrossoverWay, fs: number, index: number): CheckedWay {
  const label = `Way ${index + 1}`;
  const sections = waySections(way, fs, label);
  const gain = requireInRange(way.gainDb ?? 0, LIMITS.gainDb, `${label}: the gain`, 'dB');
  const polarity = requireOneOf(way.polarity ?? 'normal', POLARITIES, `${label}: the polarity`);
  const delay = requireInRange(way.delayMs ?? 0, LIMITS.delayMs, `${label}: the delay`, 'ms');
  return { sections, scale: 10 ** (gain / 20) * (polarity === 'inverted' ? -1 : 1), delaySeconds: delay / 1000 };
}

function response(way: CheckedWay, f: number, fs: number): Complex {
  // Sections and frequency were checked once up front; this runs per way per point.
  const omega = (2 * Math.PI * f) / fs;
  const h = way.sections.reduce<Complex>((acc, c) => {
    const x = sectionComplexResponse(c, omega);
    return { re: acc.re * x.re - acc.im * x.im, im: acc.re * x.im + acc.im * x.re };
  }, { re: 1, im: 0 });
  // A pure delay τ is e^{−j2πfτ}: exact for whole samples, the ideal fractional delay otherwise.
  const angle = -2 * Math.PI * f * way.delaySeconds;
  const c = Math.cos(angle) * way.scale;
  const s = Math.sin(angle) * way.scale;
  return { re: h.re * c - h.im * s, im: h.re * s + h.im * c };
}

export interface PhasedResponse {
  freqs: number[];
  magnitudeDb: number[];
  /** Wrapped to (−180, 180]; null where the magnitude is at its floor and the phase means nothing. */
  phaseDeg: (number | null)[];
}

export interface WaysResponse {
  ways: PhasedResponse[];
  /** The electrical sum of every way, polarity, gain and delay included. */
  sum: PhasedResponse;
}

/**
 * Each way's response and their electrical sum (complex addition: the signals add at one point, as
 * if the drivers were coincident). Gain scales by 10^(dB/20), inverted polarity multiplies by −1 and
 * a delay τ by e^{−j2πfτ}. Source: superposition of LTI systems (Oppenheim & Schafer, Discrete-Time
 * Signal Processing, 3rd ed., §2.3; section from memory); Linkwitz, JAES 24(1) 1976, for why the sum
 * is the test of a crossover.
 */
export function waysResponse(ways: readonly CrossoverWay[], freqsHz: readonly number[], sampleRateHz: number): WaysResponse {
  const fs = requireSampleRate(sampleRateHz);
  const list = requireArray(ways, 'The list of ways', 1, MAX_WAYS) as CrossoverWay[];
  const checked = list.map((way, i) => checkWay(way, fs, i));
  const freqs = (requireArray(freqsHz, 'The list of frequencies', 1, LIMITS.maxResponsePoints) as number[]).map((f, i) =>
    requireBelowNyquist(f, fs, `Response frequency ${i + 1}`, true),
  );
  const blank = (): PhasedResponse => ({ freqs, magnitudeDb: [], phaseDeg: [] });
  const out: WaysResponse = { ways: checked.map(blank), sum: blank() };
  const push = (target: PhasedResponse, h: Complex) => {
    const { magnitudeDb, phaseDeg } = toDbAndDegrees(h);
    target.magnitudeDb.push(magnitudeDb);
    target.phaseDeg.push(phaseAboveFloor(magnitudeDb, phaseDeg));
  };
  for (const f of freqs) {
    let re = 0;
    let im = 0;
    checked.forEach((way, i) => {
      const h = response(way, f, fs);
      re += h.re;
      im += h.im;
      push(out.ways[i]!, h);
    });
    push(out.sum, { re, im });
  }
  return out;
}

/**
 * Below this magnitude a phase is not drawn or reported, dB: 20·lg of the smallest relative step a
 * double resolves (2⁻⁵² ≈ −313 dB) leaves the angle as rounding noise well before the −300 dB floor,
 * and no measurement reaches 200 dB down. (Project convention.)
 */
export const PHASE_FLOOR_DB = -200;

/** The phase, or null where the magnitude is too small for it to mean anything (see PHASE_FLOOR_DB). */
export function phaseAboveFloor(magnitudeDb: number, phaseDeg: number): number | null {
  if (typeof magnitudeDb !== 'number' || typeof phaseDeg !== 'number' || !Number.isFinite(phaseDeg)) {
    throw new RangeError(`Give a magnitude in dB and a phase in degrees as numbers; got ${formatNumber(magnitudeDb)} and ${formatNumber(phaseDeg)}.`);
  }
  return magnitudeDb > PHASE_FLOOR_DB ? phaseDeg : null;
}
