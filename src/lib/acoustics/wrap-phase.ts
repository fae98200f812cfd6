/**
 * Wraps a phase in degrees into (−180, 180], the range analysers display
 * (principal value of the argument of a complex number, as atan2 gives it, with −180 mapped to +180).
 * Source: definition of the principal argument, e.g. Oppenheim & Schafer, Discrete-Time Signal
 * Processing, 3rd ed., §5.1 ("ARG"; section from memory). Throws on non-finite input rather than returning NaN.
 */
import { requireFinite } from './guards';

export function wrapPhaseDeg(phaseDeg: number): number {
  const p = requireFinite(phaseDeg, 'The phase', '°');
  const wrapped = p - 360 * Math.floor((p + 180) / 360);
  // floor puts exactly −180 at the bottom, which the range excludes; rounding in the division can also
  // leave a hair outside either end for huge inputs.
  if (wrapped <= -180) return wrapped + 360;
  if (wrapped > 180) return wrapped - 360;
  return wrapped;
}
