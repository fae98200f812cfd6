import { combFilter, speedOfSound } from '~/lib/acoustics';
import { CombQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Nulls and peaks of two equal arrivals, from their time or path difference. */
export const GET = calcGet(CombQuerySchema, (q) => {
  const delayMs = 'delayMs' in q && q.delayMs !== undefined ? q.delayMs : ((q as { distanceMeters: number }).distanceMeters / speedOfSound(q.temperatureCelsius, q.rh)) * 1000;
  return { ...combFilter(delayMs, q.upTo), delayMs };
});
