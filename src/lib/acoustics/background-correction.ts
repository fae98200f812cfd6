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

/** ISO 3744:2010 (engineering grade) wants the total at least this far above the background (clause from memory). */
export const ENGINEERING_BACKGROUND_MARGIN_DB = 6;

/**
 * Tolerance for comparing a difference of two typed levels with a threshold: 64.1 − 61.1 is
 * 2.9999999999999929 in binary floating point, and a person who typed a 3 dB difference means 3.
 */
export const THRESHOLD_TOLERANCE_DB = 1e-9;

/** A sentence when the margin is usable but under ISO 3744's 6 dB, else undefined. */
export function backgroundWarning(totalDb: number, backgroundDb: number): string | undefined {
  const margin = totalDb - backgroundDb;
  if (margin >= ENGINEERING_BACKGROUND_MARGIN_DB - THRESHOLD_TOLERANCE_DB) return undefined;
  return `The total is only ${formatNumber(margin)} dB above the background, under the ${ENGINEERING_BACKGROUND_MARGIN_DB} dB that ISO 3744 asks for: the corrected level is uncertain by a decibel or more, so treat it as an estimate and measure again when it is quieter if you can.`;
}

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
  if (margin < MIN_BACKGROUND_MARGIN_DB - THRESHOLD_TOLERANCE_DB) {
    throw new RangeError(
      `The background level must be at least ${MIN_BACKGROUND_MARGIN_DB} dB below the total to correct it (it is ${formatNumber(margin)} dB below); measure again closer to the source or when it is quieter around you.`,
    );
  }
  // 1 − 10^(−ΔL/10) written with expm1 so a 60 dB margin does not round to exactly 1.
  // A margin within the tolerance of 3 dB is corrected as exactly 3 dB.
  const used = Math.max(margin, MIN_BACKGROUND_MARGIN_DB);
  return total + 10 * Math.log10(-Math.expm1((-used / 10) * Math.LN10));
}
