import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { frequencyFromNote, noteFromFrequency } from './notes';

const RUN = { seed: 20261202, numRuns: 500 };

// 12-TET frequencies at A4 = 440 Hz (ISO 16:1975): standard note-frequency tables, values from memory,
// each also following exactly from f = 440·2^((n − 69)/12).
const TABLE: [note: string, hz: number][] = [
  ['A0', 27.5], // lowest piano key
  ['E1', 41.2034], // bass guitar low E
  ['E2', 82.4069], // guitar low E
  ['A2', 110],
  ['C4', 261.6256], // middle C
  ['A4', 440],
  ['C8', 4186.009], // highest piano key
  ['C-1', 8.17580], // MIDI note 0
];

describe('frequencyFromNote', () => {
  for (const [note, hz] of TABLE) {
    it(`${note} = ${hz} Hz (12-TET at A440, from memory)`, () => {
      expect(frequencyFromNote(note)).toBeCloseTo(hz, 3);
    });
  }

  it('reads flats and sharps as the same pitch', () => {
    expect(frequencyFromNote('Eb4')).toBeCloseTo(frequencyFromNote('D#4'), 12);
    expect(frequencyFromNote('Bb3')).toBeCloseTo(233.0819, 3); // from memory
    expect(frequencyFromNote('Cb4')).toBeCloseTo(frequencyFromNote('B3'), 12);
    expect(frequencyFromNote('B#3')).toBeCloseTo(frequencyFromNote('C4'), 12);
    expect(frequencyFromNote('C♯3')).toBeCloseTo(frequencyFromNote('C#3'), 12);
    expect(frequencyFromNote('e♭2')).toBeCloseTo(frequencyFromNote('D#2'), 12);
  });

  it('follows the reference pitch', () => {
    expect(frequencyFromNote('A4', 432)).toBe(432);
    expect(frequencyFromNote('A3', 415)).toBeCloseTo(207.5, 12);
  });

  it('refuses anything that is not a note, saying how to write one', () => {
    for (const garbage of ['H2', '', 'A', 'C##4', 'A4.5', 'foo', 'A 4', '4A', 'Ab', 'C#123']) {
      expect(() => frequencyFromNote(garbage)).toThrow(/Write a letter A–G/);
    }
    expect(() => frequencyFromNote(69 as never)).toThrow(RangeError);
    expect(() => frequencyFromNote('A4', 300)).toThrow(/reference pitch/);
  });
});

describe('noteFromFrequency', () => {
  it('names A440 as A4 with 0 cents and MIDI 69 (MIDI 1.0 spec)', () => {
    expect(noteFromFrequency(440)).toEqual({ note: 'A4', freq: 440, cents: 0, midi: 69 });
  });

  it('names middle C as C4, MIDI 60 (MIDI 1.0 spec)', () => {
    const reading = noteFromFrequency(261.63);
    expect(reading.note).toBe('C4');
    expect(reading.midi).toBe(60);
  });

  it('445 Hz is A4 + 19.56 cents (1200·log2(445/440))', () => {
    const reading = noteFromFrequency(445);
    expect(reading.note).toBe('A4');
    expect(reading.cents).toBeCloseTo(19.56, 2);
  });

  it('1 kHz is B5 + 21.3 cents (12-TET, from memory: a common feedback-chart entry)', () => {
    const reading = noteFromFrequency(1000);
    expect(reading.note).toBe('B5');
    expect(reading.freq).toBeCloseTo(987.767, 3);
    expect(reading.cents).toBeCloseTo(21.31, 2);
  });

  it('spells sharps with #', () => {
    expect(noteFromFrequency(277.18).note).toBe('C#4');
  });

  it('round-trips through frequencyFromNote and keeps cents within ±50 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100_000, noNaN: true }), fc.double({ min: 400, max: 480, noNaN: true }), (f, a4) => {
        const reading = noteFromFrequency(f, a4);
        expect(Math.abs(reading.cents)).toBeLessThanOrEqual(50 + 1e-9);
        if (reading.freq >= 1 && reading.freq <= 100_000) expect(frequencyFromNote(reading.note, a4) / reading.freq).toBeCloseTo(1, 12);
      }),
      RUN,
    );
  });

  it('refuses 0 Hz, negative and non-finite frequencies', () => {
    for (const bad of [0, -440, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => noteFromFrequency(bad)).toThrow(RangeError);
    }
  });
});
