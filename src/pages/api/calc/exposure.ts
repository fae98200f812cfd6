import { EXPOSURE_CAUTION, exposureLimit } from '~/lib/acoustics';
import { ExposureQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Each rule is answered on its own, never blended, always with the caution and its edges flagged. */
const RULES = {
  osha: { criterionDba: 90, exchangeRateDb: 5, name: 'OSHA 29 CFR 1910.95 permissible exposure (Table G-16, 90–115 dBA)' },
  niosh: { criterionDba: 85, exchangeRateDb: 3, name: 'NIOSH recommended exposure limit (Publication 98-126)' },
  eu: { criterionDba: 87, exchangeRateDb: 3, name: 'EU Directive 2003/10/EC exposure limit value, LEX,8h 87 dB(A) (action values 80 and 85)' },
} as const;

export const GET = calcGet(ExposureQuerySchema, ({ level, standard }) => {
  const rule = RULES[standard];
  const limit = exposureLimit(level, standard);
  const note = limit.notPermitted
    ? 'Not permitted: the rule allows no exposure at this level at all.'
    : limit.noDailyLimit
      ? 'No daily limit: at this level the rule allows more than 24 hours.'
      : undefined;
  return {
    ...limit,
    minutes: limit.hours === null ? null : limit.hours * 60,
    standard,
    rule: rule.name,
    criterionDba: rule.criterionDba,
    exchangeRateDb: rule.exchangeRateDb,
    ...(note ? { note } : {}),
    caution: EXPOSURE_CAUTION,
  };
});
