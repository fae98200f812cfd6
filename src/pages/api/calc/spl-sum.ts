import { coherentSum, incoherentSum } from '~/lib/acoustics';
import { SplSumQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Sum of levels: by power for unrelated sources, by pressure with phases for the same signal. */
export const GET = calcGet(SplSumQuerySchema, ({ levels, mode, phases }) => ({
  total: mode === 'coherent' ? coherentSum(levels, phases) : incoherentSum(levels),
  mode,
  count: levels.length,
}));
