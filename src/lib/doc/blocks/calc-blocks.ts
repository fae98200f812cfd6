/** Blocks made from a calculator's result, for "save into a page". */
import { COOKBOOK_TYPES, type FilterSpec } from '~/lib/acoustics';
import { BLOCK_LIMITS, CROSSOVER_BLOCK, DELAY_BLOCK, EQ_BLOCK, newDelayRow, type DelayBlockAttrs, type EqBand, type EqBlockAttrs } from './block-data';
import type { PmNode } from '../types';

/** The nearest rate a processor block offers, so a calculator's odd rate still makes a valid block. */
export function blockSampleRate(rate: number): number {
  return BLOCK_LIMITS.sampleRates.reduce((best, r) => (Math.abs(r - rate) < Math.abs(best - rate) ? r : best), 48_000);
}

/**
 * An EQ block from the response calculator's cookbook filters, and a crossover block from its crossover
 * sides (two or more). A shelf keeps its slope S; a shelf given by Q is stored with S = 1.
 */
export function blocksFromFilters(filters: readonly FilterSpec[], sampleRate: number, label: string): PmNode[] {
  const rate = blockSampleRate(sampleRate);
  const bands: EqBand[] = filters
    .filter((f) => (COOKBOOK_TYPES as readonly string[]).includes(f.type))
    .slice(0, BLOCK_LIMITS.maxBands)
    .map((f) => {
      const shelf = f.type === 'lowshelf' || f.type === 'highshelf';
      return { type: f.type as EqBand['type'], freq: f.freq, gain: f.gain ?? 0, q: shelf ? Math.min(1, f.slope ?? 1) : (f.q ?? Math.SQRT1_2), on: true };
    });
  const nodes: PmNode[] = [];
  if (bands.length) {
    const attrs: EqBlockAttrs = { label, sampleRate: rate, bands, outputGain: 0, polarity: 'normal', note: '' };
    nodes.push({ type: EQ_BLOCK, attrs });
  }
  const sides = filters.filter((f) => f.type === 'crossover-low' || f.type === 'crossover-high');
  if (sides.length) {
    const ways = sides.slice(0, BLOCK_LIMITS.maxWays).map((f, i) => {
      const edge = { family: f.family ?? 'linkwitz-riley', slope: f.slope ?? 24, freq: f.freq };
      const low = f.type === 'crossover-low';
      return { name: low ? `Low ${i + 1}` : `High ${i + 1}`, highPass: low ? null : edge, lowPass: low ? edge : null, gain: 0, polarity: 'normal' as const, delayMs: 0 };
    });
    if (ways.length >= BLOCK_LIMITS.minWays) nodes.push({ type: CROSSOVER_BLOCK, attrs: { label, sampleRate: rate, ways, note: '' } });
  }
  return nodes;
}

export interface DelayFromCalc {
  name: string;
  label: string;
  sampleRate: number;
  temperature: number;
  tempUnit: 'C' | 'F';
  /** Either a distance (with its unit) or a time. */
  distance?: number;
  unit?: 'm' | 'ft';
  timeMs?: number;
  offsetMs?: number;
}

/** A delay block with one output, from the delay or fill calculator. */
export function delayBlockFromCalc(c: DelayFromCalc): PmNode {
  const row = { ...newDelayRow(c.name), offsetMs: c.offsetMs ?? 0 };
  if (c.distance !== undefined) Object.assign(row, { mode: 'distance', distance: c.distance, unit: c.unit ?? 'm' });
  else Object.assign(row, { mode: 'time', timeMs: c.timeMs ?? 0, distance: 0 });
  const attrs: DelayBlockAttrs = { label: c.label, sampleRate: blockSampleRate(c.sampleRate), temperature: c.temperature, tempUnit: c.tempUnit, rows: [row], note: '' };
  return { type: DELAY_BLOCK, attrs };
}
