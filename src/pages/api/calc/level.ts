import { proConsumerGapDb, signalLevel } from '~/lib/acoustics';
import { LevelQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** One signal level in dBu, dBV, dBFS (against the console's full scale), volts and, with a load, watts. */
export const GET = calcGet(LevelQuerySchema, ({ value, unit, fullScaleDbu, ohms }) => ({
  ...signalLevel(value, unit, fullScaleDbu, ohms),
  fullScaleDbu,
  proConsumerGapDb: proConsumerGapDb(),
}));
