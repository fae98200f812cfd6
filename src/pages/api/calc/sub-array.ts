import { subArray } from '~/lib/acoustics';
import { SubArrayQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Quarter-wave spacing, delay and polarity for an end-fire line or a gradient pair. */
export const GET = calcGet(SubArrayQuerySchema, ({ freq, kind, temperatureCelsius }) => ({ ...subArray(freq, kind, temperatureCelsius), kind }));
