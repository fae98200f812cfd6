import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as acoustics from './index';

// Contract from the brief (no external source): every public function either answers finite numbers or
// throws a RangeError with a message; it never returns NaN or ±Infinity and never throws anything else.
const RUN = { seed: 20261202, numRuns: 300 };

const hostileNumber = fc.oneof(
  fc.double(), // includes NaN, ±Infinity, −0, subnormals and huge values
  fc.constantFrom(0, -0, -1, -300, 1e308, -1e308, Number.MIN_VALUE, 22_050, 24_000, 48_000, 96_000),
  fc.double({ min: -100, max: 30_000, noNaN: true }),
);
const hostileValue = fc.oneof(
  hostileNumber,
  fc.string({ maxLength: 6 }),
  fc.constantFrom(undefined, null, true, '', 'A4', 'C#3', 'point', 'line', 'low', 'high', 'A', 'C', 'Z', 'butterworth', 'linkwitz-riley', 'peaking', 'lowpass'),
  fc.constantFrom(1, 3, 6, 12, 24, 48_000, 44_100),
);
const hostileArray = fc.oneof(fc.array(hostileValue, { maxLength: 5 }), fc.array(hostileNumber, { maxLength: 70 }), hostileValue);
const hostileObject = fc.oneof(
  fc.record(
    {
      q: hostileValue, octaves: hostileValue, f0: hostileValue, low: hostileValue, high: hostileValue,
      mainMeters: hostileValue, fillMeters: hostileValue, temperatureCelsius: hostileValue, precedenceOffsetMs: hostileValue,
      type: hostileValue, freq: hostileValue, gain: hostileValue, slope: hostileValue, family: hostileValue,
      frequencyHz: hostileValue, sampleRateHz: hostileValue, gainDb: hostileValue, shelfSlope: hostileValue,
      b0: hostileValue, b1: hostileValue, b2: hostileValue, a1: hostileValue, a2: hostileValue,
      latencyMs: hostileValue, relativeHumidityPercent: hostileValue, sensitivityDb: hostileValue, sensitivityRef: hostileValue,
      ohms: hostileValue, powerWatts: hostileValue, distanceMeters: hostileValue, boxes: hostileValue,
      levelDba: hostileValue, hours: hostileValue, min: hostileValue, max: hostileValue,
    },
    { requiredKeys: [] },
  ),
  hostileValue,
);

/** Every number anywhere in `value` is finite. */
function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value && typeof value === 'object') return Object.values(value).every(allFinite);
  return true;
}

type Call = [name: string, args: fc.Arbitrary<unknown[]>];
const n = (count: number) => fc.tuple(...Array.from({ length: count }, () => hostileValue));

const CALLS: Call[] = [
  ['qFromOctaves', n(1)],
  ['octavesFromQ', n(1)],
  ['centreFromEdges', n(2)],
  ['edgesFromCentre', n(2)],
  ['bandwidthHz', n(2)],
  ['solveBand', fc.tuple(hostileObject)],
  ['exactMidbandHz', n(2)],
  ['bandEdgesHz', n(2)],
  ['bandIndexOf', n(2)],
  ['nominalMidbandHz', n(2)],
  ['octaveBands', n(3)],
  ['noteFromFrequency', n(2)],
  ['frequencyFromNote', n(2)],
  ['incoherentSum', fc.tuple(hostileArray)],
  ['coherentSum', fc.tuple(hostileArray, hostileArray)],
  ['levelAtDistance', n(4)],
  ['backgroundCorrection', n(2)],
  ['aWeightingDb', n(1)],
  ['cWeightingDb', n(1)],
  ['zWeightingDb', n(1)],
  ['weightingDb', n(2)],
  ['oshaPermissibleHours', n(1)],
  ['nioshRecommendedHours', n(1)],
  ['speedOfSound', n(1)],
  ['metersFromFeet', n(1)],
  ['feetFromMeters', n(1)],
  ['celsiusFromFahrenheit', n(1)],
  ['fahrenheitFromCelsius', n(1)],
  ['delayMs', n(2)],
  ['distanceFromMs', n(2)],
  ['msToSamples', n(2)],
  ['samplesToMs', n(2)],
  ['fillDelayMs', fc.tuple(hostileObject)],
  ['periodMs', n(1)],
  ['phaseToMs', n(2)],
  ['msToPhaseDeg', n(2)],
  ['subToTopOffset', n(2)],
  ['designBiquad', fc.tuple(hostileObject)],
  ['designFirstOrder', n(3)],
  ['biquadResponse', fc.tuple(hostileObject, hostileValue, hostileValue)],
  ['cascadeComplexResponse', fc.tuple(fc.array(hostileObject, { maxLength: 3 }), hostileValue, hostileValue)],
  ['butterworthSectionQs', n(1)],
  ['usualHighPolarity', n(2)],
  ['waySections', fc.tuple(hostileObject, hostileValue)],
  ['waysResponse', fc.tuple(fc.array(hostileObject, { maxLength: 3 }), hostileArray, hostileValue)],
  ['phaseAboveFloor', n(2)],
  ['analogPrototypeResponse', fc.tuple(hostileObject, hostileValue)],
  ['analogPrototypeDb', fc.tuple(hostileObject, hostileArray)],
  ['digitalHalfGainWidth', fc.tuple(hostileObject, hostileValue)],
  ['analogHalfGainWidth', fc.tuple(hostileObject)],
  ['prototypeDepartureDb', fc.tuple(hostileObject, hostileValue)],
  ['requireSampleRate', n(1)],
  ['requireBelowNyquist', n(4)],
  ['crossoverSections', n(5)],
  ['filterSections', fc.tuple(hostileObject, hostileValue)],
  ['chainSections', fc.tuple(fc.array(hostileObject, { maxLength: 3 }), hostileValue)],
  ['chainComplexResponse', fc.tuple(fc.array(hostileObject, { maxLength: 3 }), hostileValue, hostileValue)],
  ['cascadeResponse', fc.tuple(fc.array(hostileObject, { maxLength: 3 }), hostileArray, hostileValue)],
  ['logFrequencyGrid', n(3)],
  ['wrapPhaseDeg', n(1)],
  ['lengthToMeters', n(2)],
  ['lengthFromMeters', n(2)],
  ['temperatureToCelsius', n(2)],
  ['temperatureFromCelsius', n(2)],
  ['lengthRangeIn', fc.tuple(hostileValue, hostileObject)],
  ['temperatureRangeIn', fc.tuple(hostileValue, hostileObject)],
  ['celsiusFromTyped', n(2)],
  ['metersFromTyped', n(4)],
  ['requireHumidity', n(1)],
  ['waterVaporMoleFraction', n(2)],
  ['euHoursToReach', n(2)],
  ['exposureLimit', n(2)],
  ['backgroundWarning', n(2)],
  ['coherentTotal', fc.tuple(hostileArray, hostileArray)],
  ['tabulatedFrequency', n(1)],
  ['subTopCandidates', n(2)],
  ['signalLevel', n(4)],
  ['proConsumerGapDb', n(0)],
  ['wavelength', n(3)],
  ['combFilter', n(2)],
  ['speakerLoad', fc.tuple(hostileArray, hostileValue, hostileValue)],
  ['maxSpl', fc.tuple(hostileObject)],
  ['usDose', fc.tuple(fc.oneof(fc.array(hostileObject, { maxLength: 4 }), hostileValue), hostileValue)],
  ['euDailyExposure', fc.tuple(fc.oneof(fc.array(hostileObject, { maxLength: 4 }), hostileValue))],
  ['leq', fc.tuple(hostileArray)],
  ['airAbsorptionDbPerMeter', n(3)],
  ['airAbsorption', n(4)],
  ['subArray', n(3)],
];

describe('hostile inputs: finite answer or RangeError, nothing else', () => {
  it('covers every exported function', () => {
    const exportedFunctions = Object.entries(acoustics).filter(([, v]) => typeof v === 'function').map(([k]) => k).sort();
    expect(CALLS.map(([name]) => name).sort()).toEqual(exportedFunctions);
  });

  for (const [name, args] of CALLS) {
    it(name, () => {
      const run = (acoustics as Record<string, unknown>)[name] as (...xs: unknown[]) => unknown;
      expect(typeof run).toBe('function');
      fc.assert(
        fc.property(args, (values) => {
          let result: unknown;
          try {
            result = run(...values);
          } catch (error) {
            expect(error).toBeInstanceOf(RangeError);
            expect((error as Error).message.length).toBeGreaterThan(20);
            expect((error as Error).message).not.toMatch(/undefined|NaN|\[object/);
            return;
          }
          expect(allFinite(result)).toBe(true);
        }),
        RUN,
      );
    });
  }

  it('the brief\'s named hostile cases each throw a RangeError with a message', () => {
    const cases: [string, () => unknown][] = [
      ['NaN distance', () => acoustics.delayMs(Number.NaN)],
      ['Infinity level', () => acoustics.incoherentSum([Number.POSITIVE_INFINITY])],
      ['negative distance', () => acoustics.levelAtDistance(100, 1, -5)],
      ['0 Hz', () => acoustics.aWeightingDb(0)],
      ['−300 °C', () => acoustics.speedOfSound(-300)],
      ['above Nyquist', () => acoustics.cascadeResponse([{ type: 'peaking', freq: 30_000, gain: 3 }], [1000], 48_000)],
    ];
    for (const [label, run] of cases) {
      expect(run, label).toThrow(RangeError);
      try {
        run();
      } catch (error) {
        expect((error as Error).message, label).toMatch(/must|is not|below|above/);
      }
    }
  });
});
