/** Time of flight of sound and its conversion to DSP delay units. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';
import { speedOfSound } from './speed-of-sound';

function requireDistance(value: unknown, label = 'The distance'): number {
  return requireInRange(value, LIMITS.distanceMeters, label, 'm', { hint: 'Measure distances as positive numbers of metres.' });
}

function requireSampleRate(value: unknown): number {
  return requireInRange(value, LIMITS.sampleRateHz, 'The sample rate', 'Hz', { hint: 'Common rates are 44100, 48000 and 96000 Hz.' });
}

/**
 * Time sound takes to travel `distanceMeters` through air, ms: t = d / c(T) × 1000.
 * Source: definition of speed; c(T) from `speedOfSound` (ideal gas, Kinsler et al.; with humidity, Cramer 1993).
 */
export function delayMs(distanceMeters: number, temperatureCelsius = 20, relativeHumidityPercent?: number): number {
  const d = requireDistance(distanceMeters);
  return (d / speedOfSound(temperatureCelsius, relativeHumidityPercent)) * 1000;
}

/**
 * Distance sound travels through air in `ms` milliseconds, m: d = c(T) × t / 1000.
 * Source: as for `delayMs`.
 */
export function distanceFromMs(ms: number, temperatureCelsius = 20, relativeHumidityPercent?: number): number {
  const t = requireInRange(ms, LIMITS.delayMs, 'The time', 'ms');
  return (speedOfSound(temperatureCelsius, relativeHumidityPercent) * t) / 1000;
}

/**
 * Milliseconds to samples at `sampleRateHz`: n = t × fs / 1000. Returned unrounded, because
 * processors differ: most round to whole samples, some accept fractions.
 * Source: definition of the sampling period T = 1/fs (A. V. Oppenheim & R. W. Schafer,
 * Discrete-Time Signal Processing, 3rd ed., §4.1; section from memory).
 */
export function msToSamples(ms: number, sampleRateHz: number): number {
  const t = requireInRange(ms, LIMITS.delayMs, 'The time', 'ms');
  return (t * requireSampleRate(sampleRateHz)) / 1000;
}

/** Samples to milliseconds at `sampleRateHz`: t = n / fs × 1000 (as for `msToSamples`). */
export function samplesToMs(samples: number, sampleRateHz: number): number {
  const fs = requireSampleRate(sampleRateHz);
  const n = requireInRange(samples, { min: 0, max: (LIMITS.delayMs.max * fs) / 1000 }, 'The number of samples', 'samples');
  return (n / fs) * 1000;
}
