/** A chain of EQ and crossover filters, as the UI and the API describe it, and its response. */
import { LIMITS } from './limits';
import { requireArray, requireOneOf } from './guards';
import { COOKBOOK_TYPES, designBiquad, requireBelowNyquist, requireSampleRate, type BiquadCoefficients } from './biquad';
import { crossoverSections, type CrossoverFamily } from './crossover';
import { RESPONSE_FLOOR_DB, cascadeComplexResponse, sectionComplexResponse, type Complex } from './biquad-response';
import { wrapPhaseDeg } from './wrap-phase';

export const FILTER_TYPES = [...COOKBOOK_TYPES, 'crossover-low', 'crossover-high'] as const;
export type FilterType = (typeof FILTER_TYPES)[number];

/** One filter in a chain. */
export interface FilterSpec {
  type: FilterType;
  /** Centre, corner, shelf-midpoint or crossover frequency, Hz. Must be below sampleRate / 2. */
  freq: number;
  /** Gain in dB for peaking and shelves (default 0); ignored by the others. */
  gain?: number;
  /** Q for peaking, lowpass, highpass, bandpass, notch, allpass (default 0.7071) and, when given, shelves. */
  q?: number;
  /**
   * Crossovers: slope in dB/octave (default 24). Shelves: the cookbook shelf slope S (default 1),
   * used only when q is absent. Ignored by the others.
   */
  slope?: number;
  /** Crossovers only (default 'linkwitz-riley'). */
  family?: CrossoverFamily;
}

/**
 * Sections realising one filter spec at `sampleRateHz`. Source: Audio EQ Cookbook (R. Bristow-Johnson) via
 * `designBiquad`; crossovers per Butterworth / Linkwitz (JAES 1976) via `crossoverSections`. Fields a type
 * does not use (a gain on a low-pass, say) are ignored rather than refused.
 */
export function filterSections(spec: FilterSpec, sampleRateHz: number): BiquadCoefficients[] {
  if (typeof spec !== 'object' || spec === null) {
    throw new RangeError('Each filter needs at least a type and a freq (Hz).');
  }
  const type = requireOneOf(spec.type, FILTER_TYPES, 'The filter type');
  if (type === 'crossover-low' || type === 'crossover-high') {
    return crossoverSections(
      type === 'crossover-low' ? 'low' : 'high',
      spec.family ?? 'linkwitz-riley',
      spec.slope ?? 24,
      spec.freq,
      sampleRateHz,
    );
  }
  return [
    designBiquad({
      type,
      frequencyHz: spec.freq,
      sampleRateHz,
      gainDb: spec.gain,
      q: spec.q,
      shelfSlope: type === 'lowshelf' || type === 'highshelf' ? spec.slope : undefined,
    }),
  ];
}

function prefixed(error: unknown, index: number): never {
  if (error instanceof RangeError) throw new RangeError(`Filter ${index + 1}: ${error.message}`);
  throw error;
}

/** Builds every filter's sections in order (sources as for `filterSections`), prefixing a refusal with the filter's position. */
export function chainSections(filters: readonly FilterSpec[], sampleRateHz: number): BiquadCoefficients[] {
  const list = requireArray(filters, 'The list of filters', 0, LIMITS.maxFilters) as FilterSpec[];
  const fs = requireSampleRate(sampleRateHz);
  return list.flatMap((spec, i) => {
    try {
      return filterSections(spec, fs);
    } catch (error) {
      return prefixed(error, i);
    }
  });
}

/**
 * Complex response of a filter chain at one frequency, for summing crossover sides, for example.
 * Source: as for `cascadeComplexResponse` (product of the section responses).
 */
export function chainComplexResponse(filters: readonly FilterSpec[], frequencyHz: number, sampleRateHz: number): Complex {
  return cascadeComplexResponse(chainSections(filters, sampleRateHz), frequencyHz, sampleRateHz);
}

export interface CascadeResponse {
  freqs: number[];
  /** Floored at RESPONSE_FLOOR_DB so that every value is finite. */
  magnitudeDb: number[];
  /** Wrapped to (−180, 180]. */
  phaseDeg: number[];
}

/**
 * Magnitude (dB) and phase (degrees, wrapped to (−180, 180]) of `filters` in cascade at each of `freqsHz`.
 * An empty chain is a wire: 0 dB, 0°. Frequencies above Nyquist are refused; Nyquist itself is allowed.
 * Magnitudes add in dB and phases add before wrapping, which is the product of the section responses
 * (Oppenheim & Schafer, Discrete-Time Signal Processing, 3rd ed., §2.4; section from memory) without
 * underflowing when many steep sections are far into their stop band.
 */
export function cascadeResponse(filters: readonly FilterSpec[], freqsHz: readonly number[], sampleRateHz: number): CascadeResponse {
  const sections = chainSections(filters, sampleRateHz);
  const freqs = (requireArray(freqsHz, 'The list of frequencies', 1, LIMITS.maxResponsePoints) as number[]).map((f, i) =>
    requireBelowNyquist(f, sampleRateHz, `Response frequency ${i + 1}`, true),
  );
  const magnitudeDb: number[] = [];
  const phaseDeg: number[] = [];
  for (const f of freqs) {
    const omega = (2 * Math.PI * f) / sampleRateHz;
    let db = 0;
    let radians = 0;
    for (const section of sections) {
      const h = sectionComplexResponse(section, omega);
      const magnitude = Math.hypot(h.re, h.im);
      db += magnitude > 0 ? 20 * Math.log10(magnitude) : -Infinity;
      radians += Math.atan2(h.im, h.re);
    }
    magnitudeDb.push(Math.max(db, RESPONSE_FLOOR_DB));
    phaseDeg.push(wrapPhaseDeg((radians * 180) / Math.PI));
  }
  return { freqs, magnitudeDb, phaseDeg };
}
