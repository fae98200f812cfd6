/**
 * Musical notes in twelve-tone equal temperament, for naming a feedback frequency or a room mode
 * the way a musician would hear it.
 */
import { LIMITS } from './limits';
import { formatNumber, requireInRange } from './guards';

/** Note names with sharps, C first (the pitch-class order of MIDI note numbers). */
export const NOTE_NAMES = ['C', 'C#', 'D', 'D#', 'E', 'F', 'F#', 'G', 'G#', 'A', 'A#', 'B'] as const;

/**
 * MIDI note number of A4. The MIDI 1.0 Detailed Specification (MMA, 1996) makes note 60 middle C; calling it C4
 * (so 69 is A4) is ASA scientific pitch notation. Some manufacturers call middle C 'C3' — this code does not.
 */
export const A4_MIDI = 69;

/** The nearest equal-tempered note to a frequency. */
export interface NoteReading {
  /** Scientific pitch notation with sharps, C4 = middle C (e.g. 'A4', 'C#3'). */
  note: string;
  /** Frequency of that note in hertz. */
  freq: number;
  /** How far the input is from the note, in cents (−50 … +50; 100 cents = 1 semitone). */
  cents: number;
  /** MIDI note number (69 = A4). */
  midi: number;
}

function requireA4(a4Hz: unknown): number {
  return requireInRange(a4Hz, LIMITS.a4Hz, 'The reference pitch A4', 'Hz');
}

function nameOf(midi: number): string {
  const pitchClass = ((midi % 12) + 12) % 12;
  // Octave numbers change at C, and MIDI 60 is C4, so the octave is floor(midi / 12) − 1.
  return `${NOTE_NAMES[pitchClass]}${Math.floor(midi / 12) - 1}`;
}

/**
 * Nearest 12-TET note to `freqHz`: f = a4·2^((n − 69)/12), n the MIDI note number; cents = 1200·log2(f/f_note).
 * Sources: 12-TET definition with A4 = 440 Hz per ISO 16:1975 (standard tuning frequency);
 * MIDI numbering and C4 = middle C per the MIDI 1.0 Detailed Specification (MMA, 1996) and
 * ASA scientific pitch notation. A frequency exactly between two notes is named after the upper one.
 */
export function noteFromFrequency(freqHz: number, a4Hz = 440): NoteReading {
  const f = requireInRange(freqHz, LIMITS.frequencyHz, 'The frequency', 'Hz');
  const a4 = requireA4(a4Hz);
  const exactMidi = A4_MIDI + 12 * Math.log2(f / a4);
  const midi = Math.round(exactMidi);
  const freq = a4 * 2 ** ((midi - A4_MIDI) / 12);
  return { note: nameOf(midi), freq, cents: 1200 * Math.log2(f / freq), midi };
}

const LETTER_SEMITONES = { C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 } as const;
const NOTE_PATTERN = /^([A-Ga-g])(#|♯|b|♭)?(-?\d{1,2})$/;

/**
 * Frequency of a note written in scientific pitch notation ('A4', 'C#3', 'Eb2', 'Cb4' = B3).
 * Sources as for `noteFromFrequency`: f = a4·2^((n − 69)/12). Accepts '#'/'♯' for sharp and
 * 'b'/'♭' for flat; anything else is refused rather than guessed.
 */
export function frequencyFromNote(note: string, a4Hz = 440): number {
  const a4 = requireA4(a4Hz);
  const match = typeof note === 'string' ? NOTE_PATTERN.exec(note.trim()) : null;
  if (!match) {
    throw new RangeError(
      `${formatNumber(note)} is not a note. Write a letter A–G, an optional # or b, and an octave number, e.g. 'A4', 'C#3' or 'Eb2'.`,
    );
  }
  // Groups 1 and 3 are not optional in NOTE_PATTERN, so a match always has them.
  const letter = match[1]!.toUpperCase() as keyof typeof LETTER_SEMITONES;
  const accidental = match[2];
  const octave = Number(match[3]!);
  const shift = accidental === '#' || accidental === '♯' ? 1 : accidental ? -1 : 0;
  const midi = (octave + 1) * 12 + LETTER_SEMITONES[letter] + shift;
  const freq = a4 * 2 ** ((midi - A4_MIDI) / 12);
  return requireInRange(freq, LIMITS.frequencyHz, `The note ${note.trim()}`, 'Hz', {
    hint: 'Pick a note within the audible range and a little beyond.',
  });
}
