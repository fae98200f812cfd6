/** Time alignment of subwoofers and tops around their crossover. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';

function requireFrequency(frequencyHz: unknown, label = 'The frequency'): number {
  return requireInRange(frequencyHz, LIMITS.frequencyHz, label, 'Hz');
}

/** Length of one cycle at `frequencyHz`, ms: T = 1000 / f (definition of period). */
export function periodMs(frequencyHz: number): number {
  return 1000 / requireFrequency(frequencyHz);
}

/**
 * Time equivalent of a phase difference at one frequency, ms: Δt = Δφ/360 / f × 1000.
 * Source: definition of phase of a sinusoid, φ = 360°·f·t. Sign follows Δφ.
 */
export function phaseToMs(phaseDeg: number, frequencyHz: number): number {
  const phase = requireInRange(phaseDeg, LIMITS.phaseDeg, 'The phase difference', '°');
  return (phase / 360 / requireFrequency(frequencyHz)) * 1000;
}

/**
 * Phase that a delay of `ms` produces at `frequencyHz`, degrees, not wrapped: Δφ = 360°·f·t / 1000.
 * Source: as for `phaseToMs`.
 */
export function msToPhaseDeg(ms: number, frequencyHz: number): number {
  const t = requireInRange(ms, LIMITS.delayMs, 'The time', 'ms');
  return (360 * requireFrequency(frequencyHz) * t) / 1000;
}

export interface SubToTopOffset {
  /** One cycle at the crossover, ms: the amount by which any alignment is ambiguous. */
  periodMs: number;
  /** Delay that removes the measured phase difference, ms (never negative). */
  offsetMs: number;
  /** Which side gets `offsetMs`. */
  delayOn: 'top' | 'sub';
}

/**
 * Delay that brings sub and top into phase at the crossover, from the phase difference measured there.
 * `phaseDifferenceDeg` is how far the sub lags the top (sub phase below top phase is positive):
 * a lagging sub means the top must wait, so a positive difference delays the top.
 * A phase reading cannot tell cycles apart: offsetMs ± any whole number of periodMs aligns the phase too,
 * so pick the candidate that also lines up the impulse-response peaks or the measured distances.
 * Source: Δt = Δφ/360/f (definition of phase); the whole-period ambiguity is common practice
 * in sub alignment.
 */
export function subToTopOffset(crossoverHz: number, phaseDifferenceDeg = 0): SubToTopOffset {
  const f = requireFrequency(crossoverHz, 'The crossover frequency');
  const shift = phaseToMs(phaseDifferenceDeg, f);
  return { periodMs: 1000 / f, offsetMs: Math.abs(shift), delayOn: shift >= 0 ? 'top' : 'sub' };
}
