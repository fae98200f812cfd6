import { describe, expect, it } from 'vitest';
import { analogHalfGainWidth, analogPrototypeResponse, digitalHalfGainWidth, prototypeDepartureDb } from './analog-prototype';
import { biquadResponse } from './biquad-response';
import { designBiquad } from './biquad';

const db = (h: { re: number; im: number }) => 20 * Math.log10(Math.hypot(h.re, h.im));

describe('half-gain width of a bell: analog prototype against the digital biquad', () => {
  const bell = (freq: number) => ({ type: 'peaking' as const, freq, gain: 12, q: Math.SQRT2 });

  it('analog: Q √2 is exactly 1 octave between the half-gain points (Audio EQ Cookbook: 1/Q = 2·sinh(ln2/2·BW))', () => {
    const w = analogHalfGainWidth(bell(1000));
    expect(w.octaves).toBeCloseTo(1, 12);
    // Cross-check the closed form against the prototype itself: +6 dB at both edges.
    expect(db(analogPrototypeResponse(bell(1000), w.lowHz))).toBeCloseTo(6, 9);
    expect(db(analogPrototypeResponse(bell(1000), w.highHz))).toBeCloseTo(6, 9);
  });

  it('digital, 48 kHz: 0.997 octave at 1 kHz but 0.417 octave at 16 kHz (bisection on the biquad; cookbook approximation as a cross-check)', () => {
    const low = digitalHalfGainWidth(bell(1000), 48_000);
    const high = digitalHalfGainWidth(bell(16_000), 48_000);
    expect(low.octaves).toBeCloseTo(0.997, 3);
    expect(high.octaves).toBeCloseTo(0.417, 3);
    // Audio EQ Cookbook: BW(digital)·ω0/sin ω0 ≈ BW(analog); the cookbook gives it as an approximation, so within 0.02 octave.
    for (const [w, f0] of [[low, 1000], [high, 16_000]] as const) {
      const w0 = (2 * Math.PI * f0) / 48_000;
      expect(Math.abs((w.octaves * w0) / Math.sin(w0) - 1)).toBeLessThan(0.02);
    }
  });

  it('the digital bell is the gain at f0 and half the gain at its measured edges', () => {
    const c = designBiquad({ type: 'peaking', frequencyHz: 16_000, sampleRateHz: 48_000, gainDb: 12, q: Math.SQRT2 });
    const w = digitalHalfGainWidth(bell(16_000), 48_000);
    expect(biquadResponse(c, 16_000, 48_000).magnitudeDb).toBeCloseTo(12, 9);
    expect(biquadResponse(c, w.lowHz, 48_000).magnitudeDb).toBeCloseTo(6, 6);
    expect(biquadResponse(c, w.highHz, 48_000).magnitudeDb).toBeCloseTo(6, 6);
  });

  it('the prototype departs from the biquad high up, not low down (bilinear warping, Oppenheim & Schafer §7.2.2; from memory)', () => {
    expect(prototypeDepartureDb(bell(1000), 48_000)).toBeLessThan(0.1);
    expect(prototypeDepartureDb(bell(16_000), 48_000)).toBeGreaterThan(3);
  });

  it('refuses widths for bands that have none', () => {
    expect(() => digitalHalfGainWidth({ type: 'lowpass', freq: 100 }, 48_000)).toThrow(/bell/);
    expect(() => digitalHalfGainWidth({ type: 'peaking', freq: 100, gain: 0 }, 48_000)).toThrow(/gain/);
    expect(() => digitalHalfGainWidth({ type: 'peaking', freq: 24_000, gain: 3 }, 48_000)).toThrow(/half the sample rate/);
  });
});

describe('analog prototypes at known points (Audio EQ Cookbook)', () => {
  it('shelves are half their gain at f0; LPF and HPF are Q there; notch is zero at f0', () => {
    expect(db(analogPrototypeResponse({ type: 'lowshelf', freq: 100, gain: 6 }, 100))).toBeCloseTo(3, 9);
    expect(db(analogPrototypeResponse({ type: 'highshelf', freq: 8000, gain: -4, shelfSlope: 0.5 }, 8000))).toBeCloseTo(-2, 9);
    expect(Math.hypot(...Object.values(analogPrototypeResponse({ type: 'lowpass', freq: 100, q: 2 }, 100)))).toBeCloseTo(2, 9);
    expect(Math.hypot(...Object.values(analogPrototypeResponse({ type: 'highpass', freq: 100, q: 0.5 }, 100)))).toBeCloseTo(0.5, 9);
    expect(Math.hypot(...Object.values(analogPrototypeResponse({ type: 'notch', freq: 100 }, 100)))).toBeLessThan(1e-12);
    expect(db(analogPrototypeResponse({ type: 'allpass', freq: 100, q: 3 }, 37))).toBeCloseTo(0, 9);
  });
});
