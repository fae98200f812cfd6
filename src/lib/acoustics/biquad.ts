/**
 * Biquad coefficients exactly as the Audio EQ Cookbook gives them (R. Bristow-Johnson,
 * W3C Working Group Note, 8 June 2021), normalised so a0 = 1, plus the first-order sections
 * that odd-order Butterworth crossovers need.
 */
import { LIMITS } from './limits';
import { formatNumber, requireInRange, requireOneOf } from './guards';

/** H(z) = (b0 + b1·z⁻¹ + b2·z⁻²) / (1 + a1·z⁻¹ + a2·z⁻²). A first-order section has b2 = a2 = 0. */
export interface BiquadCoefficients {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

export const COOKBOOK_TYPES = ['peaking', 'lowshelf', 'highshelf', 'lowpass', 'highpass', 'bandpass', 'notch', 'allpass'] as const;
export type CookbookType = (typeof COOKBOOK_TYPES)[number];

export interface BiquadDesign {
  type: CookbookType;
  /** f0: centre, corner or shelf-midpoint frequency, Hz. Must be below sampleRateHz / 2. */
  frequencyHz: number;
  sampleRateHz: number;
  /** dBgain, for peaking and shelves (default 0). */
  gainDb?: number;
  /** Q (default 1/√2). For shelves it overrides shelfSlope when given. */
  q?: number;
  /** Cookbook shelf slope S, shelves only, used when q is absent (default 1). */
  shelfSlope?: number;
}

/** Checks a sample rate against LIMITS.sampleRateHz (a project range; no published source). */
export function requireSampleRate(sampleRateHz: unknown): number {
  return requireInRange(sampleRateHz, LIMITS.sampleRateHz, 'The sample rate', 'Hz', {
    hint: 'Common rates are 44100, 48000 and 96000 Hz.',
  });
}

/**
 * Checks that a frequency is at least LIMITS.frequencyHz.min and below Nyquist (sampleRateHz / 2):
 * a sampled system cannot represent anything at or above half its sample rate (Nyquist–Shannon;
 * Oppenheim & Schafer, Discrete-Time Signal Processing, 3rd ed., §4.2; section from memory).
 */
export function requireBelowNyquist(frequencyHz: unknown, sampleRateHz: number, label = 'The filter frequency', allowNyquist = false): number {
  const nyquist = requireSampleRate(sampleRateHz) / 2;
  // The common case returns before the refusal's sentence is built: responses call this per point.
  if (typeof frequencyHz === 'number' && frequencyHz >= LIMITS.frequencyHz.min && (allowNyquist ? frequencyHz <= nyquist : frequencyHz < nyquist)) return frequencyHz;
  return requireInRange(frequencyHz, { min: LIMITS.frequencyHz.min, max: nyquist }, label, 'Hz', {
    maxExclusive: !allowNyquist,
    hint: `At ${formatNumber(sampleRateHz)} Hz sampling nothing ${allowNyquist ? 'above' : 'at or above'} ${formatNumber(nyquist)} Hz (half the sample rate) exists; lower the frequency or raise the sample rate.`,
  });
}

function normalise(b0: number, b1: number, b2: number, a0: number, a1: number, a2: number): BiquadCoefficients {
  return { b0: b0 / a0, b1: b1 / a0, b2: b2 / a0, a1: a1 / a0, a2: a2 / a0 };
}

/**
 * Coefficients for one cookbook filter, normalised by a0.
 * Source: Audio EQ Cookbook (R. Bristow-Johnson; W3C WG Note 2021): A = 10^(dBgain/40), ω0 = 2π·f0/Fs,
 * α = sin ω0/(2Q) (case Q) or sin ω0/2·√((A + 1/A)(1/S − 1) + 2) (case S), and the LPF, HPF,
 * BPF (constant 0 dB peak gain), notch, APF, peakingEQ, lowShelf and highShelf formulas.
 * Because the cookbook pre-warps at f0: a peaking filter has exactly dBgain at f0, a shelf exactly
 * dBgain/2, and |H(f0)| = Q for the LPF and HPF.
 */
export function designBiquad(design: BiquadDesign): BiquadCoefficients {
  if (typeof design !== 'object' || design === null) {
    throw new RangeError('Describe the filter with a type, a frequencyHz and a sampleRateHz.');
  }
  const type = requireOneOf(design.type, COOKBOOK_TYPES, 'The filter type');
  const fs = requireSampleRate(design.sampleRateHz);
  const f0 = requireBelowNyquist(design.frequencyHz, fs);
  const w0 = (2 * Math.PI * f0) / fs;
  const cos = Math.cos(w0);
  const sin = Math.sin(w0);
  const isShelf = type === 'lowshelf' || type === 'highshelf';
  const gainDb = type === 'peaking' || isShelf ? requireInRange(design.gainDb ?? 0, LIMITS.gainDb, 'The gain', 'dB') : 0;
  const A = 10 ** (gainDb / 40);

  let alpha: number;
  if (isShelf && design.q === undefined) {
    const S = requireInRange(design.shelfSlope ?? 1, LIMITS.shelfSlope, 'The shelf slope S', '', {
      hint: 'S = 1 is the steepest slope that stays monotonic; for a steeper shelf give a Q instead.',
    });
    alpha = (sin / 2) * Math.sqrt((A + 1 / A) * (1 / S - 1) + 2);
  } else {
    const q = requireInRange(design.q ?? Math.SQRT1_2, LIMITS.q, 'Q', '');
    alpha = sin / (2 * q);
  }

  switch (type) {
    case 'lowpass':
      return normalise((1 - cos) / 2, 1 - cos, (1 - cos) / 2, 1 + alpha, -2 * cos, 1 - alpha);
    case 'highpass':
      return normalise((1 + cos) / 2, -(1 + cos), (1 + cos) / 2, 1 + alpha, -2 * cos, 1 - alpha);
    case 'bandpass':
      return normalise(alpha, 0, -alpha, 1 + alpha, -2 * cos, 1 - alpha);
    case 'notch':
      return normalise(1, -2 * cos, 1, 1 + alpha, -2 * cos, 1 - alpha);
    case 'allpass':
      return normalise(1 - alpha, -2 * cos, 1 + alpha, 1 + alpha, -2 * cos, 1 - alpha);
    case 'peaking':
      return normalise(1 + alpha * A, -2 * cos, 1 - alpha * A, 1 + alpha / A, -2 * cos, 1 - alpha / A);
    case 'lowshelf': {
      const k = 2 * Math.sqrt(A) * alpha;
      return normalise(
        A * (A + 1 - (A - 1) * cos + k),
        2 * A * (A - 1 - (A + 1) * cos),
        A * (A + 1 - (A - 1) * cos - k),
        A + 1 + (A - 1) * cos + k,
        -2 * (A - 1 + (A + 1) * cos),
        A + 1 + (A - 1) * cos - k,
      );
    }
    case 'highshelf': {
      const k = 2 * Math.sqrt(A) * alpha;
      return normalise(
        A * (A + 1 + (A - 1) * cos + k),
        -2 * A * (A - 1 + (A + 1) * cos),
        A * (A + 1 + (A - 1) * cos - k),
        A + 1 - (A - 1) * cos + k,
        2 * (A - 1 - (A + 1) * cos),
        A + 1 - (A - 1) * cos - k,
      );
    }
  }
}

/**
 * First-order low- or high-pass section with corner `frequencyHz`: the analog prototypes 1/(s + 1) and
 * s/(s + 1) through the same pre-warped bilinear substitution the cookbook uses,
 * s ← (1/tan(ω0/2))·(1 − z⁻¹)/(1 + z⁻¹). With K = tan(ω0/2): LP b0 = b1 = K/(1 + K); HP b0 = −b1 = 1/(1 + K);
 * a1 = (K − 1)/(K + 1). Source: Audio EQ Cookbook (bilinear substitution, "FYI" section); Oppenheim &
 * Schafer, Discrete-Time Signal Processing, 3rd ed., §7.2.2, bilinear transformation (section from memory).
 * Sharing the cookbook's pre-warp is what keeps cascades of these and cookbook sections exact at f0.
 */
export function designFirstOrder(side: 'lowpass' | 'highpass', frequencyHz: number, sampleRateHz: number): BiquadCoefficients {
  const fs = requireSampleRate(sampleRateHz);
  const f0 = requireBelowNyquist(frequencyHz, fs);
  const K = Math.tan((Math.PI * f0) / fs);
  const a1 = (K - 1) / (K + 1);
  return side === 'lowpass'
    ? { b0: K / (1 + K), b1: K / (1 + K), b2: 0, a1, a2: 0 }
    : { b0: 1 / (1 + K), b1: -1 / (1 + K), b2: 0, a1, a2: 0 };
}
