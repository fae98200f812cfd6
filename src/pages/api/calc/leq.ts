import { leq } from '~/lib/acoustics';
import { LeqQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Energy average of readings taken at equal intervals, optionally against a limit. */
export const GET = calcGet(LeqQuerySchema, ({ levels, limit }) => {
  const value = leq(levels);
  return { leq: value, count: levels.length, ...(limit !== undefined ? { limit, overLimit: value > limit + 1e-9 } : {}) };
});
