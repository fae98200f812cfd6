/** Loudest level a loudspeaker system can make at a distance, from its data sheet. */
import { LIMITS } from './limits';
import { requireComputed, requireInRange, requireOneOf } from './guards';

export type SensitivityReference = '1W' | '2.83V';

export interface MaxSplInput {
  /** Sensitivity, dB SPL at 1 m with the reference drive. */
  sensitivityDb: number;
  sensitivityRef?: SensitivityReference;
  /** Nominal impedance, Ω: needed to turn a 2.83 V sensitivity into a 1 W one. */
  ohms?: number;
  /** Amplifier power per box, W. */
  powerWatts: number;
  distanceMeters: number;
  /** Boxes playing the same signal, summed coherently (+20·log10 n) as at a distance where they act as one source. */
  boxes?: number;
}

export interface MaxSpl {
  /** Level at the distance, dB SPL. */
  level: number;
  /** Sensitivity referred to 1 W at 1 m, dB. */
  sensitivity1W: number;
  /** What the box count added, dB. */
  boxesGainDb: number;
  caution: string;
}

export const MAX_SPL_CAUTION =
  'This is the on-paper ceiling, not what you will measure: drivers heat up and lose several dB to power compression at full power, ' +
  'limiters and the amplifier’s real output at the actual load set the true limit, and boxes only add +6 dB per doubling where they ' +
  'arrive in phase. Running drivers at their rated power for long damages them; and levels like these harm hearing — keep the audience and crew within the limit that applies where you are.';

/**
 * L = S(1 W, 1 m) + 10·log10(P) − 20·log10(d) + 20·log10(n), with S(1 W) = S(2.83 V) − 10·log10(8/Z)
 * since 2.83 V into Z ohms is 8/Z watts. Check: 100 dB, 1000 W, 32 m → 99.90 dB.
 * Sources: loudspeaker sensitivity as defined in IEC 60268-5 (clause from memory); inverse-square law
 * (ISO 9613-2 geometrical divergence); coherent summation of n equal pressures, 20·log10 n (Kinsler et al.).
 * Ignores power compression, air absorption and the room; see MAX_SPL_CAUTION.
 */
export function maxSpl(input: MaxSplInput): MaxSpl {
  if (typeof input !== 'object' || input === null) throw new RangeError('Give the sensitivity, power and distance.');
  const s = requireInRange(input.sensitivityDb, LIMITS.sensitivityDb, 'The sensitivity', 'dB');
  const ref = requireOneOf(input.sensitivityRef ?? '1W', ['1W', '2.83V'] as const, 'The sensitivity reference');
  const power = requireInRange(input.powerWatts, LIMITS.powerWatts, 'The amplifier power', 'W');
  const d = requireInRange(input.distanceMeters, LIMITS.distanceMeters, 'The distance', 'm', { minExclusive: true, hint: 'The estimate starts at 1 m from the box.' });
  const n = requireInRange(input.boxes ?? 1, { min: 1, max: LIMITS.maxBoxes }, 'The number of boxes', '');
  if (!Number.isInteger(n)) throw new RangeError(`The number of boxes must be a whole number; got ${n}.`);
  let sensitivity1W = s;
  if (ref === '2.83V') {
    if (input.ohms === undefined) throw new RangeError('A 2.83 V sensitivity needs the box’s nominal impedance (ohms), e.g. 8.');
    const z = requireInRange(input.ohms, LIMITS.loadOhms, 'The nominal impedance', 'Ω');
    sensitivity1W = s - 10 * Math.log10(8 / z);
  }
  const boxesGainDb = 20 * Math.log10(n);
  const level = sensitivity1W + 10 * Math.log10(power) - 20 * Math.log10(d) + boxesGainDb;
  return { level: requireComputed(level, 'That combination is outside what this estimate handles; check the numbers.'), sensitivity1W, boxesGainDb, caution: MAX_SPL_CAUTION };
}
