/**
 * The analog prototypes the Audio EQ Cookbook starts from, and the real width of a digital band.
 * The cookbook defines Q on the analog prototype; the bilinear transform squeezes the frequency axis
 * towards Nyquist, so a band high up is narrower in the processor than its Q says.
 */
import { LIMITS } from './limits';
import { formatNumber, requireArray, requireInRange, requireOneOf } from './guards';
import { COOKBOOK_TYPES, designBiquad, requireBelowNyquist, requireSampleRate, type CookbookType } from './biquad';
import { sectionComplexResponse, type Complex } from './biquad-response';
import type { BiquadCoefficients } from './biquad';
import { logFrequencyGrid } from './frequency-grid';

export interface CookbookBand {
  type: CookbookType;
  freq: number;
  gain?: number;
  q?: number;
  /** Shelves only, used when q is absent (cookbook S). */
  shelfSlope?: number;
}

function divide(n: Complex, d: Complex): Complex {
  const m = d.re * d.re + d.im * d.im;
  return { re: (n.re * d.re + n.im * d.im) / m, im: (n.im * d.re - n.re * d.im) / m };
}

/** a·s² + b·s + c at s = jw. */
const quad = (a: number, b: number, c: number, w: number): Complex => ({ re: c - a * w * w, im: b * w });

/**
 * H(s) of the cookbook's analog prototype at s = j·f/f0 (normalised to the band's frequency).
 * Source: Audio EQ Cookbook (R. Bristow-Johnson, W3C WG Note 2021), "analog prototypes":
 * LPF 1/(s²+s/Q+1), HPF s²/(…), BPF (s/Q)/(…), notch (s²+1)/(…), APF (s²−s/Q+1)/(…),
 * peakingEQ (s²+s·A/Q+1)/(s²+s/(A·Q)+1), lowShelf A·(s²+(√A/Q)s+A)/(A·s²+(√A/Q)s+1),
 * highShelf A·(A·s²+(√A/Q)s+1)/(s²+(√A/Q)s+A); shelves take 1/Q = √((A+1/A)(1/S−1)+2) when given S.
 */
export function analogPrototypeResponse(band: CookbookBand, frequencyHz: number): Complex {
  const at = analogPrototype(band);
  return at(requireInRange(frequencyHz, LIMITS.frequencyHz, 'The response frequency', 'Hz'));
}

/** The band checked once, as a function of frequency (Hz) for curves and searches; sources as above. */
function analogPrototype(band: CookbookBand): (frequencyHz: number) => Complex {
  if (typeof band !== 'object' || band === null) throw new RangeError('Describe the band with a type and a freq (Hz).');
  const type = requireOneOf(band.type, COOKBOOK_TYPES, 'The filter type');
  const f0 = requireInRange(band.freq, LIMITS.frequencyHz, 'The band frequency', 'Hz');
  const isShelf = type === 'lowshelf' || type === 'highshelf';
  const gain = type === 'peaking' || isShelf ? requireInRange(band.gain ?? 0, LIMITS.gainDb, 'The gain', 'dB') : 0;
  const A = 10 ** (gain / 40);
  let q: number;
  if (isShelf && band.q === undefined) {
    const S = requireInRange(band.shelfSlope ?? 1, LIMITS.shelfSlope, 'The shelf slope S', '');
    q = 1 / Math.sqrt((A + 1 / A) * (1 / S - 1) + 2);
  } else {
    q = requireInRange(band.q ?? Math.SQRT1_2, LIMITS.q, 'Q', '');
  }
  return (f) => {
    const w = f / f0;
    const den = quad(1, 1 / q, 1, w);
    switch (type) {
      case 'lowpass':
        return divide({ re: 1, im: 0 }, den);
      case 'highpass':
        return divide(quad(1, 0, 0, w), den);
      case 'bandpass':
        return divide(quad(0, 1 / q, 0, w), den);
      case 'notch':
        return divide(quad(1, 0, 1, w), den);
      case 'allpass':
        return divide(quad(1, -1 / q, 1, w), den);
      case 'peaking':
        return divide(quad(1, A / q, 1, w), quad(1, 1 / (A * q), 1, w));
      case 'lowshelf': {
        const r = divide(quad(1, Math.sqrt(A) / q, A, w), quad(A, Math.sqrt(A) / q, 1, w));
        return { re: A * r.re, im: A * r.im };
      }
      case 'highshelf': {
        const r = divide(quad(A, Math.sqrt(A) / q, 1, w), quad(1, Math.sqrt(A) / q, A, w));
        return { re: A * r.re, im: A * r.im };
      }
    }
  };
}

/** |H| in dB of the analog prototype at each of `freqsHz` (checked once), floored at −300 dB like the digital responses. */
export function analogPrototypeDb(band: CookbookBand, freqsHz: readonly number[]): number[] {
  const at = analogPrototype(band);
  return (requireArray(freqsHz, 'The list of frequencies', 1, LIMITS.maxResponsePoints) as number[]).map((f, i) => {
    const hz = requireInRange(f, LIMITS.frequencyHz, `Response frequency ${i + 1}`, 'Hz');
    return Math.max(db(at(hz)), -300);
  });
}

const db = (h: Complex) => 20 * Math.log10(Math.hypot(h.re, h.im));

/** |H| in dB of a checked section at f; unchecked on purpose, since the searches below call it hundreds of times. */
const sectionDb = (c: BiquadCoefficients, f: number, fs: number) => db(sectionComplexResponse(c, (2 * Math.PI * f) / fs));

/** Bisection on a log axis for the frequency between lo and hi where `level(f)` crosses `target`. */
function crossing(level: (f: number) => number, target: number, lo: number, hi: number): number {
  const above = level(lo) > target;
  for (let i = 0; i < 100; i++) {
    const mid = Math.sqrt(lo * hi);
    if (level(mid) > target === above) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(lo * hi);
}

export interface HalfGainWidth {
  lowHz: number;
  highHz: number;
  octaves: number;
}

function widthOf(level: (f: number) => number, gain: number, f0: number, top: number): HalfGainWidth {
  const lowHz = crossing(level, gain / 2, LIMITS.frequencyHz.min, f0);
  const highHz = crossing(level, gain / 2, f0, top);
  return { lowHz, highHz, octaves: Math.log2(highHz / lowHz) };
}

function requireBell(band: CookbookBand): number {
  if (typeof band !== 'object' || band === null || band.type !== 'peaking') throw new RangeError('The half-gain width is defined for a bell (peaking) band only.');
  const gain = requireInRange(band.gain ?? 0, LIMITS.gainDb, 'The gain', 'dB');
  if (gain === 0) throw new RangeError('A bell with 0 dB gain has no half-gain points; give it a gain.');
  return gain;
}

/**
 * Width in octaves between the half-gain (dBgain/2) points of a bell as the processor really runs it
 * (the cookbook biquad at `sampleRateHz`), found by bisection on the digital response. A digital bell
 * returns to 0 dB at DC and at Nyquist, so both points exist. Example: +12 dB, Q √2 at 48 kHz is
 * 0.997 octave wide at 1 kHz but 0.417 octave at 16 kHz.
 * Source: Audio EQ Cookbook, "BW … between midpoint (dBgain/2) gain frequencies" and its digital
 * relation 1/Q = 2·sinh(ln2/2·BW·ω0/sin ω0).
 */
export function digitalHalfGainWidth(band: CookbookBand, sampleRateHz: number): HalfGainWidth {
  const gain = requireBell(band);
  const fs = requireSampleRate(sampleRateHz);
  const f0 = requireBelowNyquist(band.freq, fs, 'The band frequency');
  const coefficients = designBiquad({ type: 'peaking', frequencyHz: f0, sampleRateHz: fs, gainDb: gain, q: band.q });
  return widthOf((f) => sectionDb(coefficients, f, fs), gain, f0, fs / 2);
}

/**
 * The same width on the analog prototype, where the cookbook defines Q: BW = (2/ln 2)·asinh(1/(2Q)),
 * the edges symmetric about f0 on a log axis (Audio EQ Cookbook, peakingEQ, "case Q" and BW).
 */
export function analogHalfGainWidth(band: CookbookBand): HalfGainWidth {
  requireBell(band);
  const f0 = requireInRange(band.freq, LIMITS.frequencyHz, 'The band frequency', 'Hz');
  const q = requireInRange(band.q ?? Math.SQRT1_2, LIMITS.q, 'Q', '');
  const octaves = (2 / Math.LN2) * Math.asinh(1 / (2 * q));
  return { lowHz: f0 * 2 ** (-octaves / 2), highHz: f0 * 2 ** (octaves / 2), octaves };
}

/**
 * Largest difference, dB, between the digital band at `sampleRateHz` and its analog prototype over
 * 20 Hz up to 20 kHz or Nyquist. Over about half a dB the two are worth drawing together. (Project convention.)
 */
export function prototypeDepartureDb(band: CookbookBand, sampleRateHz: number): number {
  const fs = requireSampleRate(sampleRateHz);
  const f0 = requireBelowNyquist(band?.freq, fs, 'The band frequency');
  const coefficients = designBiquad({ type: band.type, frequencyHz: f0, sampleRateHz: fs, gainDb: band.gain, q: band.q, shelfSlope: band.shelfSlope });
  const at = analogPrototype(band);
  let worst = 0;
  for (const f of logFrequencyGrid(20, Math.min(20_000, fs / 2), 200)) {
    const digital = Math.max(sectionDb(coefficients, f, fs), -300);
    const analog = Math.max(db(at(f)), -300);
    // Deep stop bands and notch centres differ by huge amounts that nobody hears; look at the audible part.
    if (digital < -60 && analog < -60) continue;
    worst = Math.max(worst, Math.abs(digital - analog));
  }
  if (!Number.isFinite(worst)) throw new RangeError(`The band at ${formatNumber(f0)} Hz has no finite response to compare.`);
  return worst;
}
