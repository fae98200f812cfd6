/**
 * Fractional-octave bands on the base-10 system of IEC 61260-1:2014, the system every
 * analyser and graphic EQ label is drawn from.
 */
import { LIMITS } from './limits';
import { formatNumber, requireInRange, requireOneOf } from './guards';

/** Octave frequency ratio G = 10^(3/10) (IEC 61260-1:2014 §5.2, base-ten system; clause from memory). */
export const OCTAVE_RATIO_G = 10 ** (3 / 10);

/** Reference frequency fr = 1000 Hz (IEC 61260-1:2014 §5.3; clause from memory). */
export const REFERENCE_FREQUENCY_HZ = 1000;

/** Bandwidth designators b (bands are 1/b octave wide) that have nominal labels here. */
export type BandFraction = 1 | 3 | 6 | 12 | 24;

/**
 * ISO 266:1997 / IEC 61260-1:2014 Annex E preferred one-third-octave frequencies, 10 Hz to 40 kHz.
 * They are the R10 preferred numbers (ISO 3) of a decade, so the same ten mantissas repeat.
 */
export const NOMINAL_THIRD_OCTAVE_HZ: readonly number[] = [
  10, 12.5, 16, 20, 25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600,
  2000, 2500, 3150, 4000, 5000, 6300, 8000, 10000, 12500, 16000, 20000, 25000, 31500, 40000,
];

/** ISO 266:1997 / IEC 61260-1:2014 Annex E preferred octave frequencies, 8 Hz to 32 kHz (every third third-octave). */
export const NOMINAL_OCTAVE_HZ: readonly number[] = [8, 16, 31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000, 16000, 31500];

/** The ten R10 mantissas of a decade, 1000 Hz = index 0 (ISO 3:1973 series R10; ISO 266:1997). */
const R10_MANTISSAS = [1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5, 6.3, 8];

function requireFraction(fraction: unknown): BandFraction {
  return requireOneOf(fraction as number, LIMITS.bandFractions, 'The band fraction (1/b octave)') as BandFraction;
}

function requireBandIndex(x: unknown): number {
  if (typeof x !== 'number' || !Number.isInteger(x) || Math.abs(x) > 1000) {
    throw new RangeError(`The band index must be a whole number between -1000 and 1000 (0 is the band at 1 kHz); got ${formatNumber(x)}.`);
  }
  return x;
}

/**
 * Exact midband frequency of band `x` for 1/b-octave bands: odd b, fr·G^(x/b); even b, fr·G^((2x+1)/(2b)).
 * Source: IEC 61260-1:2014 §5.4, equations (2) and (3) (equation numbers from memory). Even-b bands
 * straddle 1 kHz instead of centring on it, which is why the exponent is offset by half a band.
 */
export function exactMidbandHz(x: number, fraction: BandFraction): number {
  const b = requireFraction(fraction);
  const i = requireBandIndex(x);
  const exponent = b % 2 === 1 ? i / b : (2 * i + 1) / (2 * b);
  return REFERENCE_FREQUENCY_HZ * OCTAVE_RATIO_G ** exponent;
}

/**
 * Band-edge frequencies f1 = fm·G^(−1/(2b)), f2 = fm·G^(+1/(2b)).
 * Source: IEC 61260-1:2014 §5.5, equations (4) and (5) (equation numbers from memory).
 */
export function bandEdgesHz(exactMidHz: number, fraction: BandFraction): { low: number; high: number } {
  const b = requireFraction(fraction);
  const fm = requireInRange(exactMidHz, LIMITS.frequencyHz, 'The midband frequency', 'Hz');
  const half = OCTAVE_RATIO_G ** (1 / (2 * b));
  return { low: fm / half, high: fm * half };
}

/**
 * Index x of the 1/b-octave band whose exact midband is nearest `frequencyHz` on a log axis. Source: the
 * inverse of IEC 61260-1:2014 eq. (2)/(3); the standard itself does not give it.
 */
export function bandIndexOf(frequencyHz: number, fraction: BandFraction): number {
  const b = requireFraction(fraction);
  const f = requireInRange(frequencyHz, LIMITS.frequencyHz, 'The frequency', 'Hz');
  const position = (b * Math.log(f / REFERENCE_FREQUENCY_HZ)) / Math.log(OCTAVE_RATIO_G);
  return b % 2 === 1 ? Math.round(position) : Math.round(position - 0.5);
}

function roundToSignificant(value: number, digits: number): number {
  const exponent = Math.floor(Math.log10(value)) - digits + 1;
  // Divide or multiply by an exact integer power of ten, never by 0.1, so 1060 does not come out as 1059.9999.
  return exponent >= 0
    ? Math.round(value / 10 ** exponent) * 10 ** exponent
    : Math.round(value * 10 ** -exponent) / 10 ** -exponent;
}

/**
 * Nominal (label) midband frequency of band `x`.
 * - 1/1 and 1/3 octave: the preferred frequencies of ISO 266:1997 / IEC 61260-1:2014 Annex E (E.1),
 *   i.e. the R10 series, extended by whole decades outside the printed 10 Hz–40 kHz table.
 * - 1/6, 1/12 and 1/24 octave: IEC 61260-1:2014 Annex E (E.3) rounding rule, from memory and
 *   matching a third-party implementation (acoustic-toolbox, iec_61260_1_2014.py): round the exact
 *   midband to three significant digits when its leading digit is 1–4, to two when it is 5–9.
 *   This is why a 1/6-octave analyser shows 1060 Hz but 5300 Hz.
 */
export function nominalMidbandHz(x: number, fraction: BandFraction): number {
  const b = requireFraction(fraction);
  const i = requireBandIndex(x);
  if (b === 1 || b === 3) {
    const third = b === 1 ? 3 * i : i;
    const decade = Math.floor(third / 10);
    // The index is third mod 10, always 0–9.
    const mantissa = R10_MANTISSAS[third - 10 * decade]!;
    // Six significant digits drop float noise such as 31.499999999999996 without touching any R10 value.
    return Number((mantissa * 10 ** (3 + decade)).toPrecision(6));
  }
  const exact = exactMidbandHz(i, b);
  const leading = Math.floor(exact / 10 ** Math.floor(Math.log10(exact)));
  return roundToSignificant(exact, leading <= 4 ? 3 : 2);
}

/** One fractional-octave band. All frequencies in hertz. */
export interface OctaveBand {
  /** Band index x (0 is the band at, or just above, 1 kHz). */
  index: number;
  /** Exact midband frequency (IEC 61260-1 eq. 2/3). */
  exact: number;
  /** The label printed on analysers and graphic EQs. */
  nominal: number;
  /** Lower band edge. */
  low: number;
  /** Upper band edge. */
  high: number;
}

/**
 * Every 1/b-octave band from `fromHz` to `toHz`, per IEC 61260-1:2014 (see the functions above).
 * A band is included when its exact OR its nominal midband lies within [fromHz, toHz]: the exact
 * midband of the band labelled 20 Hz is 19.95 Hz, and a person asking for 20 Hz–20 kHz expects it.
 */
export function octaveBands(fraction: BandFraction, fromHz = 20, toHz = 20_000): OctaveBand[] {
  const b = requireFraction(fraction);
  const from = requireInRange(fromHz, LIMITS.frequencyHz, 'The lowest frequency', 'Hz');
  const to = requireInRange(toHz, LIMITS.frequencyHz, 'The highest frequency', 'Hz');
  if (to < from) {
    throw new RangeError(`The highest frequency (${formatNumber(to)} Hz) must not be below the lowest (${formatNumber(from)} Hz); swap them.`);
  }
  const result: OctaveBand[] = [];
  const first = bandIndexOf(from, b) - 1;
  const last = bandIndexOf(to, b) + 1;
  for (let x = first; x <= last; x++) {
    const exact = exactMidbandHz(x, b);
    const nominal = nominalMidbandHz(x, b);
    const inside = (f: number) => f >= from && f <= to;
    if (!inside(exact) && !inside(nominal)) continue;
    const half = OCTAVE_RATIO_G ** (1 / (2 * b));
    result.push({ index: x, exact, nominal, low: exact / half, high: exact * half });
  }
  return result;
}
