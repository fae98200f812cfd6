import { tabulatedFrequency, weightingDb } from '~/lib/acoustics';
import { WeightingQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** A, C or Z weighting per IEC 61672-1; a nominal band frequency is computed at its exact base-10 value, and says so. */
export const GET = calcGet(WeightingQuerySchema, ({ freq, curve }) => {
  const at = tabulatedFrequency(freq);
  return {
    db: weightingDb(curve, at.frequencyHz),
    curve,
    freq,
    ...(at.nominalHz !== undefined ? { exactHz: at.frequencyHz, note: `${freq} Hz is a nominal band frequency: computed at the exact ${Number(at.frequencyHz.toPrecision(6))} Hz, as IEC 61672-1 Table 3 is.` } : {}),
  };
});
