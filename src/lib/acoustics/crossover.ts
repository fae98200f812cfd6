/** Butterworth and Linkwitz-Riley crossover sides built from cookbook sections. */
import { LIMITS } from './limits';
import { formatNumber, requireOneOf } from './guards';
import { designBiquad, designFirstOrder, requireBelowNyquist, requireSampleRate, type BiquadCoefficients } from './biquad';

export type CrossoverFamily = 'butterworth' | 'linkwitz-riley';
export type CrossoverSide = 'low' | 'high';

/**
 * Pole Qs of an order-n Butterworth low/high-pass, one per second-order section:
 * Q_k = 1 / (2·sin((2k − 1)·π / (2n))), k = 1 … ⌊n/2⌋, plus one first-order section when n is odd.
 * (Order 2: 0.7071; 4: 1.3066, 0.5412; 8: 2.5629, 0.9000, 0.6013, 0.5098.)
 * Source: Butterworth poles equally spaced on the unit circle — S. Butterworth, "On the Theory of
 * Filter Amplifiers", Wireless Engineer 7 (1930); A. B. Williams & F. J. Taylor, Electronic Filter
 * Design Handbook, 4th ed. (McGraw-Hill, 2006), ch. 2 (chapter from memory).
 */
export function butterworthSectionQs(order: number): { firstOrder: boolean; qs: number[] } {
  if (!Number.isInteger(order) || order < 1 || order > 8) {
    throw new RangeError(`A Butterworth order must be a whole number from 1 to 8; got ${formatNumber(order)}.`);
  }
  const qs: number[] = [];
  for (let k = 1; k <= Math.floor(order / 2); k++) {
    qs.push(1 / (2 * Math.sin(((2 * k - 1) * Math.PI) / (2 * order))));
  }
  return { firstOrder: order % 2 === 1, qs };
}

function butterworthSections(side: CrossoverSide, order: number, frequencyHz: number, sampleRateHz: number): BiquadCoefficients[] {
  const { firstOrder, qs } = butterworthSectionQs(order);
  const type = side === 'low' ? 'lowpass' : 'highpass';
  const sections = qs.map((q) => designBiquad({ type, frequencyHz, sampleRateHz, q }));
  return firstOrder ? [designFirstOrder(type, frequencyHz, sampleRateHz), ...sections] : sections;
}

/**
 * Whether the usual wiring of this crossover puts the high side in inverted polarity so that the two
 * sides sum flat. Linkwitz-Riley of odd Butterworth order (LR12, LR36) sum to a null at the crossover
 * with both sides normal and to an all-pass with the high side inverted (Linkwitz, JAES 24(1) 1976).
 * Advice only: `crossoverSections` never inverts anything; polarity is a per-way setting the person
 * sees and chooses.
 */
export function usualHighPolarity(family: CrossoverFamily, slopeDbPerOctave: number): 'normal' | 'inverted' {
  return family === 'linkwitz-riley' && (slopeDbPerOctave / 12) % 2 === 1 ? 'inverted' : 'normal';
}

/**
 * Sections for one side of a crossover at `frequencyHz`.
 * - Butterworth, slope 6n dB/oct: order n, sections with the Q's of `butterworthSectionQs`; each side is
 *   −3.01 dB at the crossover.
 * - Linkwitz-Riley, slope 12n dB/oct: two identical order-n Butterworth filters in cascade (LR12 = two
 *   first-order sections = one Q 0.5 biquad; LR24 = two Q 0.7071; LR48 = two Butterworth order 4);
 *   each side is −6.02 dB at the crossover and low + high sum to flat magnitude — with the high side
 *   inverted for LR12 and LR36 (see `usualHighPolarity`).
 * Both sides come out in normal polarity, always: a BW12 pair wired normal/normal really does null
 * at the crossover, and the sum of the ways shows it.
 * Every section uses the cookbook's bilinear transform pre-warped at the crossover frequency, so the
 * analog identities (LR sum = all-pass) hold exactly in the digital filters too.
 * Source: S. H. Linkwitz, "Active Crossover Networks for Noncoincident Drivers", J. Audio Eng. Soc.
 * 24(1), 1976; Audio EQ Cookbook (R. Bristow-Johnson) LPF/HPF sections.
 */
export function crossoverSections(
  side: CrossoverSide,
  family: CrossoverFamily,
  slopeDbPerOctave: number,
  frequencyHz: number,
  sampleRateHz: number,
): BiquadCoefficients[] {
  const s = requireOneOf(side, ['low', 'high'] as const, 'The crossover side');
  const fam = requireOneOf(family, ['butterworth', 'linkwitz-riley'] as const, 'The crossover family');
  const slope = requireOneOf(slopeDbPerOctave, LIMITS.crossoverSlopesDbPerOctave[fam], `The ${fam === 'butterworth' ? 'Butterworth' : 'Linkwitz-Riley'} slope (dB/octave)`);
  const fs = requireSampleRate(sampleRateHz);
  const f = requireBelowNyquist(frequencyHz, fs, 'The crossover frequency');
  if (fam === 'butterworth') return butterworthSections(s, slope / 6, f, fs);
  const half = butterworthSections(s, slope / 12, f, fs);
  return [...half, ...half.map((c) => ({ ...c }))];
}
