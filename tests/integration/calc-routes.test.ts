import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';

/**
 * The calculator routes answer published values, signed out. Each expected number names where
 * it comes from; "from memory" marks a value recalled rather than read from the source today.
 */
let server: TestServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

async function get(path: string): Promise<Record<string, any>> /* eslint-disable-line @typescript-eslint/no-explicit-any -- answers are checked field by field below */ {
  const res = await fetch(`${server.url}/api/calc/${path}`);
  expect(res.status, `${path}: ${await res.clone().text()}`).toBe(200);
  expect(res.headers.get('content-type')).toMatch(/application\/json/);
  return res.json();
}

async function post(body: unknown): Promise<Record<string, any>> /* eslint-disable-line @typescript-eslint/no-explicit-any -- answers are checked field by field below */ {
  const res = await fetch(`${server.url}/api/calc/response`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  expect(res.status, await res.clone().text()).toBe(200);
  return res.json();
}

describe('GET /api/calc/band', () => {
  it('converts octaves and Q both ways', async () => {
    // Audio EQ Cookbook relation 1/Q = 2·sinh(ln2/2·N); RaneNote 170 table: 1 oct = 1.41, 1/3 oct = 4.32, 2 oct = 0.67 (from memory).
    expect((await get('band?octaves=1')).q).toBeCloseTo(Math.SQRT2, 10);
    expect((await get('band?octaves=0.3333333333')).q).toBeCloseTo(4.318, 3);
    expect((await get('band?octaves=2')).q).toBeCloseTo(0.667, 3);
    expect((await get('band?q=1.4142135623730951')).octaves).toBeCloseTo(1, 10);
  });

  it('gives the −3 dB edges around f0 as their geometric mean, and back', async () => {
    // Audio EQ Cookbook BPF prototype: f1·f2 = f0², f2 − f1 = f0/Q.
    const band = await get('band?f0=1000&q=1.4142135623730951');
    expect(band.low).toBeCloseTo(707.107, 3);
    expect(band.high).toBeCloseTo(1414.214, 3);
    expect(band.bandwidthHz).toBeCloseTo(707.107, 3);
    expect(Math.sqrt(band.low * band.high)).toBeCloseTo(1000, 9);
    const back = await get('band?low=707.1067811865476&high=1414.213562373095');
    expect(back.f0).toBeCloseTo(1000, 9);
    expect(back.octaves).toBeCloseTo(1, 9);
    expect(back.q).toBeCloseTo(Math.SQRT2, 9);
    const byOctaves = await get('band?f0=1000&octaves=1');
    expect(byOctaves.low).toBeCloseTo(707.107, 3);
  });
});

describe('GET /api/calc/bands', () => {
  it('lists third-octave bands on the IEC 61260-1 base-10 grid', async () => {
    const { bands } = await get('bands?fraction=3&from=20&to=20000');
    // ISO 266 preferred frequencies 20 Hz … 20 kHz: 31 bands.
    expect(bands).toHaveLength(31);
    expect(bands[0].nominal).toBe(20);
    // IEC 61260-1 eq. for odd b: fm = 1000·10^(3x/30); x = −17 → 19.953 Hz.
    expect(bands[0].exact).toBeCloseTo(19.953, 3);
    const k1 = bands.find((b: { nominal: number }) => b.nominal === 1000);
    expect(k1.exact).toBe(1000);
    // Edges fm·G^(±1/6), G = 10^0.3: 891.25 and 1122.02 Hz.
    expect(k1.low).toBeCloseTo(891.251, 3);
    expect(k1.high).toBeCloseTo(1122.018, 3);
  });

  it('accepts 1/3 as the fraction and lists octave bands with their ISO labels', async () => {
    expect((await get('bands?fraction=1/3')).bands).toHaveLength(31);
    const { bands } = await get('bands?fraction=1');
    // ISO 266 octave centres between 20 Hz and 20 kHz.
    expect(bands.map((b: { nominal: number }) => b.nominal)).toEqual([31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000, 16000]);
  });
});

describe('GET /api/calc/note', () => {
  it('names a frequency with its offset in cents, for a chosen A4', async () => {
    // ISO 16: A4 = 440 Hz; 12-TET middle C = 440·2^(−9/12) = 261.626 Hz.
    expect(await get('note?freq=440')).toMatchObject({ note: 'A4', freq: 440, cents: 0 });
    const c4 = await get('note?freq=261.63');
    expect(c4.note).toBe('C4');
    expect(c4.freq).toBeCloseTo(261.626, 3);
    expect(Math.abs(c4.cents)).toBeLessThan(0.1);
    // 445 Hz is 1200·log2(445/440) = +19.56 cents sharp of A4.
    expect((await get('note?freq=445')).cents).toBeCloseTo(19.56, 2);
    expect(await get('note?freq=432&a4=432')).toMatchObject({ note: 'A4', freq: 432 });
  });

  it('gives the frequency of a note, sharps written %23', async () => {
    expect((await get('note?note=C%234')).freq).toBeCloseTo(277.183, 3);
    expect((await get('note?note=A2')).freq).toBeCloseTo(110, 10);
    expect((await get('note?note=Eb2')).note).toBe('D#2');
  });
});

describe('GET /api/calc/spl-sum', () => {
  it('adds unrelated sources by power', async () => {
    // Kinsler et al., energetic summation: two equal sources +3.01 dB, three +4.77 dB.
    expect((await get('spl-sum?levels=94,94')).total).toBeCloseTo(97.01, 2);
    expect((await get('spl-sum?levels=90,90,90')).total).toBeCloseTo(94.77, 2);
    expect((await get('spl-sum?levels=100,80')).total).toBeCloseTo(100.04, 2);
  });

  it('adds the same signal by pressure with phases', async () => {
    // Superposition of equal pressures: in phase +6.02 dB, 90° apart +3.01 dB.
    expect((await get('spl-sum?levels=94,94&mode=coherent')).total).toBeCloseTo(100.02, 2);
    expect((await get('spl-sum?levels=94,94&mode=coherent&phases=0,90')).total).toBeCloseTo(97.01, 2);
    expect((await get('spl-sum?levels=94,94&mode=coherent&phases=0,180')).total).toBeLessThan(0);
  });
});

describe('GET /api/calc/distance', () => {
  it('loses 6 dB per doubling from a point and 3 dB from a line, in m or ft', async () => {
    // ISO 9613-2 eq. (7) geometrical divergence; cylindrical spreading for a line (Kinsler et al.).
    expect(await get('distance?level=100&from=10&to=20')).toMatchObject({ source: 'point' });
    expect((await get('distance?level=100&from=10&to=20')).change).toBeCloseTo(-6.02, 2);
    expect((await get('distance?level=100&from=10&to=20&source=line')).level).toBeCloseTo(96.99, 2);
    expect((await get('distance?level=100&from=33&to=66&unit=ft')).change).toBeCloseTo(-6.02, 2);
    expect((await get('distance?level=90&from=40&to=10')).level).toBeCloseTo(102.04, 2);
  });
});

describe('GET /api/calc/background', () => {
  it('removes the background from the total', async () => {
    // ISO 3744 K1 = −10·log10(1 − 10^(−ΔL/10)): ΔL = 8 dB → 0.75 dB; ΔL = 3 dB → 3.02 dB.
    expect((await get('background?total=96&background=88')).source).toBeCloseTo(95.25, 2);
    expect((await get('background?total=90&background=87')).correction).toBeCloseTo(3.02, 2);
  });
});

describe('GET /api/calc/weighting', () => {
  it('matches IEC 61672-1 Table 3 (rounded to 0.1 dB)', async () => {
    // Table 3 rows are labelled with nominal frequencies but hold the curves at the exact base-10
    // frequencies 10^(n/10): the "31.5 Hz" row is 31.62 Hz.
    const f31 = 10 ** 1.5;
    const cases: [number, string, number][] = [
      [1000, 'A', 0],
      [100, 'A', -19.1],
      [f31, 'A', -39.4],
      [10000, 'A', -2.5],
      [f31, 'C', -3.0],
      [10000, 'C', -4.4],
      [63, 'Z', 0],
    ];
    for (const [freq, curve, db] of cases) expect((await get(`weighting?freq=${freq}&curve=${curve}`)).db).toBeCloseTo(db, 1);
    expect((await get('weighting?freq=1000&curve=a')).curve).toBe('A');
  });
});

describe('GET /api/calc/exposure', () => {
  it('answers OSHA per 29 CFR 1910.95 Table G-16, with the caution', async () => {
    const cases: [number, number][] = [
      [90, 8],
      [95, 4],
      [100, 2],
      [105, 1],
      [115, 0.25],
    ];
    for (const [level, hours] of cases) expect((await get(`exposure?level=${level}&standard=osha`)).hours).toBeCloseTo(hours, 10);
    const answer = await get('exposure?level=100&standard=osha');
    expect(answer).toMatchObject({ standard: 'osha', criterionDba: 90, exchangeRateDb: 5 });
    expect(answer.caution).toMatch(/estimate/i);
    expect(answer.caution).toMatch(/calibrated/i);
    expect(answer.caution).toMatch(/countr/i);
  });

  it('answers NIOSH per Publication 98-126, kept apart from OSHA', async () => {
    // NIOSH 98-126 Table 1-1: 85 dBA 8 h, 88 dBA 4 h, 94 dBA 1 h, 100 dBA 15 min.
    const cases: [number, number][] = [
      [85, 8],
      [88, 4],
      [94, 1],
      [100, 0.25],
    ];
    for (const [level, hours] of cases) expect((await get(`exposure?level=${level}&standard=niosh`)).hours).toBeCloseTo(hours, 10);
    const niosh = await get('exposure?level=100&standard=NIOSH');
    expect(niosh).toMatchObject({ standard: 'niosh', criterionDba: 85, exchangeRateDb: 3 });
    expect(niosh.caution.length).toBeGreaterThan(60);
  });
});

describe('GET /api/calc/delay', () => {
  it('uses the ideal-gas speed of sound and converts to samples', async () => {
    // c = 331.3·√(1 + T/273.15): 343.21 m/s at 20 °C (Kinsler et al.).
    const d = await get('delay?distance=34.321462268&rate=48000');
    expect(d.speed).toBeCloseTo(343.215, 3);
    expect(d.ms).toBeCloseTo(100, 6);
    expect(d.samples).toBeCloseTo(4800, 3);
    expect((await get('delay?distance=34.321462268&temp=68&tempUnit=F')).ms).toBeCloseTo(100, 6);
    expect((await get('delay?distance=10&temp=0')).speed).toBeCloseTo(331.3, 10);
    // 1 ft = 0.3048 m exactly (NIST SP 811).
    expect((await get('delay?distance=100&unit=ft')).distanceMeters).toBeCloseTo(30.48, 12);
    expect((await get('delay?distance=10')).samples).toBeUndefined();
  });
});

describe('GET /api/calc/align', () => {
  it('delays the fill by the path difference plus the precedence offset', async () => {
    expect((await get('align?main=30&fill=8')).delayMs).toBeCloseTo((22 / 343.2146) * 1000, 2);
    const withOffset = await get('align?main=30&fill=8&offset=5');
    expect(withOffset).toMatchObject({ delayOn: 'fill' });
    expect(withOffset.delayMs).toBeCloseTo(64.1 + 5, 1);
    const reversed = await get('align?main=8&fill=30');
    expect(reversed.delayOn).toBe('main');
    expect(reversed.note).toMatch(/farther/);
  });
});

describe('POST /api/calc/response', () => {
  it('puts a peaking band exactly at its gain at f0 (Audio EQ Cookbook pre-warping)', async () => {
    const r = await post({ sampleRate: 48000, filters: [{ type: 'peaking', freq: 1000, gain: 6, q: 1 }], freqs: [1000, 20] });
    expect(r.magnitudeDb[0]).toBeCloseTo(6, 9);
    expect(Math.abs(r.magnitudeDb[1])).toBeLessThan(0.05);
  });

  it('gives crossovers their textbook level at the crossover frequency', async () => {
    // Linkwitz (JAES 1976): each LR side −6.02 dB at fc; Butterworth −3.01 dB.
    const lr = await post({ sampleRate: 48000, filters: [{ type: 'crossover-low', freq: 100, family: 'linkwitz-riley', slope: 24 }], freqs: [100] });
    expect(lr.magnitudeDb[0]).toBeCloseTo(-6.02, 2);
    const bw = await post({ sampleRate: 48000, filters: [{ type: 'crossover-high', freq: 100, family: 'butterworth', slope: 12 }], freqs: [100] });
    expect(bw.magnitudeDb[0]).toBeCloseTo(-3.01, 2);
  });

  it('defaults to a log grid from 10 Hz to 24 kHz, or to Nyquist below 48 kHz', async () => {
    const r = await post({ sampleRate: 48000, filters: [] });
    expect(r.freqs[0]).toBe(10);
    expect(r.freqs.at(-1)).toBe(24000);
    expect(r.magnitudeDb.every((v: number) => v === 0)).toBe(true);
    expect(r.freqs.length).toBe(r.phaseDeg.length);
    expect((await post({ sampleRate: 44100, filters: [] })).freqs.at(-1)).toBe(22050);
  });
});

it('answers without a session and with no server error logged', () => {
  expect(server.output()).not.toMatch(/unhandled error/);
});
