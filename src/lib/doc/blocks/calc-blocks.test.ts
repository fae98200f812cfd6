import { describe, expect, it } from 'vitest';
import { validateDoc } from '../validate-doc';
import { blockSampleRate, blocksFromFilters, delayBlockFromCalc } from './calc-blocks';
import { delayResult } from './block-curves';
import type { DelayBlockAttrs } from './block-data';

const valid = (nodes: unknown[]) => validateDoc({ type: 'doc', content: nodes });

describe('blocks made from calculator results pass the server check', () => {
  it('response filters → an EQ block and a crossover block', () => {
    const nodes = blocksFromFilters(
      [
        { type: 'peaking', freq: 250, gain: -3, q: 1.4 },
        { type: 'highshelf', freq: 8000, gain: -2, slope: 1 },
        { type: 'crossover-low', freq: 90, slope: 24, family: 'linkwitz-riley' },
        { type: 'crossover-high', freq: 90, slope: 24, family: 'linkwitz-riley' },
      ],
      48_000,
      'From the calculator',
    );
    expect(nodes.map((n) => n.type)).toEqual(['eqBlock', 'crossoverBlock']);
    expect(valid(nodes)).toMatchObject({ ok: true });
  });
  it('a delay from the travel or fill calculator keeps its distance, temperature and offset', () => {
    const node = delayBlockFromCalc({ name: 'Fill', label: 'x', sampleRate: 44_100, temperature: 68, tempUnit: 'F', distance: 22, unit: 'm', offsetMs: 5 });
    expect(valid([node])).toMatchObject({ ok: true });
    const a = node.attrs as DelayBlockAttrs;
    // 22 m at 20 °C (68 °F) is 64.1 ms at c = 343.2 m/s (ideal gas, speedOfSound), + 5 ms offset.
    expect(delayResult(a.rows[0]!, a).setMs).toBeCloseTo((22 / 343.2) * 1000 + 5, 0);
    expect(valid([delayBlockFromCalc({ name: 'Out', label: 'y', sampleRate: 48_000, temperature: 20, tempUnit: 'C', timeMs: 12.5 })])).toMatchObject({ ok: true });
  });
  it('an odd calculator rate becomes the nearest block rate', () => {
    expect(blockSampleRate(32_000)).toBe(44_100);
    expect(blockSampleRate(384_000)).toBe(192_000);
  });
});
