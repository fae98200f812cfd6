/** Comb filtering: the same signal arriving twice, a short time apart. */
import { LIMITS } from './limits';
import { requireComputed, requireInRange } from './guards';

export interface CombFilter {
  /** Frequencies where the two arrivals cancel (equal levels: a null), Hz. */
  nulls: number[];
  /** Frequencies where they add in phase (+6 dB for equal levels), Hz. */
  peaks: number[];
  /** Spacing between neighbouring nulls (and peaks), Hz: 1/τ. */
  spacingHz: number;
  /** True when more frequencies fall below `upToHz` than the lists hold. */
  truncated: boolean;
}

/**
 * Nulls and peaks of two equal arrivals `delayMs` apart: the sum 1 + e^(−j2πfτ) is zero at
 * f = (2k + 1)/(2τ) and doubles at f = k/τ (k ≥ 1). 1 ms gives nulls at 500, 1500, 2500 Hz…
 * Source: F. A. Everest & K. C. Pohlmann, Master Handbook of Acoustics, 5th ed., ch. "Comb filter effects"
 * (chapter from memory); the formula follows from the definition of phase.
 */
export function combFilter(delayMs: number, upToHz = 20_000): CombFilter {
  const tauMs = requireInRange(delayMs, LIMITS.delayMs, 'The time difference', 'ms', { minExclusive: true, hint: 'Two arrivals at the same moment do not comb.' });
  const top = requireInRange(upToHz, LIMITS.frequencyHz, 'The highest frequency', 'Hz');
  const spacingHz = requireComputed(1000 / tauMs, 'The time difference is too small to comb anything audible; check the number.');
  const nulls: number[] = [];
  const peaks: number[] = [];
  const max = LIMITS.maxCombFrequencies;
  for (let k = 0; k < max && ((2 * k + 1) * spacingHz) / 2 <= top; k++) nulls.push(((2 * k + 1) * spacingHz) / 2);
  for (let k = 1; k <= max && k * spacingHz <= top; k++) peaks.push(k * spacingHz);
  const truncated = ((2 * max + 1) * spacingHz) / 2 <= top || (max + 1) * spacingHz <= top;
  return { nulls, peaks, spacingHz, truncated };
}
