import { levelAtDistance } from '~/lib/acoustics';
import { DistanceQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Free-field level at a new distance from a point or line source. */
export const GET = calcGet(DistanceQuerySchema, ({ level, fromMeters, toMeters, source, unit }) => {
  const result = levelAtDistance(level, fromMeters, toMeters, source);
  return { level: result.levelDb, change: result.changeDb, source, unit };
});
