/**
 * Bandwidth of a resonant (2nd-order band-pass / peaking) filter as Q, octaves and hertz.
 * All relations here are the analog-prototype ones; a digital filter designed with the
 * Audio EQ Cookbook's Q already has the bilinear-transform warping compensated at f0.
 */
import { formatNumber, requireComputed, requirePositive } from './guards';

/**
 * Q of a band `octaves` wide between its −3 dB points (for a peaking EQ, between its half-gain points).
 *
 * Q = 2^(N/2) / (2^N − 1), i.e. 1/Q = 2·sinh(ln2/2 · N).
 * Source: Audio EQ Cookbook (R. Bristow-Johnson, W3C Working Group Note 2021), "relationship between
 * bandwidth and Q — analog filter prototype"; tabulated in RaneNote 170, "Bandwidth in Octaves
 * Versus Q in Bandpass Filters" (D. Bohn, 2008; note number from memory).
 * The sinh form is used because 2^N overflows to Infinity/Infinity = NaN for very wide bands.
 */
export function qFromOctaves(octaves: number): number {
  requirePositive(octaves, 'The bandwidth', 'octaves', 'A band must be wider than zero octaves.');
  return requireComputed(
    1 / (2 * Math.sinh((Math.LN2 / 2) * octaves)),
    `A band ${formatNumber(octaves)} octaves wide has no finite, non-zero Q; enter a width between a millionth of an octave and 1000 octaves.`,
    true,
  );
}

/**
 * Bandwidth in octaves of a filter with quality factor `q`: N = (2/ln2)·asinh(1/(2Q)).
 * Source: inverse of the Audio EQ Cookbook analog-prototype relation 1/Q = 2·sinh(ln2/2 · N).
 */
export function octavesFromQ(q: number): number {
  requirePositive(q, 'Q', '', 'Q is a ratio of centre frequency to bandwidth and must be positive.');
  return requireComputed(
    (2 / Math.LN2) * Math.asinh(1 / (2 * q)),
    `Q = ${formatNumber(q)} is too small to give a bandwidth; enter a Q above 1e-300.`,
    true,
  );
}

/**
 * Centre frequency of a band from its edges: the geometric mean √(f1·f2), because bands are
 * symmetric on a logarithmic frequency axis. Source: IEC 61260-1:2014 §5 (band-edge equations,
 * f1·f2 = fm²; clause from memory) and the Audio EQ Cookbook's analog prototypes.
 */
export function centreFromEdges(lowHz: number, highHz: number): number {
  requirePositive(lowHz, 'The lower edge', 'Hz');
  requirePositive(highHz, 'The upper edge', 'Hz');
  if (!(highHz > lowHz)) {
    throw new RangeError(`The upper edge (${formatNumber(highHz)} Hz) must be above the lower edge (${formatNumber(lowHz)} Hz); swap them or widen the band.`);
  }
  // √low·√high rather than √(low·high): same value, no overflow for absurdly large edges.
  return Math.sqrt(lowHz) * Math.sqrt(highHz);
}

/** The two −3 dB points of a band. */
export interface BandEdges {
  lowHz: number;
  highHz: number;
}

/**
 * Lower and upper −3 dB frequencies of a 2nd-order band-pass with centre `f0Hz` and quality `q`:
 * f0·(√(1 + 1/(4Q²)) ∓ 1/(2Q)). These are the roots of |H(jω)|² = ½ for H(s) = (s/Q)/(s² + s/Q + 1),
 * the Audio EQ Cookbook's BPF (constant 0 dB peak gain) prototype; their product is f0² and their
 * difference f0/Q.
 */
export function edgesFromCentre(f0Hz: number, q: number): BandEdges {
  requirePositive(f0Hz, 'The centre frequency', 'Hz');
  requirePositive(q, 'Q');
  const half = 1 / (2 * q);
  // √(1 + h²) + h written as h·(√(1 + 1/h²) + 1) when h is huge, so h² does not overflow.
  const upperFactor = half > 1e150 ? half * (Math.sqrt(1 + 1 / (half * half)) + 1) : Math.sqrt(1 + half * half) + half;
  const highHz = f0Hz * upperFactor;
  // (root − half) loses everything when Q is tiny; f0/upperFactor is the same number without the cancellation.
  const lowHz = f0Hz / upperFactor;
  const tooExtreme = `A band at ${formatNumber(f0Hz)} Hz with Q = ${formatNumber(q)} has edges beyond what can be computed; enter a larger Q or a more ordinary frequency.`;
  return { lowHz: requireComputed(lowHz, tooExtreme, true), highHz: requireComputed(highHz, tooExtreme, true) };
}

/**
 * Width of a band in hertz between its −3 dB points: f0 / Q (definition of Q for a 2nd-order
 * resonance; Audio EQ Cookbook, "Q: the EE kind of definition").
 */
export function bandwidthHz(f0Hz: number, q: number): number {
  requirePositive(f0Hz, 'The centre frequency', 'Hz');
  requirePositive(q, 'Q');
  return requireComputed(f0Hz / q, `A bandwidth of ${formatNumber(f0Hz)} Hz / ${formatNumber(q)} is too large to compute; enter a larger Q.`);
}

/** What `solveBand` can start from. Frequencies are in hertz. */
export type BandInput =
  | { q: number }
  | { octaves: number }
  | { f0: number; q: number }
  | { f0: number; octaves: number }
  | { low: number; high: number };

/** Every description of the band that the input determines. Frequencies are in hertz. */
export interface BandSolution {
  q: number;
  octaves: number;
  f0?: number;
  low?: number;
  high?: number;
  bandwidthHz?: number;
}

function has(input: object, key: string): boolean {
  return (input as Record<string, unknown>)[key] !== undefined;
}

/**
 * Completes a band description from any one of: q; octaves; f0 + q; f0 + octaves; low + high.
 * Frequencies come back only when the input fixes them (Q alone says nothing about where the band is).
 * Source: the relations in this file (Audio EQ Cookbook analog prototypes).
 */
export function solveBand(input: BandInput): BandSolution {
  if (typeof input !== 'object' || input === null) {
    throw new RangeError('Describe the band with q, octaves, f0 with q or octaves, or low with high.');
  }
  const hasQ = has(input, 'q');
  const hasOctaves = has(input, 'octaves');
  const hasF0 = has(input, 'f0');
  const hasEdges = has(input, 'low') || has(input, 'high');
  const widths = Number(hasQ) + Number(hasOctaves);
  if (hasEdges) {
    if (hasQ || hasOctaves || hasF0) {
      throw new RangeError('Give either the two edges (low and high) or a width (q or octaves), not both: the edges already fix the centre and the width.');
    }
    const { low, high } = input as { low: number; high: number };
    const f0 = centreFromEdges(low, high);
    // Q from the edges is exact for any pair: (high − low) = f0/Q.
    const q = f0 / (high - low);
    // log2(high) − log2(low), not log2(high/low), which overflows for absurd pairs.
    return { q, octaves: Math.log2(high) - Math.log2(low), f0, low, high, bandwidthHz: high - low };
  }
  if (widths !== 1) {
    throw new RangeError(
      widths === 0
        ? 'Give the width of the band as q or as octaves (with f0 for frequencies), or give its edges as low and high.'
        : 'Give the width as q or as octaves, not both: each one fixes the other.',
    );
  }
  const q = hasQ ? requirePositive((input as { q: number }).q, 'Q') : qFromOctaves((input as { octaves: number }).octaves);
  const octaves = hasOctaves ? (input as { octaves: number }).octaves : octavesFromQ(q);
  if (!hasF0) return { q, octaves };
  const f0 = requirePositive((input as { f0: number }).f0, 'The centre frequency', 'Hz');
  const { lowHz, highHz } = edgesFromCentre(f0, q);
  return { q, octaves, f0, low: lowHz, high: highHz, bandwidthHz: f0 / q };
}
