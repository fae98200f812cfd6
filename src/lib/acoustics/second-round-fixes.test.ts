import { describe, expect, it } from 'vitest';
import {
  aWeightingDb,
  backgroundCorrection,
  backgroundWarning,
  celsiusFromTyped,
  coherentTotal,
  delayMs,
  exposureLimit,
  levelAtDistance,
  metersFromTyped,
  speedOfSound,
  subTopCandidates,
  tabulatedFrequency,
} from './index';
import { parseDecimalOrFraction } from '~/lib/schemas/decimal';

/** The cases issue 13 lists, each against the source it names. */
describe('exposure stops at the rules’ edges', () => {
  it('OSHA above Table G-16’s 115 dBA is not permitted, not 1.9 min (29 CFR 1910.95 Table G-16 ends at 115 dBA ¼ h)', () => {
    expect(exposureLimit(130, 'osha')).toEqual({ hours: 0, notPermitted: true, noDailyLimit: false });
    expect(exposureLimit(115, 'osha').hours).toBeCloseTo(0.25, 12); // Table G-16: 115 dBA, ¼ h
    expect(exposureLimit(90, 'osha').hours).toBeCloseTo(8, 12); // Table G-16: 90 dBA, 8 h
  });

  it('past 24 h there is no daily limit, not "128 h a day" (OSHA formula at 70 dBA gives 128 h: 8·2^4)', () => {
    expect(exposureLimit(70, 'osha')).toEqual({ hours: null, notPermitted: false, noDailyLimit: true });
    expect(exposureLimit(70, 'niosh').noDailyLimit).toBe(true); // NIOSH 98-126: 8·2^(15/3) = 256 h
  });

  it('EU 2003/10/EC: 87 dB(A) for 8 h reaches the limit value; +3 dB halves the time (LEX,8h definition, ISO 1999)', () => {
    expect(exposureLimit(87, 'eu').hours).toBeCloseTo(8, 12);
    expect(exposureLimit(90, 'eu').hours).toBeCloseTo(8 / 10 ** 0.3, 12);
  });
});

describe('background correction at the thresholds', () => {
  it('64.1 − 61.1 is a 3 dB difference and is accepted (ISO 3746 3 dB floor; K1 = 3.02 dB at 3 dB, ISO 3744 formula)', () => {
    expect(backgroundCorrection(64.1, 61.1)).toBeCloseTo(64.1 - 3.0206, 3);
  });

  it('warns between 3 and 6 dB (ISO 3744:2010 wants ≥ 6 dB; from memory), not at 6 dB or above', () => {
    expect(backgroundWarning(64.1, 61.1)).toMatch(/ISO 3744/);
    expect(backgroundWarning(96, 90)).toBeUndefined();
    expect(backgroundWarning(96.3, 90.3)).toBeUndefined(); // 6.000000000000001 or 5.99999… in floats
  });
});

describe('sub-to-top candidates', () => {
  it('180° at 80 Hz: a polarity flip alone is exact, ranked before a 6.25 ms delay (φ = 360°·f·t; flip = 180°)', () => {
    const list = subTopCandidates(80, 180);
    expect(list[0]).toMatchObject({ invertPolarity: true, delayMs: 0, phaseErrorDeg: 0, delayOn: 'none' });
    expect(list.some((c) => !c.invertPolarity && c.delayOn === 'top' && Math.abs(c.delayMs - 6.25) < 1e-9)).toBe(true);
    expect(list.some((c) => c.delayOn === 'top' && Math.abs(c.delayMs - 18.75) < 1e-9)).toBe(true); // +1 cycle (12.5 ms period)
  });

  it('90° at 100 Hz: delay 2.5 ms exact, flip alone leaves 90°, flip + 2.5 ms on the sub exact (definition of phase)', () => {
    const list = subTopCandidates(100, 90);
    expect(list[0]).toMatchObject({ delayOn: 'top', invertPolarity: false, phaseErrorDeg: 0 });
    expect(list[0]!.delayMs).toBeCloseTo(2.5, 12);
    expect(list.find((c) => c.invertPolarity && c.delayOn === 'none')!.phaseErrorDeg).toBeCloseTo(90, 9);
    const flipDelay = list.find((c) => c.invertPolarity && c.delayOn !== 'none')!;
    expect(flipDelay.delayOn).toBe('sub');
    expect(flipDelay.delayMs).toBeCloseTo(2.5, 12);
  });

  it('accepts an unwrapped reading: 450° is 90° plus a cycle', () => {
    expect(subTopCandidates(100, 450)[0]!.delayMs).toBeCloseTo(2.5, 12);
  });
});

describe('coherent nulls', () => {
  it('two equal sources at 0° and 180° are a null, not −26 dB (superposition: p − p = 0)', () => {
    expect(coherentTotal([94, 94], [0, 180]).isNull).toBe(true);
    expect(coherentTotal([94, 91], [0, 180]).isNull).toBe(false); // 94 dB − 91 dB in antiphase: 20·log10(1 − 10^(−3/20)) + 94 = 86.3 dB
    expect(coherentTotal([94, 91], [0, 180]).totalDb).toBeCloseTo(94 + 20 * Math.log10(1 - 10 ** (-3 / 20)), 9);
  });
});

describe('speed of sound with humidity (Cramer 1993)', () => {
  it('30 °C / 90 % RH over 34.32 m takes 97.71 ms (issue 13, Cramer 1993 eq. 8), against 98.33 ms for dry air', () => {
    expect(delayMs(34.32, 30, 90)).toBeCloseTo(97.71, 2);
    expect(delayMs(34.32, 30)).toBeCloseTo(98.33, 2);
  });

  it('dry air at 0 °C: 331.45 m/s (Cramer 1993, Table / abstract: c0 = 331.45 m/s; from memory)', () => {
    expect(speedOfSound(0, 0)).toBeCloseTo(331.45, 1);
  });

  it('humidity refused outside 0–100 %', () => {
    expect(() => speedOfSound(20, 101)).toThrow(/relative humidity/);
    expect(() => speedOfSound(20, -1)).toThrow(/relative humidity/);
  });
});

describe('nominal band frequencies snap to the exact ones IEC 61672-1 Table 3 uses', () => {
  it('16 Hz gives the table’s −56.7 dB at 15.849 Hz, not −56.4 dB (IEC 61672-1:2013 Table 3, A at 16 Hz: −56.7)', () => {
    const at = tabulatedFrequency(16);
    expect(at.nominalHz).toBe(16);
    expect(at.frequencyHz).toBeCloseTo(15.8489, 4);
    expect(aWeightingDb(at.frequencyHz)).toBeCloseTo(-56.7, 1);
    expect(aWeightingDb(16)).toBeCloseTo(-56.4, 1);
  });

  it('1 kHz is exact already and 440 Hz is not a band frequency: both used as typed', () => {
    expect(tabulatedFrequency(1000)).toEqual({ frequencyHz: 1000 });
    expect(tabulatedFrequency(440)).toEqual({ frequencyHz: 440 });
  });
});

describe('messages in the unit typed, with unrounded bounds; results range-checked', () => {
  it('150 °F is refused in °F, not as "65.5556 °C" (LIMITS: 60 °C = 140 °F, NIST SP 811 conversion)', () => {
    expect(() => celsiusFromTyped(150, 'F')).toThrow(/at most 140 °F; got 150 °F/);
    expect(celsiusFromTyped(68, 'F')).toBeCloseTo(20, 12);
  });

  it('a bound in feet is shown unrounded, so it never reads like the value refused (2000 m = 6561.67979 ft)', () => {
    expect(() => metersFromTyped(6561.68, 'ft')).toThrow(/at most 6561\.67979\d* ft; got 6561\.68 ft/);
  });

  it('distance from 1e-320 m answers a sentence, not −6306 dB', () => {
    expect(() => levelAtDistance(100, 1e-320, 20)).toThrow(/outside -50 to 200 dB/);
  });
});

describe('fractions as widths', () => {
  it('"1/3" is a third, "2/3" two thirds; "1/0" and "1/3/4" are not numbers', () => {
    expect(parseDecimalOrFraction('1/3')).toBeCloseTo(1 / 3, 15);
    expect(parseDecimalOrFraction(' 2 / 3 ')).toBeCloseTo(2 / 3, 15);
    expect(parseDecimalOrFraction('1/0')).toBe('syntax');
    expect(parseDecimalOrFraction('1/3/4')).toBe('syntax');
    expect(parseDecimalOrFraction('0.5')).toBe(0.5);
  });
});
