/** How a level changes with distance in the free field. */
import { LIMITS } from './limits';
import { formatNumber, requireInRange, requireOneOf } from './guards';

export type SourceGeometry = 'point' | 'line';

export interface LevelAtDistance {
  /** Level at the new distance, dB. */
  levelDb: number;
  /** New level minus the old one, dB (negative when moving away). */
  changeDb: number;
}

/**
 * Free-field level at `toMeters` given `levelDb` at `fromMeters`.
 * - point source: spherical spreading, ΔL = −20·log10(r2/r1), −6.02 dB per doubling
 *   (ISO 9613-2:1996 §7.1, eq. (7), geometrical divergence, clause and equation from memory; Kinsler et al., Fundamentals of Acoustics, 4th ed.).
 * - line source: cylindrical spreading, ΔL = −10·log10(r2/r1), −3.01 dB per doubling (Kinsler et al.,
 *   ibid., cylindrical waves; chapter from memory). A real line array only behaves like this in its
 *   near field; beyond its transition distance it falls off like a point source again — common practice.
 * Ignores air absorption, ground and room reflections, so outdoors at long range the real level is lower.
 */
export function levelAtDistance(
  levelDb: number,
  fromMeters: number,
  toMeters: number,
  source: SourceGeometry = 'point',
): LevelAtDistance {
  const level = requireInRange(levelDb, LIMITS.levelDb, 'The level', 'dB');
  const hint = 'A level is only defined some distance away from the source.';
  const from = requireInRange(fromMeters, LIMITS.distanceMeters, 'The measured distance', 'm', { minExclusive: true, hint });
  const to = requireInRange(toMeters, LIMITS.distanceMeters, 'The new distance', 'm', { minExclusive: true, hint });
  const geometry = requireOneOf(source, ['point', 'line'] as const, 'The source type');
  // Difference of logs, not log of the ratio: the ratio of a tiny and a large distance overflows.
  const changeDb = -(geometry === 'point' ? 20 : 10) * (Math.log10(to) - Math.log10(from));
  const levelAt = level + changeDb;
  // A valid pair of distances can still put the answer outside any level a meter reads (1e−320 m to 20 m).
  if (levelAt < LIMITS.levelDb.min || levelAt > LIMITS.levelDb.max) {
    throw new RangeError(
      `At that distance the level would be ${formatNumber(levelAt)} dB, outside ${LIMITS.levelDb.min} to ${LIMITS.levelDb.max} dB where this estimate means anything; check both distances and their unit.`,
    );
  }
  return { levelDb: levelAt, changeDb };
}
