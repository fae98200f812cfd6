/** Directional subwoofer arrays: end-fire lines and gradient (cardioid) pairs. */
import { LIMITS } from './limits';
import { requireInRange, requireOneOf } from './guards';
import { speedOfSound } from './speed-of-sound';

export type SubArrayKind = 'end-fire' | 'gradient';

export interface SubArray {
  /** Distance between neighbouring elements, front to back, m: a quarter wavelength. */
  spacing: number;
  /** Delay per element, ms: the time sound takes to cross one spacing (a quarter period). */
  delayMs: number;
  /** Which elements get `delayMs`: in an end-fire line each box ahead waits for the one behind; in a gradient pair the rear element waits. */
  delayOn: 'front' | 'rear';
  /** Invert the element behind (gradient pair) — never in an end-fire line. */
  invertPolarity: boolean;
  /** What it does, in words. */
  summary: string;
}

/**
 * Spacing d = λ/4 = c/(4f) and delay τ = d/c = 1/(4f) for the frequency to steer at.
 * - End-fire: boxes in a line along the throw, each one ahead delayed by τ·(its place in the line), so
 *   they add in front and partly cancel behind (rearward cancellation best at f and its odd multiples).
 * - Gradient (cardioid) pair: a rear element λ/4 behind the front one, delayed by τ and inverted, so it
 *   cancels the front element's sound behind the pair (2τ of path plus delay = half a period + 180°) and
 *   adds in front.
 * Sources: H. F. Olson, Acoustical Engineering (Van Nostrand, 1957), directional arrays and gradient
 * loudspeakers (chapter from memory); the quarter-wavelength spacing is common practice.
 */
export function subArray(frequencyHz: number, kind: SubArrayKind, temperatureCelsius = 20): SubArray {
  const f = requireInRange(frequencyHz, { min: 10, max: 500 }, 'The frequency to steer', 'Hz', { hint: 'Directional sub arrays work in the subwoofer band; 40–100 Hz is usual.' });
  const k = requireOneOf(kind, ['end-fire', 'gradient'] as const, 'The kind of array');
  const c = speedOfSound(requireInRange(temperatureCelsius, LIMITS.temperatureCelsius, 'The temperature', '°C'));
  const spacing = c / (4 * f);
  const delayMs = (spacing / c) * 1000;
  return k === 'end-fire'
    ? { spacing, delayMs, delayOn: 'front', invertPolarity: false, summary: 'Line the boxes up front to back; delay each box ahead of the rearmost by this much per step, polarity normal.' }
    : { spacing, delayMs, delayOn: 'rear', invertPolarity: true, summary: 'Put the rear element this far behind the front one, delay it by this much and invert its polarity.' };
}
