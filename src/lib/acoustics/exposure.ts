/** How long a worker may stay in a steady noise level under the two common US rules. */
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
 * Table G-16 stops at 115 dBA for continuous noise; values above that are the formula's extrapolation.
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
