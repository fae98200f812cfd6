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

export interface SubTopCandidate {
  /** What to do, in words. */
  action: string;
  /** Which side gets `delayMs`; 'none' when no delay is part of this candidate. */
  delayOn: 'top' | 'sub' | 'none';
  /** Delay to set, ms (never negative). */
  delayMs: number;
  /** Invert the sub's polarity. */
  invertPolarity: boolean;
  /** Phase left between sub and top at the crossover after this candidate, degrees (0…180). */
  phaseErrorDeg: number;
}

/** Below this a delay is none and a phase error is zero (a millionth of a degree). */
const EPSILON = 1e-6;

function wrap(phaseDeg: number): number {
  const wrapped = phaseDeg - 360 * Math.floor((phaseDeg + 180) / 360);
  return wrapped <= -180 ? wrapped + 360 : wrapped;
}

function candidate(shiftMs: number, invertPolarity: boolean, phaseErrorDeg: number, what: string): SubTopCandidate {
  const delayMs = Math.abs(shiftMs) < EPSILON ? 0 : Math.abs(shiftMs);
  const delayOn = delayMs === 0 ? 'none' : shiftMs > 0 ? 'top' : 'sub';
  const steps = [invertPolarity ? 'invert the sub’s polarity' : '', delayOn === 'none' ? '' : `delay the ${delayOn} by ${Number(delayMs.toFixed(3))} ms`].filter(Boolean);
  const action = `${steps.length ? steps.join(' and ') : 'change nothing'}${what ? ` (${what})` : ''}`;
  return { action: action[0]!.toUpperCase() + action.slice(1), delayOn, delayMs, invertPolarity, phaseErrorDeg: phaseErrorDeg < EPSILON ? 0 : phaseErrorDeg };
}

/**
 * Every usual way to bring sub and top into phase at the crossover, best first: the smallest delay
 * alone; a polarity flip alone (exact only at 180°, its phase error says how far off it leaves them);
 * a flip plus the remaining delay; and the delay-only answer one cycle later or earlier, which matches
 * the phase just as well but moves the arrivals by a whole period (pick by the impulse peaks).
 * `phaseDifferenceDeg` is how far the sub lags the top at `crossoverHz` (any real number: an
 * unwrapped reading is accepted). Positive delays wait the top, negative wait the sub.
 * Sources: φ = 360°·f·t (definition of phase); inverting polarity adds 180° at every frequency
 * (definition); the whole-cycle ambiguity and "flip before you delay" are common practice.
 * Ranking: smallest phase error, then smallest delay, then no flip.
 */
export function subTopCandidates(crossoverHz: number, phaseDifferenceDeg: number): SubTopCandidate[] {
  const f = requireFrequency(crossoverHz, 'The crossover frequency');
  const phase = requireInRange(phaseDifferenceDeg, LIMITS.measuredPhaseDeg, 'The phase difference', '°');
  const period = 1000 / f;
  const p = wrap(phase);
  const flipped = wrap(p - 180);
  const shift = (p / 360) * period;
  const list = [
    candidate(shift, false, 0, 'delay alone'),
    candidate(0, true, Math.abs(flipped), 'polarity flip alone'),
    candidate((flipped / 360) * period, true, 0, 'polarity flip and delay'),
    candidate(shift + period, false, 0, 'one cycle later'),
    candidate(shift - period, false, 0, 'one cycle earlier'),
  ];
  const seen = new Set<string>();
  return list
    .filter((c) => {
      const key = `${c.invertPolarity}:${c.delayOn}:${c.delayMs.toFixed(9)}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    })
    .sort((a, b) => a.phaseErrorDeg - b.phaseErrorDeg || a.delayMs - b.delayMs || Number(a.invertPolarity) - Number(b.invertPolarity));
}
