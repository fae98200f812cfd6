import { delayMs, msToSamples, speedOfSound } from '~/lib/acoustics';
import { DelayQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Time of flight over a distance at an air temperature, and the same in samples at a rate. */
export const GET = calcGet(DelayQuerySchema, ({ distanceMeters, temperatureCelsius, rate, rh }) => {
  const ms = delayMs(distanceMeters, temperatureCelsius, rh);
  return {
    ms,
    speed: speedOfSound(temperatureCelsius, rh),
    ...(rh !== undefined ? { rh } : {}),
    ...(rate !== undefined ? { samples: msToSamples(ms, rate), rate } : {}),
    distanceMeters,
    temperatureCelsius,
  };
});
