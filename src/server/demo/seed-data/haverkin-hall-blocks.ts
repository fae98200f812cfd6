/**
 * Haverkin Hall's processor settings as blocks, per rig state, so the history of the processing
 * page tells the retune: broadside subs (HOUSE 2.0) → cardioid subs (HOUSE 3.0) → balcony delays
 * re-hung (HOUSE 3.1). All values invented for the demo.
 */
import type { CrossoverBlockAttrs, DelayBlockAttrs, EqBand, EqBlockAttrs } from '~/lib/doc/blocks/block-data';
import type { PmNode } from './types';

export interface TuneState {
  cardioid: boolean;
  delaysRehung: boolean;
}

const bell = (freq: number, gain: number, q: number, on = true): EqBand => ({ type: 'peaking', freq, gain, q, on });

export function mainsEqBlock(s: TuneState): PmNode {
  const attrs: EqBlockAttrs = {
    label: 'Mains L/R, processor outputs 1–2',
    sampleRate: 96_000,
    bands: [
      { type: 'highpass', freq: 35, gain: 0, q: 0.71, on: true },
      s.cardioid ? bell(160, -1, 1.2) : bell(180, -3, 1.2),
      bell(400, -2, 2),
      bell(1250, s.cardioid ? -1 : -1.5, 3, s.cardioid),
      bell(2600, -2.5, 2.5),
      bell(5000, 1, 1.4),
      { type: 'highshelf', freq: 10_000, gain: -2, q: 0.7, on: true },
      bell(16_000, s.cardioid ? 1.5 : 2, 1.41),
    ],
    outputGain: 0,
    polarity: 'normal',
    note: s.cardioid
      ? 'Low-mid cut mostly undone after the cardioid subs: less low end on stage, cleaner room at FOH. Band 4 added at 1.25 kHz for the upper boxes.'
      : 'Low-mid cut for the build-up from the stage and the back wall.',
  };
  return { type: 'eqBlock', attrs };
}

export function subEqBlock(s: TuneState): PmNode {
  const attrs: EqBlockAttrs = {
    label: 'Subs, processor outputs 3–6',
    sampleRate: 96_000,
    bands: [bell(52, s.cardioid ? -2.5 : -4, 5), bell(38, 1.5, 2, s.cardioid)],
    outputGain: s.cardioid ? 1.5 : 0,
    polarity: 'normal',
    note: 'Room mode along the length of the hall at 52 Hz.',
  };
  return { type: 'eqBlock', attrs };
}

export function subMainCrossoverBlock(s: TuneState): PmNode {
  const lr24 = (freq: number) => ({ family: 'linkwitz-riley' as const, slope: 24, freq });
  const attrs: CrossoverBlockAttrs = {
    label: 'Sub / main at 90 Hz',
    sampleRate: 96_000,
    ways: [
      { name: 'Sub', highPass: { family: 'butterworth', slope: 24, freq: 27 }, lowPass: lr24(90), gain: s.cardioid ? 1.5 : 0, polarity: 'normal', delayMs: s.cardioid ? 7.6 : 8.2 },
      { name: 'Main', highPass: lr24(90), lowPass: null, gain: 0, polarity: 'normal', delayMs: 0 },
    ],
    note: s.cardioid
      ? 'Sub delay by phase match at 90 Hz at FOH (geometric 7.9 ms). Rear cardioid boxes are set on their own outputs.'
      : 'Sub delay is the centre pair of the arc; outer pairs 7.4 ms, centre 9.0 ms.',
  };
  return { type: 'crossoverBlock', attrs };
}

export function delaysBlock(s: TuneState): PmNode {
  const attrs: DelayBlockAttrs = {
    label: 'Fills and delays, outputs 7–12',
    sampleRate: 96_000,
    temperature: 20,
    tempUnit: 'C',
    rows: [
      { name: 'Front fills FF-A/C (out 7)', mode: 'distance', distance: 3.1, unit: 'm', timeMs: 0, latencyMs: 0, offsetMs: 0.5 },
      { name: 'Front fill FF-B (out 8)', mode: 'distance', distance: 4.45, unit: 'm', timeMs: 0, latencyMs: 0, offsetMs: 0.5 },
      { name: 'Under-balcony (out 9–10)', mode: 'distance', distance: 15.3, unit: 'm', timeMs: 0, latencyMs: 0, offsetMs: 1.4 },
      { name: 'Balcony (out 11–12)', mode: 'distance', distance: s.delaysRehung ? 17.2 : 16.9, unit: 'm', timeMs: 0, latencyMs: 0, offsetMs: s.delaysRehung ? 1.9 : 2 },
    ],
    note: s.delaysRehung ? 'Balcony delays re-measured after the re-hang 1 m lower.' : 'Paths measured from the main arrays to each zone\'s listening line.',
  };
  return { type: 'delayBlock', attrs };
}
