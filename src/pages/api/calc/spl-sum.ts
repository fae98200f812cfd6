import { coherentTotal, incoherentSum } from '~/lib/acoustics';
import { SplSumQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Sum of levels: by power for unrelated sources, by pressure with phases for the same signal; a full cancellation says so. */
export const GET = calcGet(SplSumQuerySchema, ({ levels, mode, phases }) => {
  if (mode !== 'coherent') return { total: incoherentSum(levels), mode, count: levels.length };
  const { totalDb, isNull } = coherentTotal(levels, phases);
  return {
    total: totalDb,
    mode,
    count: levels.length,
    ...(isNull ? { isNull: true, note: 'The sources cancel completely here: a null. The total is shown at the 120 dB floor below the loudest source.' } : {}),
  };
});
