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
  /** Relative humidity, % (optional: dry air when left out). */
  relativeHumidityPercent?: number;
  /** Extra delay so the main arrives first and keeps the image on stage, ms (default 0). */
  precedenceOffsetMs?: number;
  /** How much later the fill's signal path is than the main's (wireless link, extra DSP), ms (default 0). */
  latencyMs?: number;
}

/**
 * Longest lag of a fill behind the main that is left alone: it still fuses with the main and leaves
 * the image there. Haas (1972) found fusion up to about 30 ms for speech (figure from memory); 20 ms
 * keeps music clear of the echo threshold — common practice.
 */
export const PRECEDENCE_WINDOW_MS = 20;

/** Below this a delay is "none": no processor sets a thousandth of a microsecond. */
const NO_DELAY_MS = 1e-6;

export interface FillDelay {
  /** Delay to set, ms (never negative). */
  delayMs: number;
  /** Which loudspeaker gets that delay; 'none' when neither needs any. */
  delayOn: 'fill' | 'main' | 'none';
  /** How late the fill arrives after the main before any delay, ms (negative: the fill arrives first). */
  fillLagMs: number;
  /** Main path minus fill path, m (positive when the fill is closer). */
  pathDifferenceMeters: number;
}

/**
 * Delay that makes the fill arrive `precedenceOffsetMs` after the main at the listener. The fill's
 * own lag before any delay is lag = (fill − main)/c × 1000 + latency; the fill needs x = offset − lag.
 * - x > 0 (the usual case, fill closer than main): delay the fill by x.
 * - x ≈ 0: no delay needed.
 * - x < 0, the fill already lags by more than the offset: with an offset asked for and a lag inside
 *   PRECEDENCE_WINDOW_MS the fill needs no delay ('none'); otherwise (an exact alignment asked for,
 *   offset 0, or a lag long enough to be heard as an echo) only delaying the MAIN by −x lines them up
 *   ('main'). Delaying a main moves everything it covers, so the UI says so.
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
  const latency = requireInRange(input.latencyMs ?? 0, LIMITS.latencyMs, 'The fill latency', 'ms');
  const c = speedOfSound(input.temperatureCelsius ?? 20, input.relativeHumidityPercent);
  const fillLagMs = ((fill - main) / c) * 1000 + latency;
  const x = offset - fillLagMs;
  const pathDifferenceMeters = main - fill;
  if (Math.abs(x) < NO_DELAY_MS) return { delayMs: 0, delayOn: 'none', fillLagMs, pathDifferenceMeters };
  if (x > 0) return { delayMs: x, delayOn: 'fill', fillLagMs, pathDifferenceMeters };
  if (offset > 0 && fillLagMs <= PRECEDENCE_WINDOW_MS) return { delayMs: 0, delayOn: 'none', fillLagMs, pathDifferenceMeters };
  return { delayMs: -x, delayOn: 'main', fillLagMs, pathDifferenceMeters };
}
