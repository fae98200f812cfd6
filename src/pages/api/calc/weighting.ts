import { weightingDb } from '~/lib/acoustics';
import { WeightingQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** A, C or Z weighting at one frequency per IEC 61672-1. */
export const GET = calcGet(WeightingQuerySchema, ({ freq, curve }) => ({ db: weightingDb(curve, freq), curve, freq }));
