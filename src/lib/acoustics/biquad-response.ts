/** Frequency response of biquad sections evaluated on the unit circle. */
import { requireBelowNyquist, requireSampleRate, type BiquadCoefficients } from './biquad';
import { formatNumber, requireArray, requireFinite } from './guards';
import { wrapPhaseDeg } from './wrap-phase';

/**
 * Magnitudes are never reported below this, dB. 64-bit floats carry about 2⁻⁵³ ≈ −319 dB of relative
 * precision, so anything lower is rounding, and an exact zero (a notch right on its frequency)
 * would be −Infinity, which JSON cannot carry.
 */
export const RESPONSE_FLOOR_DB = -300;

export interface Complex {
  re: number;
  im: number;
}

export interface PointResponse extends Complex {
  magnitudeDb: number;
  /** Wrapped to (−180, 180]. */
  phaseDeg: number;
}

/**
 * H(e^{jω}) of one section at ω = 2π·f/fs: (b0 + b1·e^{−jω} + b2·e^{−2jω}) / (1 + a1·e^{−jω} + a2·e^{−2jω}).
 * Source: the z-transform evaluated on the unit circle, z = e^{jω} (Oppenheim & Schafer, Discrete-Time
 * Signal Processing, 3rd ed., §5.1; section from memory). No input checks, because it runs once per
 * section per point: callers check once per response. Not re-exported from index.ts for that reason.
 */
export function sectionComplexResponse(c: BiquadCoefficients, omega: number): Complex {
  const c1 = Math.cos(omega);
  const s1 = Math.sin(omega);
  const c2 = Math.cos(2 * omega);
  const s2 = Math.sin(2 * omega);
  const nRe = c.b0 + c.b1 * c1 + c.b2 * c2;
  const nIm = -(c.b1 * s1 + c.b2 * s2);
  const dRe = 1 + c.a1 * c1 + c.a2 * c2;
  const dIm = -(c.a1 * s1 + c.a2 * s2);
  const dMagSq = dRe * dRe + dIm * dIm;
  return { re: (nRe * dRe + nIm * dIm) / dMagSq, im: (nIm * dRe - nRe * dIm) / dMagSq };
}

const COEFFICIENT_NAMES = ['b0', 'b1', 'b2', 'a1', 'a2'] as const;

/** Refuses sections that are not five finite numbers; designs from this library always pass. (Project convention, no published source.) */
export function requireSections(sections: unknown): BiquadCoefficients[] {
  const list = requireArray(sections, 'The list of filter sections', 0, 1024);
  return list.map((section, i) => {
    if (typeof section !== 'object' || section === null) {
      throw new RangeError(`Section ${i + 1} must be an object with b0, b1, b2, a1 and a2; got ${formatNumber(section)}.`);
    }
    for (const name of COEFFICIENT_NAMES) requireFinite((section as Record<string, unknown>)[name], `Coefficient ${name} of section ${i + 1}`);
    return section as BiquadCoefficients;
  });
}

/**
 * Complex response of sections in cascade (product of the section responses) at `frequencyHz`.
 * Frequencies up to and including Nyquist are accepted, above it refused: a sampled response repeats
 * itself there. Source: cascade of LTI systems multiplies their transfer functions (Oppenheim & Schafer, ibid., §2.4; section from memory).
 */
export function cascadeComplexResponse(sections: readonly BiquadCoefficients[], frequencyHz: number, sampleRateHz: number): Complex {
  const checked = requireSections(sections);
  const fs = requireSampleRate(sampleRateHz);
  const f = requireBelowNyquist(frequencyHz, fs, 'The response frequency', true);
  const omega = (2 * Math.PI * f) / fs;
  let re = 1;
  let im = 0;
  for (const section of checked) {
    const h = sectionComplexResponse(section, omega);
    [re, im] = [re * h.re - im * h.im, re * h.im + im * h.re];
  }
  if (!Number.isFinite(re) || !Number.isFinite(im)) {
    // Only hand-made coefficients get here: a pole on the unit circle, or gains beyond double range.
    throw new RangeError(`The response at ${formatNumber(f)} Hz is infinite: the filter has a pole on the unit circle there or too much gain. Check the coefficients.`);
  }
  return { re, im };
}

/**
 * Magnitude in dB, 20·lg|H| (level of a field quantity, IEC 60027-3:2002; from memory), floored at
 * RESPONSE_FLOOR_DB, and phase arg H in degrees wrapped by `wrapPhaseDeg`.
 */
export function toDbAndDegrees(h: Complex): { magnitudeDb: number; phaseDeg: number } {
  const magnitude = Math.hypot(requireFinite(h.re, 'The real part'), requireFinite(h.im, 'The imaginary part'));
  const magnitudeDb = magnitude > 0 ? Math.max(20 * Math.log10(magnitude), RESPONSE_FLOOR_DB) : RESPONSE_FLOOR_DB;
  return { magnitudeDb, phaseDeg: wrapPhaseDeg((Math.atan2(h.im, h.re) * 180) / Math.PI) };
}

/**
 * Response of one biquad at one frequency: complex value, magnitude in dB and phase in degrees.
 * Source: as for `sectionComplexResponse`.
 */
export function biquadResponse(coefficients: BiquadCoefficients, frequencyHz: number, sampleRateHz: number): PointResponse {
  const h = cascadeComplexResponse([coefficients], frequencyHz, sampleRateHz);
  return { ...h, ...toDbAndDegrees(h) };
}
