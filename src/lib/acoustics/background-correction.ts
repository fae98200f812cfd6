/** Removing background noise from a measured level. */
import { LIMITS } from './limits';
import { formatNumber, requireInRange } from './guards';

/**
 * Smallest difference between total and background level that this correction accepts, dB.
 * ISO 3746:2010 (survey grade) accepts corrections down to a 3 dB difference, ISO 3744:2010
 * (engineering grade) wants at least 6 dB; 3 dB is the common-practice floor, below which the
 * source is buried in the noise and the correction (≥ 3 dB) is too uncertain to report.
 * (Clause numbers of both standards not quoted: from memory.)
 */
export const MIN_BACKGROUND_MARGIN_DB = 3;

/**
 * Level of the source alone from the total with it running and the background without it:
 * Ls = 10·log10(10^(Lt/10) − 10^(Lb/10)), i.e. Lt − K1 with K1 = −10·log10(1 − 10^(−ΔL/10)).
 * Source: ISO 3744:2010 background noise correction K1 (from memory for the clause) with the
 * 3 dB minimum difference of ISO 3746:2010 / common practice.
 */
export function backgroundCorrection(totalDb: number, backgroundDb: number): number {
  const total = requireInRange(totalDb, LIMITS.levelDb, 'The total level', 'dB');
  const background = requireInRange(backgroundDb, LIMITS.levelDb, 'The background level', 'dB');
  const margin = total - background;
  if (margin < MIN_BACKGROUND_MARGIN_DB) {
    throw new RangeError(
      `The background level must be at least ${MIN_BACKGROUND_MARGIN_DB} dB below the total to correct it (it is ${formatNumber(margin)} dB below); measure again closer to the source or when it is quieter around you.`,
    );
  }
  // 1 − 10^(−ΔL/10) written with expm1 so a 60 dB margin does not round to exactly 1.
  return total + 10 * Math.log10(-Math.expm1((-margin / 10) * Math.LN10));
}
