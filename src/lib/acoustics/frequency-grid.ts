/** Frequencies for drawing a response on a logarithmic axis. */
import { LIMITS } from './limits';
import { formatNumber, requireInRange } from './guards';

/**
 * `points` frequencies spaced evenly on a log axis from `fromHz` to `toHz` inclusive:
 * f_i = from·(to/from)^(i/(points − 1)). Equal ratios per step are what a log-frequency plot needs
 * (the same idea as IEC 61260-1's fractional-octave spacing). The last point is exactly `toHz`, so a
 * grid that ends at Nyquist does not overshoot it by a rounding error. Pass toHz = sampleRate/2 for
 * sample rates below 48 kHz.
 */
export function logFrequencyGrid(fromHz = 10, toHz = 24_000, points = 256): number[] {
  const from = requireInRange(fromHz, LIMITS.frequencyHz, 'The lowest frequency', 'Hz');
  const to = requireInRange(toHz, LIMITS.frequencyHz, 'The highest frequency', 'Hz');
  if (!(to > from)) {
    throw new RangeError(`The highest frequency (${formatNumber(to)} Hz) must be above the lowest (${formatNumber(from)} Hz); swap them.`);
  }
  if (!Number.isInteger(points) || points < 2 || points > LIMITS.maxResponsePoints) {
    throw new RangeError(`The number of points must be a whole number from 2 to ${LIMITS.maxResponsePoints}; got ${formatNumber(points)}.`);
  }
  const ratio = to / from;
  const grid = Array.from({ length: points }, (_, i) => from * ratio ** (i / (points - 1)));
  grid[0] = from;
  grid[points - 1] = to;
  return grid;
}
