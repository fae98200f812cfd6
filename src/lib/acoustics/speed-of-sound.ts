/** Speed of sound in air. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';

/** Speed of sound in dry air at 0 °C, m/s (the c0 used with the ideal-gas temperature law). */
export const SPEED_OF_SOUND_0C_MPS = 331.3;

/** 0 °C in kelvin (SI Brochure, 9th ed., BIPM 2019 §2.3.1). */
export const ZERO_CELSIUS_KELVIN = 273.15;

/** Standard atmosphere, Pa (ISO 2533:1975). */
export const STANDARD_PRESSURE_PA = 101_325;

/** CO2 mole fraction Cramer (1993) used for his reference air. */
const CRAMER_CO2_MOLE_FRACTION = 0.000314;

/** Cramer (1993), eq. (8) coefficients a0…a15 (J. Acoust. Soc. Am. 93(5), p. 2510). */
const A = [
  331.5024, 0.603055, -0.000528, 51.471935, 0.1495874, -0.000782, -1.82e-7, 3.73e-8, -2.93e-10, -85.20931, -0.228525, 5.91e-5, -2.835149, -2.15e-13,
  29.179762, 0.000486,
] as const;

function requireTemperature(temperatureCelsius: unknown): number {
  return requireInRange(temperatureCelsius, LIMITS.temperatureCelsius, 'The temperature', '°C', {
    hint: 'Enter the air temperature where the audience is.',
  });
}

/** Relative humidity, checked (0–100 %). */
export function requireHumidity(relativeHumidityPercent: unknown): number {
  return requireInRange(relativeHumidityPercent, LIMITS.relativeHumidityPercent, 'The relative humidity', '%', {
    hint: 'Relative humidity runs from 0 % (dry) to 100 % (saturated).',
  });
}

/**
 * Mole fraction of water vapour from relative humidity, per Cramer (1993) / Giacomo (1982):
 * xw = h·f(p,t)·psv(T)/p, with the enhancement factor f = 1.00062 + 3.14e−8·p + 5.6e−7·t² and the
 * saturation vapour pressure psv = exp(1.2811805e−5·T² − 1.9509874e−2·T + 34.04926034 − 6.3536311e3/T) Pa.
 */
export function waterVaporMoleFraction(temperatureCelsius: number, relativeHumidityPercent: number): number {
  const pressurePa = STANDARD_PRESSURE_PA;
  const t = requireTemperature(temperatureCelsius);
  const h = requireHumidity(relativeHumidityPercent) / 100;
  const kelvin = t + ZERO_CELSIUS_KELVIN;
  const psv = Math.exp(1.2811805e-5 * kelvin * kelvin - 1.9509874e-2 * kelvin + 34.04926034 - 6.3536311e3 / kelvin);
  const f = 1.00062 + 3.14e-8 * pressurePa + 5.6e-7 * t * t;
  return (h * f * psv) / pressurePa;
}

/**
 * Speed of sound in air, m/s.
 * - Without humidity: dry air, c = 331.3·√(1 + T/273.15) — the ideal-gas adiabatic sound speed
 *   c = √(γRT/M) scaled from c0 = 331.3 m/s at 0 °C; L. E. Kinsler et al., Fundamentals of
 *   Acoustics, 4th ed. (Wiley, 2000), §5.6 (section from memory).
 * - With `relativeHumidityPercent`: O. Cramer, "The variation of the specific heat ratio and the
 *   speed of sound in air with temperature, pressure, humidity, and CO2 concentration",
 *   J. Acoust. Soc. Am. 93(5), 2510–2516 (1993), eq. (8), at 101.325 kPa and 314 ppm CO2.
 *   Humid air is faster: at 30 °C and 90 % RH by about 0.6 % over the dry formula.
 */
export function speedOfSound(temperatureCelsius = 20, relativeHumidityPercent?: number): number {
  const t = requireTemperature(temperatureCelsius);
  if (relativeHumidityPercent === undefined) return SPEED_OF_SOUND_0C_MPS * Math.sqrt(1 + t / ZERO_CELSIUS_KELVIN);
  const xw = waterVaporMoleFraction(t, relativeHumidityPercent);
  const p = STANDARD_PRESSURE_PA;
  const xc = CRAMER_CO2_MOLE_FRACTION;
  return (
    A[0] + A[1] * t + A[2] * t * t +
    (A[3] + A[4] * t + A[5] * t * t) * xw +
    (A[6] + A[7] * t + A[8] * t * t) * p +
    (A[9] + A[10] * t + A[11] * t * t) * xc +
    A[12] * xw * xw + A[13] * p * p + A[14] * xc * xc + A[15] * xw * p * xc
  );
}
