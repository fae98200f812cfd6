/** Speed of sound in air. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';

/** Speed of sound in dry air at 0 °C, m/s (the c0 used with the ideal-gas temperature law). */
export const SPEED_OF_SOUND_0C_MPS = 331.3;

/** 0 °C in kelvin (SI Brochure, 9th ed., BIPM 2019 §2.3.1). */
export const ZERO_CELSIUS_KELVIN = 273.15;

/**
 * Speed of sound in dry air, m/s: c = 331.3·√(1 + T/273.15).
 * Source: ideal-gas adiabatic sound speed c = √(γRT/M), scaled from c0 = 331.3 m/s at 0 °C; L. E. Kinsler
 * et al., Fundamentals of Acoustics, 4th ed. (Wiley, 2000), §5.6 (section from memory). Humidity adds
 * up to about 0.5 % at warm temperatures and is ignored, as it is in every delay calculator.
 */
export function speedOfSound(temperatureCelsius = 20): number {
  const t = requireInRange(temperatureCelsius, LIMITS.temperatureCelsius, 'The temperature', '°C', {
    hint: 'Enter the air temperature where the audience is.',
  });
  return SPEED_OF_SOUND_0C_MPS * Math.sqrt(1 + t / ZERO_CELSIUS_KELVIN);
}
