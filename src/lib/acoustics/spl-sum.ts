/**
 * Adding sound levels: uncorrelated sources add by power, correlated ones (the same signal from
 * two boxes) by pressure with their phases.
 */
import { LIMITS } from './limits';
import { requireArray, requireInRange } from './guards';

/**
 * A coherent sum is never reported lower than this many dB below its loudest component.
 * Cancelling deeper than 120 dB needs two sources matched to about 1e−5 dB in level and 1e−4°
 * in phase, which no real pair of loudspeakers holds; below that the arithmetic shows only
 * rounding noise, and a true zero would give −Infinity, which JSON cannot carry.
 */
export const COHERENT_CANCELLATION_FLOOR_DB = 120;

function requireLevels(levelsDb: unknown): number[] {
  const list = requireArray(levelsDb, 'The list of levels', 1, LIMITS.maxLevels);
  return list.map((level, i) => requireInRange(level, LIMITS.levelDb, `Level ${i + 1}`, 'dB'));
}

/**
 * Level of uncorrelated sources together: L = 10·log10(Σ 10^(Li/10)).
 * Source: energetic summation of mean-square pressures of incoherent sources; L. E. Kinsler et al.,
 * Fundamentals of Acoustics, 4th ed. (Wiley, 2000), §5.12 "combining sound levels" (section from memory);
 * also the level definition of ISO 80000-8:2020. The loudest level is factored out so that
 * 10^(L/10) never overflows or loses the quiet terms.
 */
export function incoherentSum(levelsDb: number[]): number {
  const levels = requireLevels(levelsDb);
  const loudest = Math.max(...levels);
  const relativePower = levels.reduce((sum, level) => sum + 10 ** ((level - loudest) / 10), 0);
  return loudest + 10 * Math.log10(relativePower);
}

/**
 * Level of correlated sources with the given phases at the listener: L = 20·log10|Σ pi·e^(jφi)|,
 * pi = 10^(Li/20). Two equal sources in phase give +6.02 dB; 180° apart they cancel.
 * Source: superposition of harmonic pressures of one frequency (Kinsler et al., Fundamentals of
 * Acoustics, 4th ed., ch. 5; chapter from memory).
 *
 * Decision: the result is clamped to (loudest − COHERENT_CANCELLATION_FLOOR_DB) so total
 * cancellation answers a finite, clearly-floored number instead of −Infinity.
 * `phasesDeg` defaults to all zero (everything in phase).
 */
export function coherentSum(levelsDb: number[], phasesDeg?: number[]): number {
  const levels = requireLevels(levelsDb);
  let phases = levels.map(() => 0);
  if (phasesDeg !== undefined) {
    const list = requireArray(phasesDeg, 'The list of phases', 0, LIMITS.maxLevels);
    if (list.length !== levels.length) {
      throw new RangeError(`Give one phase per level: there are ${levels.length} levels but ${list.length} phases.`);
    }
    phases = list.map((phase, i) => requireInRange(phase, LIMITS.phaseDeg, `Phase ${i + 1}`, '°'));
  }
  const loudest = Math.max(...levels);
  let re = 0;
  let im = 0;
  phases.forEach((phase, i) => {
    const amplitude = 10 ** ((levels[i]! - loudest) / 20);
    const radians = (phase * Math.PI) / 180;
    re += amplitude * Math.cos(radians);
    im += amplitude * Math.sin(radians);
  });
  const relativeDb = 20 * Math.log10(Math.hypot(re, im));
  return loudest + Math.max(relativeDb, -COHERENT_CANCELLATION_FLOOR_DB);
}

export interface CoherentTotal {
  /** The total, dB, floored at COHERENT_CANCELLATION_FLOOR_DB below the loudest source. */
  totalDb: number;
  /** The sources cancel completely (deeper than the floor): a null, not a level. */
  isNull: boolean;
}

/**
 * `coherentSum` that says when the answer is a null: two equal sources 180° apart cancel completely,
 * which is not "120 dB below the loudest" but no sound at all at this frequency (a comb-filter null).
 */
export function coherentTotal(levelsDb: number[], phasesDeg?: number[]): CoherentTotal {
  const totalDb = coherentSum(levelsDb, phasesDeg);
  const loudest = Math.max(...levelsDb);
  return { totalDb, isNull: totalDb <= loudest - COHERENT_CANCELLATION_FLOOR_DB + 1e-9 };
}
