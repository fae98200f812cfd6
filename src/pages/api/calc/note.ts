import { frequencyFromNote, noteFromFrequency } from '~/lib/acoustics';
import { NoteQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/**
 * Nearest equal-tempered note to a frequency (freq is that note's frequency, cents the input's
 * offset from it), or the frequency of a named note (cents 0; the name comes back with sharps).
 */
export const GET = calcGet(NoteQuerySchema, (input) => {
  if ('freq' in input) {
    const reading = noteFromFrequency(input.freq, input.a4);
    return { ...reading, input: input.freq, a4: input.a4 };
  }
  const freq = frequencyFromNote(input.note, input.a4);
  const reading = noteFromFrequency(freq, input.a4);
  return { note: reading.note, freq, cents: 0, midi: reading.midi, input: input.note, a4: input.a4 };
});
