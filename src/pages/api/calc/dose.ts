import { EU_LIMITS_DBA, EXPOSURE_CAUTION, euDailyExposure, usDose } from '~/lib/acoustics';
import { DoseQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** A day of segments as a dose and TWA (OSHA, NIOSH) or as LEX,8h against the EU action values. */
export const GET = calcGet(DoseQuerySchema, ({ segments, standard }) =>
  standard === 'eu'
    ? { ...euDailyExposure(segments), standard, values: EU_LIMITS_DBA, caution: EXPOSURE_CAUTION }
    : { ...usDose(segments, standard), standard, caution: EXPOSURE_CAUTION },
);
