/**
 * The compact stored form of a parsed trace: JSON with values rounded to what a measurement can
 * resolve (7 significant digits of frequency, 0.001 dB, 0.01°, 0.001 coherence). Read back on
 * every render instead of re-parsing the uploaded text, and checked on the way in so a damaged
 * file on disk cannot put NaN into a plot.
 */
import type { Trace } from './parse-trace';

const round = (digits: number) => (x: number) => Number(x.toFixed(digits));

export function encodeTrace(trace: Trace): string {
  return JSON.stringify({
    v: 1,
    f: trace.freqHz.map((x) => Number(x.toPrecision(7))),
    m: trace.magnitudeDb.map(round(3)),
    ...(trace.phaseDeg ? { p: trace.phaseDeg.map(round(2)) } : {}),
    ...(trace.coherence ? { c: trace.coherence.map(round(3)) } : {}),
  });
}

function numbers(value: unknown, length?: number): number[] {
  if (!Array.isArray(value) || (length !== undefined && value.length !== length) || !value.every((x) => typeof x === 'number' && Number.isFinite(x))) {
    throw new Error('The stored trace is damaged.');
  }
  return value as number[];
}

export function decodeTrace(json: string): Trace {
  const raw = JSON.parse(json) as { v?: unknown; f?: unknown; m?: unknown; p?: unknown; c?: unknown };
  if (raw.v !== 1) throw new Error('The stored trace has an unknown version.');
  const freqHz = numbers(raw.f);
  const trace: Trace = { freqHz, magnitudeDb: numbers(raw.m, freqHz.length) };
  if (raw.p !== undefined) trace.phaseDeg = numbers(raw.p, freqHz.length);
  if (raw.c !== undefined) trace.coherence = numbers(raw.c, freqHz.length);
  return trace;
}
