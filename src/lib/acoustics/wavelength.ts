/** Wavelength of sound in air. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';
import { speedOfSound } from './speed-of-sound';
import { METERS_PER_FOOT } from './unit-conversions';

export interface Wavelength {
  meters: number;
  feet: number;
  /** Speed of sound used, m/s. */
  speed: number;
}

/** λ = c / f, with c(T, RH) from `speedOfSound` (definition of wavelength; Kinsler et al., Fundamentals of Acoustics, ch. 5). */
export function wavelength(frequencyHz: number, temperatureCelsius = 20, relativeHumidityPercent?: number): Wavelength {
  const f = requireInRange(frequencyHz, LIMITS.frequencyHz, 'The frequency', 'Hz');
  const speed = speedOfSound(temperatureCelsius, relativeHumidityPercent);
  const meters = speed / f;
  return { meters, feet: meters / METERS_PER_FOOT, speed };
}
