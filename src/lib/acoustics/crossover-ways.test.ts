import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { waysResponse, PHASE_FLOOR_DB, type CrossoverEdge } from './crossover-ways';
import { logFrequencyGrid } from './frequency-grid';

const RUN = { seed: 20261203, numRuns: 200 };
const edge = (family: CrossoverEdge['family'], slope: number, freq: number): CrossoverEdge => ({ family, slope, freq });

describe('sum of the ways', () => {
  it('LR24, both ways normal: the sum is flat within 0.01 dB from 20 Hz to 20 kHz (Linkwitz, JAES 24(1) 1976: LR sum is an all-pass)', () => {
    const lr = edge('linkwitz-riley', 24, 90);
    const r = waysResponse([{ lowPass: lr }, { highPass: lr }], logFrequencyGrid(20, 20_000, 300), 48_000);
    for (const m of r.sum.magnitudeDb) expect(Math.abs(m)).toBeLessThan(0.01);
  });

  it('BW12 with both ways normal nulls at the crossover frequency; high side inverted it peaks +3.01 dB there (Butterworth 2nd order: LP(j)= −j/√2, HP(j)= +j/√2, from the transfer functions)', () => {
    const bw = edge('butterworth', 12, 1000);
    const normal = waysResponse([{ lowPass: bw }, { highPass: bw }], [1000], 48_000);
    expect(normal.sum.magnitudeDb[0]!).toBeLessThan(-100);
    expect(normal.sum.phaseDeg[0]).toBeNull(); // magnitude at the floor: no phase claimed
    const inverted = waysResponse([{ lowPass: bw }, { highPass: bw, polarity: 'inverted' }], [1000], 48_000);
    expect(inverted.sum.magnitudeDb[0]!).toBeCloseTo(3.0103, 3);
  });

  it('LR12 needs the high way inverted by hand: normal/normal nulls at fc, inverted sums flat (Linkwitz 1976)', () => {
    const lr = edge('linkwitz-riley', 12, 500);
    const grid = logFrequencyGrid(20, 20_000, 200);
    expect(waysResponse([{ lowPass: lr }, { highPass: lr }], [500], 48_000).sum.magnitudeDb[0]!).toBeLessThan(-100);
    const flipped = waysResponse([{ lowPass: lr }, { highPass: lr, polarity: 'inverted' }], grid, 48_000);
    for (const m of flipped.sum.magnitudeDb) expect(Math.abs(m)).toBeLessThan(0.01);
  });

  it('a way delayed by half a period at fc cancels an equal way there: two equal signals half a cycle apart sum to zero (superposition)', () => {
    const r = waysResponse([{ gainDb: 0 }, { delayMs: 0.5 }], [1000, 2000], 48_000);
    expect(r.sum.magnitudeDb[0]!).toBeLessThan(-100);
    expect(r.sum.magnitudeDb[1]!).toBeCloseTo(20 * Math.log10(2), 9); // one full cycle: in phase, +6.02 dB
  });

  it('gain and polarity on a single way: −6 dB scales by 10^(−6/20), inversion adds 180° (definitions)', () => {
    const r = waysResponse([{ gainDb: -6, polarity: 'inverted' }], [100], 48_000);
    expect(r.ways[0]!.magnitudeDb[0]!).toBeCloseTo(-6, 9);
    expect(Math.abs(r.ways[0]!.phaseDeg[0]!)).toBeCloseTo(180, 9);
  });

  it('any LR way pair with the usual polarity sums flat, at any sample rate (property; Linkwitz 1976)', () => {
    fc.assert(
      fc.property(fc.constantFrom(44_100, 48_000, 96_000), fc.constantFrom(24, 48), fc.double({ min: 40, max: 6000, noNaN: true }), (fs, slope, f) => {
        const lr = edge('linkwitz-riley', slope, f);
        const r = waysResponse([{ lowPass: lr }, { highPass: lr }], [f / 3, f, f * 3], fs);
        for (const m of r.sum.magnitudeDb) expect(Math.abs(m)).toBeLessThan(0.01);
      }),
      RUN,
    );
  });

  it('refuses a bad way naming it and its edge', () => {
    expect(() => waysResponse([{ lowPass: edge('linkwitz-riley', 18, 100) }], [100], 48_000)).toThrow(/Way 1, low-pass: .*12, 24, 36, 48/);
    expect(() => waysResponse([{}, { polarity: 'sideways' as never }], [100], 48_000)).toThrow(/Way 2: the polarity/);
    expect(() => waysResponse([{ delayMs: -1 }], [100], 48_000)).toThrow(/Way 1: the delay/);
    expect(() => waysResponse([{}, {}, {}, {}, {}], [100], 48_000)).toThrow(/at most 4/);
    expect(PHASE_FLOOR_DB).toBeLessThan(-100);
  });
});
