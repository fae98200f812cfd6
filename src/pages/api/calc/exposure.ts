import { EXPOSURE_CAUTION, nioshRecommendedHours, oshaPermissibleHours } from '~/lib/acoustics';
import { ExposureQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** The two US rules are answered one at a time, never blended, and always with the caution. */
const RULES = {
  osha: { hours: oshaPermissibleHours, criterionDba: 90, exchangeRateDb: 5, name: 'OSHA 29 CFR 1910.95 permissible exposure' },
  niosh: { hours: nioshRecommendedHours, criterionDba: 85, exchangeRateDb: 3, name: 'NIOSH recommended exposure limit (Publication 98-126)' },
} as const;

export const GET = calcGet(ExposureQuerySchema, ({ level, standard }) => {
  const rule = RULES[standard];
  const hours = rule.hours(level);
  return { hours, minutes: hours * 60, standard, rule: rule.name, criterionDba: rule.criterionDba, exchangeRateDb: rule.exchangeRateDb, caution: EXPOSURE_CAUTION };
});
