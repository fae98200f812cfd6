import { octaveBands } from '~/lib/acoustics';
import { BandsQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Fractional-octave bands per IEC 61260-1 (base 10), exact and nominal midbands with edges. */
export const GET = calcGet(BandsQuerySchema, ({ fraction, from, to }) => ({
  fraction,
  bands: octaveBands(fraction, from, to).map(({ index, exact, nominal, low, high }) => ({ index, exact, nominal, low, high })),
}));
