/** Delay for a fill loudspeaker so it lines up with the main system at a listener. */
import { LIMITS } from './limits';
import { requireInRange } from './guards';
import { speedOfSound } from './speed-of-sound';

export interface FillDelayInput {
  /** Path length from the main loudspeaker to the listening position, m. */
  mainMeters: number;
  /** Path length from the fill loudspeaker to the same position, m. */
  fillMeters: number;
  /** Air temperature, °C (default 20). */
  temperatureCelsius?: number;
  /** Extra delay so the main arrives first and keeps the image on stage, ms (default 0). */
  precedenceOffsetMs?: number;
}

export interface FillDelay {
  /** Delay to set, ms (never negative). */
  delayMs: number;
  /** Which loudspeaker gets that delay. */
  delayOn: 'fill' | 'main';
  /** Main path minus fill path, m (positive when the fill is closer). */
  pathDifferenceMeters: number;
}

/**
 * Delay that makes the fill arrive `precedenceOffsetMs` after the main at the listener:
 * x = (main − fill)/c × 1000 + offset.
 * - x ≥ 0 (the usual case, fill closer than main): delay the fill by x.
 * - x < 0 (the fill is farther than the main, or nearly as far and the offset does not fit): no delay
 *   on a fill can make it earlier, so the answer is the delay the MAIN would need, −x, with delayOn 'main'.
 *   Delaying a main moves everything it covers, so the UI should say so.
 * Sources: time of flight with c(T) from `speedOfSound`; the offset is the precedence (Haas) effect —
 * H. Haas, "The Influence of a Single Echo on the Audibility of Speech", J. Audio Eng. Soc. 20(2), 1972
 * (5–10 ms is common practice).
 */
export function fillDelayMs(input: FillDelayInput): FillDelay {
  if (typeof input !== 'object' || input === null) {
    throw new RangeError('Give the main and fill distances in metres (mainMeters, fillMeters).');
  }
  const hint = 'Measure both paths to the same listening position, in metres.';
  const main = requireInRange(input.mainMeters, LIMITS.distanceMeters, 'The main distance', 'm', { hint });
  const fill = requireInRange(input.fillMeters, LIMITS.distanceMeters, 'The fill distance', 'm', { hint });
  const offset = requireInRange(input.precedenceOffsetMs ?? 0, LIMITS.precedenceOffsetMs, 'The precedence offset', 'ms');
  const c = speedOfSound(input.temperatureCelsius ?? 20);
  const x = ((main - fill) / c) * 1000 + offset;
  // 0 belongs to the fill: "delay the fill by 0" reads right, "delay the main by 0" alarms people.
  return { delayMs: Math.abs(x), delayOn: x >= 0 ? 'fill' : 'main', pathDifferenceMeters: main - fill };
}
