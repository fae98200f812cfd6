import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { designBiquad, designFirstOrder, type BiquadDesign } from './biquad';
import { biquadResponse, cascadeComplexResponse, RESPONSE_FLOOR_DB } from './biquad-response';

const RUN = { seed: 20261202, numRuns: 500 };
const FS = 48_000;
const db = (design: Omit<BiquadDesign, 'sampleRateHz'>, f: number, fs = FS) =>
  biquadResponse(designBiquad({ ...design, sampleRateHz: fs }), f, fs).magnitudeDb;

describe('cookbook coefficients', () => {
  it('LPF with Q = 1/√2 equals SciPy\'s 2nd-order Butterworth (scipy.signal.butter(2, 1000, fs=48000), SciPy 1.17.1)', () => {
    const c = designBiquad({ type: 'lowpass', frequencyHz: 1000, sampleRateHz: 48_000, q: Math.SQRT1_2 });
    expect(c.b0).toBeCloseTo(0.003916126660547369, 14);
    expect(c.b1).toBeCloseTo(0.007832253321094738, 14);
    expect(c.b2).toBeCloseTo(0.003916126660547369, 14);
    expect(c.a1).toBeCloseTo(-1.815341082704568, 13);
    expect(c.a2).toBeCloseTo(0.8310055893467575, 13);
  });

  it('HPF with Q = 1/√2 equals SciPy\'s 2nd-order Butterworth high-pass (same call, \'high\')', () => {
    const c = designBiquad({ type: 'highpass', frequencyHz: 1000, sampleRateHz: 48_000, q: Math.SQRT1_2 });
    expect(c.b0).toBeCloseTo(0.9115866680128315, 13);
    expect(c.b1).toBeCloseTo(-1.823173336025663, 13);
    expect(c.a1).toBeCloseTo(-1.815341082704568, 13);
    expect(c.a2).toBeCloseTo(0.8310055893467575, 13);
  });
});

describe('cookbook responses at f0 (Audio EQ Cookbook, W3C WG Note 2021: BLT pre-warped at f0)', () => {
  it('peaking gain at f0 equals the gain (property over f0, gain, Q and sample rate)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(44_100, 48_000, 96_000),
        fc.double({ min: 20, max: 20_000, noNaN: true }),
        fc.double({ min: -24, max: 24, noNaN: true }),
        fc.double({ min: 0.3, max: 20, noNaN: true }),
        (fs, f0, gain, q) => {
          expect(db({ type: 'peaking', frequencyHz: f0, gainDb: gain, q }, f0, fs)).toBeCloseTo(gain, 6);
        },
      ),
      RUN,
    );
  });

  it('a boost followed by the same cut is a wire (the cookbook\'s stated reason for its peaking Q)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 20, max: 20_000, noNaN: true }),
        fc.double({ min: 0.5, max: 24, noNaN: true }),
        fc.double({ min: 0.3, max: 20, noNaN: true }),
        fc.double({ min: 10, max: 23_000, noNaN: true }),
        (f0, gain, q, f) => {
          const boost = designBiquad({ type: 'peaking', frequencyHz: f0, sampleRateHz: FS, gainDb: gain, q });
          const cut = designBiquad({ type: 'peaking', frequencyHz: f0, sampleRateHz: FS, gainDb: -gain, q });
          const h = cascadeComplexResponse([boost, cut], f, FS);
          expect(20 * Math.log10(Math.hypot(h.re, h.im))).toBeCloseTo(0, 6);
        },
      ),
      RUN,
    );
  });

  it('shelves are at half their gain (dB) at f0 and at full gain on their shelf', () => {
    for (const gain of [-12, -3, 6, 15]) {
      expect(db({ type: 'lowshelf', frequencyHz: 200, gainDb: gain }, 200)).toBeCloseTo(gain / 2, 9);
      expect(db({ type: 'highshelf', frequencyHz: 5000, gainDb: gain }, 5000)).toBeCloseTo(gain / 2, 9);
      expect(db({ type: 'lowshelf', frequencyHz: 200, gainDb: gain, q: 2 }, 200)).toBeCloseTo(gain / 2, 9);
      expect(db({ type: 'lowshelf', frequencyHz: 200, gainDb: gain }, 1)).toBeCloseTo(gain, 3);
      expect(db({ type: 'highshelf', frequencyHz: 5000, gainDb: gain }, 24_000)).toBeCloseTo(gain, 9);
    }
  });

  it('a gentler shelf slope S is still at half gain at f0 but flatter around it', () => {
    const steep = db({ type: 'highshelf', frequencyHz: 4000, gainDb: 12, shelfSlope: 1 }, 8000);
    const gentle = db({ type: 'highshelf', frequencyHz: 4000, gainDb: 12, shelfSlope: 0.5 }, 8000);
    expect(db({ type: 'highshelf', frequencyHz: 4000, gainDb: 12, shelfSlope: 0.5 }, 4000)).toBeCloseTo(6, 9);
    expect(gentle).toBeLessThan(steep);
  });

  it('LPF and HPF have |H(f0)| = Q, i.e. 20·log10(Q) dB', () => {
    for (const q of [0.5, Math.SQRT1_2, 1, 4]) {
      expect(db({ type: 'lowpass', frequencyHz: 1000, q }, 1000)).toBeCloseTo(20 * Math.log10(q), 9);
      expect(db({ type: 'highpass', frequencyHz: 1000, q }, 1000)).toBeCloseTo(20 * Math.log10(q), 9);
    }
    expect(db({ type: 'lowpass', frequencyHz: 1000, q: Math.SQRT1_2 }, 1000)).toBeCloseTo(-3.0103, 4);
  });

  it('LPF passes DC at 0 dB and has its zero at Nyquist', () => {
    expect(db({ type: 'lowpass', frequencyHz: 1000 }, 1)).toBeCloseTo(0, 6);
    expect(db({ type: 'lowpass', frequencyHz: 1000 }, 24_000)).toBeLessThan(-200);
  });

  it('BPF (constant 0 dB peak) is 0 dB at f0 and −3.01 dB at the analog edges when f0 ≪ fs', () => {
    expect(db({ type: 'bandpass', frequencyHz: 1000, q: 4.318 }, 1000)).toBeCloseTo(0, 9);
    const f0 = 100;
    const q = 4.318;
    const half = 1 / (2 * q);
    const low = f0 * (Math.sqrt(1 + half * half) - half);
    const high = f0 * (Math.sqrt(1 + half * half) + half);
    expect(db({ type: 'bandpass', frequencyHz: f0, q }, low)).toBeCloseTo(-3.0103, 2);
    expect(db({ type: 'bandpass', frequencyHz: f0, q }, high)).toBeCloseTo(-3.0103, 2);
  });

  it('notch removes f0 entirely and leaves DC and Nyquist at 0 dB', () => {
    expect(db({ type: 'notch', frequencyHz: 1000, q: 2 }, 1000)).toBeLessThan(-200);
    expect(db({ type: 'notch', frequencyHz: 1000, q: 2 }, 24_000)).toBeCloseTo(0, 9);
    expect(db({ type: 'notch', frequencyHz: 1000, q: 2 }, 1)).toBeCloseTo(0, 4); // 1 Hz is near, not at, DC
  });

  it('allpass is 0 dB everywhere and 180° at f0 (APF prototype H(j) = −1)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 24_000, noNaN: true }), (f) => {
        expect(db({ type: 'allpass', frequencyHz: 1000, q: 0.9 }, f)).toBeCloseTo(0, 9);
      }),
      RUN,
    );
    const r = biquadResponse(designBiquad({ type: 'allpass', frequencyHz: 1000, sampleRateHz: FS, q: 0.9 }), 1000, FS);
    expect(Math.abs(Math.abs(r.phaseDeg) - 180)).toBeLessThan(1e-9);
  });

  it('the floor keeps every magnitude finite', () => {
    expect(RESPONSE_FLOOR_DB).toBe(-300);
    const r = biquadResponse({ b0: 0, b1: 0, b2: 0, a1: 0, a2: 0 }, 1000, FS);
    expect(r.magnitudeDb).toBe(RESPONSE_FLOOR_DB);
  });
});

describe('first-order sections', () => {
  it('are −3.01 dB at the corner and two in cascade equal the cookbook LPF/HPF with Q = 0.5', () => {
    for (const side of ['lowpass', 'highpass'] as const) {
      const first = designFirstOrder(side, 800, FS);
      expect(biquadResponse(first, 800, FS).magnitudeDb).toBeCloseTo(-3.0103, 4);
      const cookbook = designBiquad({ type: side, frequencyHz: 800, sampleRateHz: FS, q: 0.5 });
      for (const f of [20, 300, 800, 2000, 15_000]) {
        const a = cascadeComplexResponse([first, first], f, FS);
        const b = cascadeComplexResponse([cookbook], f, FS);
        expect(a.re).toBeCloseTo(b.re, 12);
        expect(a.im).toBeCloseTo(b.im, 12);
      }
    }
  });
});

describe('hostile filter inputs', () => {
  it('refuses frequencies at or above Nyquist, 0 Hz, NaN and bad types with a sentence', () => {
    expect(() => designBiquad({ type: 'peaking', frequencyHz: 24_000, sampleRateHz: FS, gainDb: 3 })).toThrow(/below 24000 Hz.*half the sample rate/);
    expect(() => designBiquad({ type: 'peaking', frequencyHz: 30_000, sampleRateHz: FS })).toThrow(RangeError);
    expect(() => designBiquad({ type: 'lowpass', frequencyHz: 0, sampleRateHz: FS })).toThrow(RangeError);
    expect(() => designBiquad({ type: 'lowpass', frequencyHz: Number.NaN, sampleRateHz: FS })).toThrow(/finite number/);
    expect(() => designBiquad({ type: 'lowpass', frequencyHz: 100, sampleRateHz: Number.POSITIVE_INFINITY })).toThrow(/sample rate/);
    expect(() => designBiquad({ type: 'comb' as never, frequencyHz: 100, sampleRateHz: FS })).toThrow(/filter type must be one of/);
    expect(() => designBiquad({ type: 'peaking', frequencyHz: 100, sampleRateHz: FS, q: 0 })).toThrow(/Q must be at least 0.1/);
    expect(() => designBiquad({ type: 'peaking', frequencyHz: 100, sampleRateHz: FS, gainDb: 80 })).toThrow(/gain/);
    expect(() => designBiquad({ type: 'lowshelf', frequencyHz: 100, sampleRateHz: FS, gainDb: 6, shelfSlope: 2 })).toThrow(/give a Q instead/);
    expect(() => biquadResponse(designBiquad({ type: 'lowpass', frequencyHz: 100, sampleRateHz: FS }), 25_000, FS)).toThrow(/response frequency/);
  });
});
