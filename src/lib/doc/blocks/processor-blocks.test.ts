import { describe, expect, it } from 'vitest';
import { Node as PmModelNode } from '@tiptap/pm/model';
import { getDocSchema } from '../doc-schema';
import { validateDoc } from '../validate-doc';
import { renderDocHtml } from '../render-html';
import type { PmNode } from '../types';
import { newCrossoverBlock, newDelayBlock, newEqBlock } from './block-data';
import { delayResult } from './block-curves';
import { magnitudeY } from '~/lib/plot/response-svg';
import { dbRange } from '~/lib/plot/frequency-axis';

const doc = (...content: PmNode[]): PmNode => ({ type: 'doc', content });
const eq = (attrs: Record<string, unknown> = {}): PmNode => ({ type: 'eqBlock', attrs: { ...newEqBlock(), ...attrs } });
const band = (b: Record<string, unknown>): Record<string, unknown> => ({ type: 'peaking', freq: 1000, gain: 0, q: 1.41, on: true, ...b });

function refusal(input: PmNode): string {
  const r = validateDoc(input);
  if (r.ok) throw new Error('expected a refusal');
  return r.message;
}

describe('processor blocks round-trip through the editor schema and the server check', () => {
  for (const [name, node] of [
    ['EQ', eq({ bands: [band({ freq: 250, gain: -3, q: 1.4 }), band({ type: 'highshelf', freq: 8000, gain: -2, q: 0.7 }), band({ type: 'highpass', freq: 35, q: 0.71, on: false })] })],
    ['crossover', { type: 'crossoverBlock', attrs: newCrossoverBlock() }],
    ['delay', { type: 'delayBlock', attrs: newDelayBlock() }],
  ] as const) {
    it(name, () => {
      const input = doc(node as PmNode);
      const checked = validateDoc(input);
      expect(checked.ok).toBe(true);
      if (!checked.ok) return;
      expect(checked.doc).toEqual({ type: 'doc', content: [node] });
      // The editor's own schema reads the stored JSON back to the same node.
      const parsed = PmModelNode.fromJSON(getDocSchema(), checked.doc);
      expect(parsed.toJSON()).toEqual(checked.doc);
    });
  }

  it('fills missing attributes with the defaults, then checks them', () => {
    const r = validateDoc(doc({ type: 'eqBlock' }));
    expect(r.ok).toBe(true);
  });
});

describe('hostile block attributes are refused with a sentence naming the band and the field', () => {
  it('NaN, strings in numbers, 1e9 Hz, negative Q', () => {
    expect(refusal(doc(eq({ bands: [band({}), band({ freq: Number.NaN })] })))).toMatch(/^EQ block "Mains EQ": band 2, frequency \(Hz\) must be/);
    expect(refusal(doc(eq({ bands: [band({ gain: '3' })] })))).toMatch(/band 1, gain \(dB\) must be a number .*the text "3"/);
    expect(refusal(doc(eq({ bands: [band({}), band({}), band({ freq: 1e9 })] })))).toMatch(/band 3, frequency \(Hz\) must be from 1 to 100000/);
    expect(refusal(doc(eq({ bands: [band({ q: -1 })] })))).toMatch(/band 1, Q .* must be from 0.1 to 100/);
  });
  it('33 bands, f0 at or above 0.49·fs, unknown band types, unknown fields', () => {
    expect(refusal(doc(eq({ bands: Array.from({ length: 33 }, () => band({})) })))).toMatch(/bands must hold 0 to 32 bands; got 33/);
    expect(refusal(doc(eq({ sampleRate: 48_000, bands: [band({ freq: 23_520 })] })))).toMatch(/band 1, frequency \(Hz\) must be below 23520 Hz \(0.49/);
    expect(validateDoc(doc(eq({ sampleRate: 48_000, bands: [band({ freq: 23_519 })] }))).ok).toBe(true);
    expect(refusal(doc(eq({ bands: [band({ type: 'wobble' })] })))).toMatch(/band 1, type must be one of peaking/);
    expect(refusal(doc(eq({ bands: [band({ colour: 'red' })] })))).toMatch(/band 1/);
    expect(refusal(doc({ type: 'eqBlock', attrs: { ...newEqBlock(), script: 'x' } }))).toMatch(/no attribute "script"/);
    expect(refusal(doc({ type: 'spectrumBlock' }))).toMatch(/does not know/);
  });
  it('1 MB of note text, an odd sample rate, a shelf with S above 1', () => {
    expect(refusal(doc(eq({ note: 'x'.repeat(1024 * 1024) })))).toMatch(/note must be at most 2000 characters/);
    expect(refusal(doc(eq({ sampleRate: 50_000 })))).toMatch(/sample rate must be one of 44100, 48000, 88200, 96000, 192000/);
    expect(refusal(doc(eq({ bands: [band({ type: 'lowshelf', q: 2 })] })))).toMatch(/band 1, Q .* shelf slope S/);
  });
  it('crossover: a way count outside 2–4, a slope the family lacks, Bessel, a wrong polarity, above 0.49·fs', () => {
    const x = newCrossoverBlock();
    const cross = (attrs: Record<string, unknown>): PmNode => ({ type: 'crossoverBlock', attrs: { ...x, ...attrs } });
    expect(refusal(doc(cross({ ways: [x.ways[0]] })))).toMatch(/ways must hold 2 to 4 ways/);
    expect(refusal(doc(cross({ ways: [x.ways[0], { ...x.ways[1], highPass: { family: 'linkwitz-riley', slope: 18, freq: 90 } }] })))).toMatch(/way 2, high-pass, slope .* must be one of 12, 24, 36, 48/);
    expect(refusal(doc(cross({ ways: [x.ways[0], { ...x.ways[1], highPass: { family: 'bessel', slope: 24, freq: 90 } }] })))).toMatch(/way 2, high-pass, filter family/);
    expect(refusal(doc(cross({ ways: [{ ...x.ways[0], polarity: 'reverse' }, x.ways[1]] })))).toMatch(/way 1, polarity must be normal or inverted/);
    expect(refusal(doc(cross({ ways: [x.ways[0], { ...x.ways[1], highPass: { family: 'butterworth', slope: 24, freq: 23_600 } }] })))).toMatch(/way 2, high-pass, frequency .* below 23520/);
  });
  it('delay: a temperature out of the air range, a negative latency', () => {
    const d = newDelayBlock();
    expect(refusal(doc({ type: 'delayBlock', attrs: { ...d, temperature: 200 } }))).toMatch(/temperature must be from -60 to 60/);
    expect(refusal(doc({ type: 'delayBlock', attrs: { ...d, rows: [{ ...d.rows[0], latencyMs: -2 }] } }))).toMatch(/output 1, latency \(ms\) must be from 0/);
  });
});

/** The y of the total magnitude curve at its point nearest `hz` in the first block's plot. */
function curveYAt(html: string, cls: string, hz: number): number {
  const d = new RegExp(`class="tl-curve tl-curve-${cls}" d="([^"]+)"`).exec(html)![1]!;
  const points = [...d.matchAll(/[ML]([\d.]+) ([\d.-]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
  const x = (1000 * Math.log10(hz / 20)) / 3;
  return points.reduce((best, p) => (Math.abs(p.x - x) < Math.abs(best.x - x) ? p : best)).y;
}

describe('server render at known points', () => {
  it('a +6 dB bell reads +6 dB at its centre on the plot\'s own scale (Audio EQ Cookbook: peakingEQ is exactly dBgain at f0)', () => {
    // 1002.3 Hz sits on the 240-point grid from 20 Hz to 20 kHz (20·1000^(136/239)), so the nearest point is f0 itself.
    const f0 = 20 * 1000 ** (136 / 239);
    const html = renderDocHtml(doc(eq({ bands: [band({ freq: f0, gain: 6, q: 2 })] })));
    expect(html).toContain('<svg class="tl-plot"');
    expect(html).not.toContain('<script');
    const y = curveYAt(html, 'total', f0);
    expect(y).toBeCloseTo(magnitudeY(6, dbRange([6])), 1);
    expect(html).toContain('Q per the Audio EQ Cookbook: width between the half-gain points of the analog prototype.');
  });

  it('an LR24 crossover\'s sum is drawn flat (Linkwitz 1976: within 0.01 dB, which is far below one SVG unit)', () => {
    const html = renderDocHtml(doc({ type: 'crossoverBlock', attrs: newCrossoverBlock() }));
    const range = { top: 12, bottom: -36 };
    for (const f of [30, 90, 300, 3000]) expect(Math.abs(curveYAt(html, 'sum', f) - magnitudeY(0, range))).toBeLessThan(0.11);
  });

  it('BW12 with both ways normal shows the null at fc', () => {
    const edge = { family: 'butterworth' as const, slope: 12, freq: 100 };
    const x = newCrossoverBlock();
    const html = renderDocHtml(doc({ type: 'crossoverBlock', attrs: { ...x, ways: [{ ...x.ways[0]!, lowPass: edge }, { ...x.ways[1]!, highPass: edge }] } }));
    // Around fc the sum falls off the bottom of the −36 dB pane (held at 20 % below it).
    expect(curveYAt(html, 'sum', 100)).toBeGreaterThan(magnitudeY(-36, { top: 12, bottom: -36 }));
  });

  it('a band at 16 kHz on a 48 kHz EQ gets its dashed analog prototype and its real width (0.417 octave, +12 dB, Q √2)', () => {
    const html = renderDocHtml(doc(eq({ bands: [band({ freq: 16_000, gain: 12, q: Math.SQRT2 })] })));
    expect(html).toContain('tl-curve-prototype');
    expect(html).toMatch(/<td class="num">0.417<\/td>/);
  });

  it('the delay table: 34.3 m at 20 °C is 100 ms (c = 343.2 m/s, ideal-gas formula of speedOfSound), + 5 ms offset − 2 ms latency', () => {
    const d = newDelayBlock();
    const row = { ...d.rows[0]!, distance: 34.32, offsetMs: 5, latencyMs: 2 };
    const r = delayResult(row, d);
    expect(r.flightMs).toBeCloseTo(100, 0);
    expect(r.setMs).toBeCloseTo(r.flightMs + 3, 9);
    expect(r.samples).toBeCloseTo((r.setMs * 48_000) / 1000, 9);
    expect(r.driftColdMs).toBeGreaterThan(0); // colder air is slower
    expect(r.driftWarmMs).toBeLessThan(0);
    const html = renderDocHtml(doc({ type: 'delayBlock', attrs: { ...d, rows: [row] } }));
    expect(html).toMatch(/<strong>103\.\d\d<\/strong>/);
  });

  it('a stored block that cannot be drawn reads as a note, not a crash', () => {
    const html = renderDocHtml(doc(eq({ bands: [band({ freq: 30_000 })] })));
    expect(html).toContain('cannot be drawn');
  });
});
