import { describe, expect, it } from 'vitest';
import {
  airAbsorption,
  airAbsorptionDbPerMeter,
  combFilter,
  euDailyExposure,
  exactMidbandHz,
  leq,
  maxSpl,
  proConsumerGapDb,
  signalLevel,
  speakerLoad,
  subArray,
  usDose,
  wavelength,
} from './index';

describe('signal levels', () => {
  it('0 dBu = 0.7746 V, +4 dBu = 1.228 V, −10 dBV = 0.3162 V (dBu: 1 mW into 600 Ω; dBV: 1 V — definitions)', () => {
    expect(signalLevel(0, 'dBu').volts).toBeCloseTo(0.7746, 4);
    expect(signalLevel(4, 'dBu').volts).toBeCloseTo(1.2277, 4);
    expect(signalLevel(-10, 'dBV').volts).toBeCloseTo(0.31623, 5);
    expect(signalLevel(1, 'V').dBV).toBeCloseTo(0, 12);
    expect(signalLevel(1, 'V').dBu).toBeCloseTo(2.2185, 4); // 20·log10(1/0.7746)
  });

  it('the +4 dBu / −10 dBV gap is 11.78 dB (definitions; "about 11.8 dB" in the trade, common practice)', () => {
    expect(proConsumerGapDb()).toBeCloseTo(11.78, 2);
  });

  it('dBFS against the console’s full scale: −20 dBFS with 0 dBFS = +24 dBu is +4 dBu (definition)', () => {
    expect(signalLevel(-20, 'dBFS', 24).dBu).toBeCloseTo(4, 12);
    expect(signalLevel(4, 'dBu', 18).dBFS).toBeCloseTo(-14, 12);
  });

  it('watts into a load: 100 W into 8 Ω is 28.28 V (P = V²/R, Joule’s law)', () => {
    expect(signalLevel(100, 'W', 24, 8).volts).toBeCloseTo(28.2843, 4);
    expect(signalLevel(28.2842712, 'V', 24, 8).watts).toBeCloseTo(100, 5);
    expect(() => signalLevel(100, 'W')).toThrow(/load/);
  });
});

describe('wavelength and comb filtering', () => {
  it('1 kHz at 20 °C is 0.3432 m; 100 Hz 3.432 m (λ = c/f, c = 343.2 m/s, Kinsler et al.)', () => {
    expect(wavelength(1000).meters).toBeCloseTo(0.34321, 5);
    expect(wavelength(100).feet).toBeCloseTo(3.4321 / 0.3048, 3);
  });

  it('1 ms → nulls at 500, 1500, 2500 Hz, peaks at 1, 2, 3 kHz (issue 13; Everest & Pohlmann, comb filters)', () => {
    const comb = combFilter(1, 3000);
    expect(comb.nulls).toEqual([500, 1500, 2500]);
    expect(comb.peaks).toEqual([1000, 2000, 3000]);
    expect(comb.spacingHz).toBe(1000);
  });

  it('a long delay lists at most the cap and says it was cut short', () => {
    const comb = combFilter(1000, 20_000);
    expect(comb.nulls.length).toBe(500);
    expect(comb.truncated).toBe(true);
    expect(() => combFilter(0)).toThrow(/time difference/);
  });
});

describe('loudspeaker loads', () => {
  it('two 8 Ω in parallel are 4 Ω, in series 16 Ω; four 8 Ω in parallel 2 Ω (Kirchhoff)', () => {
    expect(speakerLoad([8, 8], 'parallel').ohms).toBeCloseTo(4, 12);
    expect(speakerLoad([8, 8], 'series').ohms).toBe(16);
    expect(speakerLoad([8, 8, 8, 8], 'parallel').ohms).toBeCloseTo(2, 12);
    expect(speakerLoad([8, 4], 'parallel').ohms).toBeCloseTo(8 / 3, 12);
  });

  it('warns below the amplifier’s minimum, not at it', () => {
    expect(speakerLoad([8, 8, 8, 8], 'parallel', 2).belowMinimum).toBe(false);
    const low = speakerLoad([8, 8, 8, 8], 'parallel', 4);
    expect(low.belowMinimum).toBe(true);
    expect(low.warning).toMatch(/below the amplifier’s 4 Ω minimum/);
  });
});

describe('maximum SPL', () => {
  it('100 dB, 1000 W, 32 m → 99.90 dB (issue 13; inverse-square law and 10·log10 P)', () => {
    expect(maxSpl({ sensitivityDb: 100, powerWatts: 1000, distanceMeters: 32 }).level).toBeCloseTo(99.9, 2);
  });

  it('2.83 V into 4 Ω is 2 W, so 2.83 V sensitivity is 3.01 dB above the 1 W one (Ohm’s law)', () => {
    expect(maxSpl({ sensitivityDb: 100, sensitivityRef: '2.83V', ohms: 4, powerWatts: 1, distanceMeters: 1 }).sensitivity1W).toBeCloseTo(100 - 3.0103, 4);
    expect(() => maxSpl({ sensitivityDb: 100, sensitivityRef: '2.83V', powerWatts: 1, distanceMeters: 1 })).toThrow(/impedance/);
  });

  it('two boxes add +6.02 dB coherently (20·log10 2) and the caution speaks of power compression', () => {
    const one = maxSpl({ sensitivityDb: 100, powerWatts: 1000, distanceMeters: 32 });
    const two = maxSpl({ sensitivityDb: 100, powerWatts: 1000, distanceMeters: 32, boxes: 2 });
    expect(two.level - one.level).toBeCloseTo(6.0206, 4);
    expect(two.caution).toMatch(/power compression/);
  });
});

describe('show dose', () => {
  it('OSHA Appendix A example: 110 dBA ¼ h, 100 dBA ½ h, 90 dBA 1½ h → D = 93.8 %, TWA 89.5 dBA (29 CFR 1910.95 App. A; from memory)', () => {
    const d = usDose([{ levelDba: 110, hours: 0.25 }, { levelDba: 100, hours: 0.5 }, { levelDba: 90, hours: 1.5 }], 'osha');
    expect(d.dosePercent).toBeCloseTo(93.75, 2);
    expect(d.twa!).toBeCloseTo(89.5, 1);
    expect(d.notPermitted).toBe(false);
  });

  it('OSHA: 8 h at 90 dBA is 100 % and TWA 90; a segment above 115 dBA is flagged; below 80 dBA left out (App. A)', () => {
    expect(usDose([{ levelDba: 90, hours: 8 }], 'osha')).toEqual({ dosePercent: 100, twa: 90, notPermitted: false });
    expect(usDose([{ levelDba: 120, hours: 0.1 }], 'osha').notPermitted).toBe(true);
    expect(usDose([{ levelDba: 79, hours: 8 }], 'osha')).toEqual({ dosePercent: 0, twa: null, notPermitted: false });
  });

  it('NIOSH: 4 h at 88 dBA is 100 %, TWA 85 (NIOSH 98-126: 85 dBA REL, 3 dB exchange)', () => {
    const d = usDose([{ levelDba: 88, hours: 4 }], 'niosh');
    expect(d.dosePercent).toBeCloseTo(100, 9);
    expect(d.twa!).toBeCloseTo(85, 9);
  });

  it('EU: 8 h at 85 dB(A) is LEX,8h 85 → upper action value; 4 h at 88 is 84.99 → lower; 8 h at 87 → limit (2003/10/EC Art. 3)', () => {
    expect(euDailyExposure([{ levelDba: 85, hours: 8 }])).toEqual({ lex8h: 85, actionLevel: 'upper' });
    expect(euDailyExposure([{ levelDba: 88, hours: 4 }]).lex8h).toBeCloseTo(88 - 3.0103, 4);
    expect(euDailyExposure([{ levelDba: 88, hours: 4 }]).actionLevel).toBe('lower');
    expect(euDailyExposure([{ levelDba: 87, hours: 8 }]).actionLevel).toBe('limit');
    expect(euDailyExposure([{ levelDba: 75, hours: 8 }]).actionLevel).toBe('none');
  });

  it('more than 24 h in segments is refused', () => {
    expect(() => usDose([{ levelDba: 90, hours: 20 }, { levelDba: 90, hours: 5 }], 'osha')).toThrow(/more than a day/);
  });

  it('Leq of 90 and 100 dB is 97.40 dB; equal readings give themselves (IEC 61672-1 time-average level)', () => {
    expect(leq([90, 100])).toBeCloseTo(97.4036, 4);
    expect(leq([100, 100, 100])).toBeCloseTo(100, 12);
    expect(leq([200, -50])).toBeCloseTo(200 - 3.0103, 4);
  });
});

describe('air absorption per ISO 9613-1', () => {
  // Expected: ISO 9613-2:1996 Table 2 (attenuation coefficients from ISO 9613-1, dB/km, octave bands;
  // values from memory), computed here at the exact base-10 midband frequencies as ISO 9613-1 specifies.
  const TABLE: [number, number, number[]][] = [
    [10, 70, [0.1, 0.4, 1.0, 1.9, 3.7, 9.7, 32.8, 117]],
    [20, 70, [0.1, 0.3, 1.1, 2.8, 5.0, 9.0, 22.9, 76.6]],
    [15, 20, [0.3, 0.6, 1.2, 2.7, 8.2, 28.2, 88.8, 202]],
    [15, 50, [0.1, 0.5, 1.2, 2.2, 4.2, 10.8, 36.2, 129]],
    [15, 80, [0.1, 0.3, 1.1, 2.4, 4.1, 8.3, 23.7, 82.8]],
    [30, 70, [0.1, 0.3, 1.0, 3.1, 7.4, 12.7, 23.1, 59.3]],
  ];
  for (const [t, rh, row] of TABLE) {
    it(`${t} °C, ${rh} % RH, 63 Hz – 8 kHz`, () => {
      row.forEach((expected, i) => {
        const f = exactMidbandHz(i - 4, 1);
        const got = airAbsorptionDbPerMeter(f, t, rh) * 1000;
        // One decimal in the table: within half a unit of its last digit, or 1.5 % for the large values.
        expect(Math.abs(got - expected), `${f.toFixed(1)} Hz: ${got}`).toBeLessThanOrEqual(Math.max(0.05, expected * 0.015));
      });
    });
  }

  it('over a throw the attenuation is α·d: 4 kHz, 20 °C, 50 % RH, 100 m ≈ 2.9 dB (ISO 9613-1 eq. 2)', () => {
    const r = airAbsorption(exactMidbandHz(6, 3), 100, 20, 50);
    expect(r.attenuationDb).toBeCloseTo(r.perKmDb / 10, 12);
    expect(r.attenuationDb).toBeGreaterThan(2.5);
    expect(r.attenuationDb).toBeLessThan(3.2);
  });
});

describe('sub arrays', () => {
  it('60 Hz at 20 °C: λ/4 = 1.43 m and a quarter period, 4.17 ms (λ = c/f; quarter-wave spacing common practice)', () => {
    const g = subArray(60, 'gradient');
    expect(g.spacing).toBeCloseTo(343.2146 / 240, 3);
    expect(g.delayMs).toBeCloseTo(1000 / 240, 9);
    expect(g.invertPolarity).toBe(true);
    expect(g.delayOn).toBe('rear');
    const e = subArray(60, 'end-fire');
    expect(e.invertPolarity).toBe(false);
    expect(e.delayOn).toBe('front');
  });

  it('a gradient pair cancels behind: path back (λ/4) + delay (T/4) + inversion (½ cycle) = a whole cycle (superposition)', () => {
    const f = 80;
    const g = subArray(f, 'gradient');
    const rearTravelMs = (g.spacing / 343.2146) * 1000;
    const phaseDeg = (((rearTravelMs + g.delayMs) * f) / 1000) * 360 + 180;
    expect(phaseDeg % 360).toBeCloseTo(0, 1);
  });
});
