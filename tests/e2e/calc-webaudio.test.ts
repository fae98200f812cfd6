import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cascadeResponse, type FilterSpec } from '~/lib/acoustics';
import { foreignRequests, launchBrowser, type Browser } from '../helpers/browser';
import { startServer, type TestServer } from '../helpers/server';

/**
 * Our cookbook biquads against Chromium's own BiquadFilterNode.getFrequencyResponse.
 *
 * Source for the browser's side: Web Audio API (W3C), § BiquadFilterNode, "Filters
 * Characteristics" (WebAudio/web-audio-api index.bs). It uses the Audio EQ Cookbook formulas with
 * three conventions of its own, mapped here:
 * - lowpass / highpass: alpha = sin(w0) / (2 · 10^(Q/20)), i.e. Q is given in dB, so our linear
 *   Q is passed as 20·log10(Q);
 * - lowshelf / highshelf: Q is ignored and the shelf slope is fixed at S = 1, so our shelves are
 *   designed with no Q and the default S = 1;
 * - bandpass, notch, allpass, peaking: alpha = sin(w0) / (2Q) with Q as in the cookbook.
 * Both sides are compared at float32 frequencies, because getFrequencyResponse takes Float32Arrays.
 */
let server: TestServer;
let browser: Browser;
beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

type WebAudioType = 'lowpass' | 'highpass' | 'bandpass' | 'lowshelf' | 'highshelf' | 'peaking' | 'notch' | 'allpass';

interface Case {
  type: WebAudioType;
  freq: number;
  q?: number;
  gain?: number;
}

const CASES: Case[] = [
  { type: 'lowpass', freq: 1000, q: Math.SQRT1_2 },
  { type: 'lowpass', freq: 120, q: 3 },
  { type: 'highpass', freq: 80, q: 0.5 },
  { type: 'highpass', freq: 6000, q: 2.5 },
  { type: 'bandpass', freq: 1000, q: 2 },
  { type: 'bandpass', freq: 60, q: 0.7 },
  { type: 'notch', freq: 1000, q: 5 },
  { type: 'notch', freq: 12000, q: 1 },
  { type: 'allpass', freq: 1000, q: 0.7 },
  { type: 'allpass', freq: 200, q: 4 },
  { type: 'peaking', freq: 250, q: 1.4, gain: -6 },
  { type: 'peaking', freq: 8000, q: 4, gain: 12 },
  { type: 'lowshelf', freq: 100, gain: 6 },
  { type: 'lowshelf', freq: 400, gain: -12 },
  { type: 'highshelf', freq: 8000, gain: -9 },
  { type: 'highshelf', freq: 3000, gain: 15 },
];

/** The Web Audio node's Q for our filter, per the conventions above. */
function webAudioQ(c: Case): number {
  if (c.type === 'lowpass' || c.type === 'highpass') return 20 * Math.log10(c.q as number);
  if (c.type === 'lowshelf' || c.type === 'highshelf') return 1;
  return c.q as number;
}

/** Our spec for the same filter: shelves without a Q, so the cookbook's S = 1 applies. */
function ourSpec(c: Case): FilterSpec {
  const shelf = c.type === 'lowshelf' || c.type === 'highshelf';
  return { type: c.type, freq: c.freq, ...(shelf ? {} : { q: c.q }), ...(c.gain !== undefined ? { gain: c.gain } : {}) };
}

/**
 * Far into a stop band both sides compute a tiny number from coefficients rounded differently
 * (Chromium reads frequency and Q from float32 AudioParams); below this, dB differences are noise.
 */
const COMPARE_ABOVE_DB = -140;
const TOLERANCE_DB = 0.01;

describe.each([48_000, 44_100])('biquads at %i Hz against Chromium', (sampleRate) => {
  const freqs = Array.from({ length: 240 }, (_, i) => Math.fround(10 * ((sampleRate / 2) / 10) ** (i / 239)));

  it.each(CASES)('$type at $freq Hz matches getFrequencyResponse within 0.01 dB', async (c) => {
    const page = await browser.context.newPage();
    await page.goto(`${server.url}/calc`);
    const chromium = await page.evaluate(
      ({ type, frequency, Q, gain, freqs, sampleRate }) => {
        const context = new OfflineAudioContext(1, 128, sampleRate);
        const node = new BiquadFilterNode(context, { type, frequency, Q, gain });
        const magnitude = new Float32Array(freqs.length);
        const phase = new Float32Array(freqs.length);
        node.getFrequencyResponse(new Float32Array(freqs), magnitude, phase);
        return { magnitude: Array.from(magnitude), phase: Array.from(phase) };
      },
      { type: c.type, frequency: c.freq, Q: webAudioQ(c), gain: c.gain ?? 0, freqs, sampleRate },
    );
    await page.close();

    const ours = cascadeResponse([ourSpec(c)], freqs, sampleRate);
    let compared = 0;
    let worstDb = 0;
    let worstDeg = 0;
    freqs.forEach((f, i) => {
      const theirsDb = 20 * Math.log10(chromium.magnitude[i]);
      if (ours.magnitudeDb[i] < COMPARE_ABOVE_DB && theirsDb < COMPARE_ABOVE_DB) return;
      compared += 1;
      worstDb = Math.max(worstDb, Math.abs(ours.magnitudeDb[i] - theirsDb));
      const theirsDeg = (chromium.phase[i] * 180) / Math.PI;
      const diff = Math.abs(((ours.phaseDeg[i] - theirsDeg + 540) % 360) - 180);
      worstDeg = Math.max(worstDeg, diff);
    });
    expect(compared).toBeGreaterThan(freqs.length * 0.75);
    expect(worstDb).toBeLessThan(TOLERANCE_DB);
    // Phase is not part of the requirement, but the same coefficients must give the same angle.
    expect(worstDeg).toBeLessThan(0.01);
  });
});

it('made no request beyond 127.0.0.1', () => {
  expect(foreignRequests(browser.requests)).toEqual([]);
});
