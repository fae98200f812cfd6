/** Frequency weightings A, C and Z of sound level meters. */
import { LIMITS } from './limits';
import { requireInRange, requireOneOf } from './guards';
import { NOMINAL_THIRD_OCTAVE_HZ, exactMidbandHz } from './octave-bands';

/** Pole frequencies of the weighting networks, Hz (IEC 61672-1:2013 Annex E, E.2–E.3). */
export const WEIGHTING_POLES_HZ = {
  f1: 20.598997,
  f2: 107.65265,
  f3: 737.86223,
  f4: 12194.217,
} as const;

/** Normalisation constants: the un-normalised curves' values at 1 kHz, dB (IEC 61672-1:2013 Annex E). */
export const A1000_DB = -2.0;
export const C1000_DB = -0.062;

export type WeightingCurve = 'A' | 'C' | 'Z';

function requireFrequency(frequencyHz: unknown): number {
  return requireInRange(frequencyHz, LIMITS.frequencyHz, 'The frequency', 'Hz', {
    hint: 'Weightings are defined for positive frequencies.',
  });
}

/**
 * C-weighting, dB: C(f) = 20·log10[f4²·f² / ((f² + f1²)(f² + f4²))] − C1000.
 * Source: IEC 61672-1:2013 Annex E, equation (E.1) (equation number from memory).
 */
export function cWeightingDb(frequencyHz: number): number {
  const f2 = requireFrequency(frequencyHz) ** 2;
  const { f1, f4 } = WEIGHTING_POLES_HZ;
  return 20 * Math.log10((f4 * f4 * f2) / ((f2 + f1 * f1) * (f2 + f4 * f4))) - C1000_DB;
}

/**
 * A-weighting, dB: A(f) = 20·log10[f4²·f⁴ / ((f² + f1²)·√(f² + f2²)·√(f² + f3²)·(f² + f4²))] − A1000.
 * Source: IEC 61672-1:2013 Annex E, equation (E.6) (equation number from memory).
 */
export function aWeightingDb(frequencyHz: number): number {
  const fSq = requireFrequency(frequencyHz) ** 2;
  const { f1, f2, f3, f4 } = WEIGHTING_POLES_HZ;
  const ratio = (f4 * f4 * fSq * fSq) / ((fSq + f1 * f1) * Math.sqrt(fSq + f2 * f2) * Math.sqrt(fSq + f3 * f3) * (fSq + f4 * f4));
  return 20 * Math.log10(ratio) - A1000_DB;
}

/** Z-weighting ("zero"): 0 dB at every frequency (IEC 61672-1:2013 Table 3, Z column). The frequency is still checked so that every curve refuses the same inputs. */
export function zWeightingDb(frequencyHz: number): number {
  requireFrequency(frequencyHz);
  return 0;
}

/** Weighting `curve` at `frequencyHz`, dB (IEC 61672-1:2013 Annex E; see the per-curve functions). */
export function weightingDb(curve: WeightingCurve, frequencyHz: number): number {
  const which = requireOneOf(curve, ['A', 'C', 'Z'] as const, 'The weighting');
  return which === 'A' ? aWeightingDb(frequencyHz) : which === 'C' ? cWeightingDb(frequencyHz) : zWeightingDb(frequencyHz);
}

export interface TabulatedFrequency {
  /** The frequency the weighting is computed at, Hz. */
  frequencyHz: number;
  /** The nominal band frequency typed, when it was snapped to its exact base-10 value. */
  nominalHz?: number;
}

/**
 * IEC 61672-1 Table 3 lists nominal one-third-octave frequencies (16 Hz, 31.5 Hz…) but computes each
 * entry at the exact base-10 midband frequency 1000·10^(x/10) Hz (IEC 61260-1:2014 §5.2 / Table 3
 * footnote; from memory). A typed nominal frequency is snapped to that exact one, so 16 Hz answers the
 * table's −56.7 dB (at 15.849 Hz) rather than −56.4 dB; any other frequency is used as typed.
 */
export function tabulatedFrequency(frequencyHz: number): TabulatedFrequency {
  const f = requireFrequency(frequencyHz);
  const i = NOMINAL_THIRD_OCTAVE_HZ.findIndex((nominal) => Math.abs(nominal - f) < 1e-9 * nominal);
  if (i < 0) return { frequencyHz: f };
  const exact = exactMidbandHz(Math.round(10 * Math.log10(f / 1000)), 3);
  return Math.abs(exact - f) < 1e-12 * f ? { frequencyHz: f } : { frequencyHz: exact, nominalHz: f };
}

