/** How long a worker may stay in a steady noise level under the two common US rules and the EU directive. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';

/** Shown beside every exposure figure. */
export const EXPOSURE_CAUTION =
  'These times are estimates from a formula, not a measurement or legal advice. ' +
  'A calibrated sound level meter or dosimeter and the rule that applies where you work decide; ' +
  'limits and exchange rates differ by country (many use 85 dB(A) with a 3 dB exchange rate rather than OSHA’s 90 dB(A) and 5 dB), ' +
  'and hearing damage can start below any of them.';

function requireLevel(levelDba: unknown): number {
  return requireInRange(levelDba, LIMITS.exposureLevelDba, 'The A-weighted level', 'dB(A)', {
    hint: 'Below 70 dB(A) neither rule sets a daily limit; above 140 dB any exposure risks immediate harm.',
  });
}

/**
 * OSHA permissible daily exposure, hours: T = 8 / 2^((L − 90)/5) — 90 dBA criterion, 5 dB exchange rate.
 * Source: 29 CFR 1910.95, Table G-16 (90 dBA 8 h … 115 dBA 0.25 h) and Appendix A, Table A-1 formula.
 * Table G-16 stops at 115 dBA for continuous noise; `exposureLimit` refuses to extrapolate past it.
 */
export function oshaPermissibleHours(levelDba: number): number {
  const level = requireLevel(levelDba);
  return 8 / 2 ** ((level - 90) / 5);
}

/**
 * NIOSH recommended daily exposure, hours: T = 8 / 2^((L − 85)/3) — 85 dBA REL, 3 dB exchange rate.
 * Source: NIOSH, Criteria for a Recommended Standard: Occupational Noise Exposure, Revised Criteria 1998,
 * DHHS (NIOSH) Publication No. 98-126, ch. 1 (T = 480 / 2^((L − 85)/3) minutes; equation number 1-1 from memory).
 */
export function nioshRecommendedHours(levelDba: number): number {
  const level = requireLevel(levelDba);
  return 8 / 2 ** ((level - 85) / 3);
}

/** Table G-16 of 29 CFR 1910.95 ends here: continuous noise above it is not permitted at all. */
export const OSHA_TABLE_MAX_DBA = 115;
/** NIOSH 98-126: no exposure to continuous, varying or impulsive noise above 140 dBA. */
export const NIOSH_CEILING_DBA = 140;
/** A day has 24 hours: a "permitted time" longer than that means the rule sets no daily limit. */
export const HOURS_PER_DAY = 24;

/** EU Directive 2003/10/EC Art. 3: exposure limit value and upper / lower exposure action values, LEX,8h dB(A). */
export const EU_LIMITS_DBA = { lowerAction: 80, upperAction: 85, limit: 87 } as const;

export type ExposureStandard = 'osha' | 'niosh' | 'eu';

export interface ExposureLimit {
  /** Permitted hours a day; null when the rule sets no daily limit at this level; 0 when not permitted at all. */
  hours: number | null;
  /** Above the end of the rule's table (OSHA 115 dBA) or its ceiling: no time at all. */
  notPermitted: boolean;
  /** The formula would allow more than 24 h: the rule sets no daily limit here. */
  noDailyLimit: boolean;
}

/**
 * EU 2003/10/EC time until LEX,8h reaches the exposure limit value (87 dB(A)) at a steady level:
 * LEX,8h = L + 10·log10(T/8) ⇒ T = 8·10^((87 − L)/10) (Directive 2003/10/EC Art. 2(b), with ISO 1999:1990
 * for the definition of LEX,8h). The directive's limit value counts the effect of hearing protectors; the
 * action values (80, 85) do not — see `euHoursToReach`.
 */
export function euHoursToReach(levelDba: number, lexDba: number = EU_LIMITS_DBA.limit): number {
  const level = requireLevel(levelDba);
  return 8 * 10 ** ((lexDba - level) / 10);
}

/**
 * Daily limit at a steady level under one rule, stopping at each rule's published edges instead of
 * extrapolating: OSHA above Table G-16's 115 dBA is not permitted; NIOSH above 140 dBA is not
 * permitted; any rule whose time exceeds 24 h sets no daily limit.
 */
export function exposureLimit(levelDba: number, standard: ExposureStandard): ExposureLimit {
  const level = requireLevel(levelDba);
  const ceiling = standard === 'osha' ? OSHA_TABLE_MAX_DBA : NIOSH_CEILING_DBA;
  // A level typed as 115 must read as the table's 115 even after float conversion from °-free text.
  if (standard !== 'eu' && level > ceiling + 1e-9) return { hours: 0, notPermitted: true, noDailyLimit: false };
  const hours = standard === 'osha' ? oshaPermissibleHours(level) : standard === 'niosh' ? nioshRecommendedHours(level) : euHoursToReach(level);
  if (hours > HOURS_PER_DAY) return { hours: null, notPermitted: false, noDailyLimit: true };
  return { hours, notPermitted: false, noDailyLimit: false };
}
