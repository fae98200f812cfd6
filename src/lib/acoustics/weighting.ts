/** Frequency weightings A, C and Z of sound level meters. */
import { LIMITS } from './limits';
import { requireInRange, requireOneOf } from './guards';

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
