import { backgroundCorrection, backgroundWarning } from '~/lib/acoustics';
import { BackgroundQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** The source alone from a total and a background reading; refused when they are too close, warned under 6 dB. */
export const GET = calcGet(BackgroundQuerySchema, ({ total, background }) => {
  const source = backgroundCorrection(total, background);
  const warning = backgroundWarning(total, background);
  return { source, correction: total - source, ...(warning ? { warning } : {}) };
});
