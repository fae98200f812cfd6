import { delayMs, msToSamples, speedOfSound } from '~/lib/acoustics';
import { DelayQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Time of flight over a distance at an air temperature, and the same in samples at a rate. */
export const GET = calcGet(DelayQuerySchema, ({ distanceMeters, temperatureCelsius, rate }) => {
  const ms = delayMs(distanceMeters, temperatureCelsius);
  return {
    ms,
    speed: speedOfSound(temperatureCelsius),
    ...(rate !== undefined ? { samples: msToSamples(ms, rate), rate } : {}),
    distanceMeters,
    temperatureCelsius,
  };
});
