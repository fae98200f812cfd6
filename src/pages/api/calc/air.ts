import { airAbsorption } from '~/lib/acoustics';
import { AirQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Air absorption over a throw per ISO 9613-1, on top of the distance loss. */
export const GET = calcGet(AirQuerySchema, ({ freq, distanceMeters, temperatureCelsius, rh }) => ({
  ...airAbsorption(freq, distanceMeters, temperatureCelsius, rh),
  temperatureCelsius,
  rh,
}));
