/** Sound absorbed by the air itself over a long throw. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';
import { requireHumidity } from './speed-of-sound';

/** Reference air of ISO 9613-1: 293.15 K (at 101.325 kPa); triple-point isotherm 273.16 K. */
const T0_KELVIN = 293.15;
const T01_KELVIN = 273.16;

export interface AirAbsorption {
  /** Attenuation over the distance, dB. */
  attenuationDb: number;
  /** Attenuation coefficient, dB per km. */
  perKmDb: number;
}

/**
 * Pure-tone atmospheric absorption coefficient α, dB/m, per ISO 9613-1:1993 eqs. (3)–(5) and Annex B:
 * h = hr·(psat/pr)/(pa/pr) with psat/pr = 10^C, C = −6.8346·(T01/T)^1.261 + 4.6151;
 * frO = (pa/pr)(24 + 4.04e4·h·(0.02 + h)/(0.391 + h));
 * frN = (pa/pr)(T/T0)^−½ (9 + 280·h·exp{−4.170[(T/T0)^−⅓ − 1]});
 * α = 8.686 f² [1.84e−11 (pa/pr)^−1 (T/T0)^½ + (T/T0)^−5/2 (0.01275 e^(−2239.1/T)/(frO + f²/frO) + 0.1068 e^(−3352.0/T)/(frN + f²/frN))].
 * (Equation numbers from memory.) For a band, ISO 9613-1 takes the exact midband frequency.
 */
export function airAbsorptionDbPerMeter(frequencyHz: number, temperatureCelsius = 20, relativeHumidityPercent = 50): number {
  const f = requireInRange(frequencyHz, LIMITS.frequencyHz, 'The frequency', 'Hz');
  const t = requireInRange(temperatureCelsius, LIMITS.temperatureCelsius, 'The temperature', '°C', { hint: 'Enter the air temperature along the throw.' });
  const hr = requireHumidity(relativeHumidityPercent);
  const T = t + 273.15;
  // At the reference pressure; a venue's altitude changes α by a few per cent at most (ISO 9613-1 Table 1 is at 101.325 kPa).
  const pa = 1;
  const C = -6.8346 * (T01_KELVIN / T) ** 1.261 + 4.6151;
  const h = (hr * 10 ** C) / pa;
  const frO = pa * (24 + (4.04e4 * h * (0.02 + h)) / (0.391 + h));
  const frN = pa * (T / T0_KELVIN) ** -0.5 * (9 + 280 * h * Math.exp(-4.17 * ((T / T0_KELVIN) ** (-1 / 3) - 1)));
  const f2 = f * f;
  return (
    8.686 * f2 *
    (1.84e-11 * (1 / pa) * (T / T0_KELVIN) ** 0.5 +
      (T / T0_KELVIN) ** -2.5 * ((0.01275 * Math.exp(-2239.1 / T)) / (frO + f2 / frO) + (0.1068 * Math.exp(-3352.0 / T)) / (frN + f2 / frN)))
  );
}

/** Air absorption over `distanceMeters`: A = α·d (ISO 9613-1:1993 eq. (2), from memory; ISO 9613-2 §7.2 uses it outdoors). */
export function airAbsorption(frequencyHz: number, distanceMeters: number, temperatureCelsius = 20, relativeHumidityPercent = 50): AirAbsorption {
  const d = requireInRange(distanceMeters, LIMITS.distanceMeters, 'The distance', 'm');
  const alpha = airAbsorptionDbPerMeter(frequencyHz, temperatureCelsius, relativeHumidityPercent);
  return { attenuationDb: alpha * d, perKmDb: alpha * 1000 };
}
