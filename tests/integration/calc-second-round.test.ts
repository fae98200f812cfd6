import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';

/**
 * Issue 13 over HTTP: the cases it lists answer as described, and the new routes answer published
 * values. Each expected number names its source; "from memory" marks a value recalled, not re-read.
 */
let server: TestServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

async function get(path: string): Promise<Record<string, any>> /* eslint-disable-line @typescript-eslint/no-explicit-any -- answers are checked field by field below */ {
  const res = await fetch(`${server.url}/api/calc/${path}`);
  expect(res.status, `${path}: ${await res.clone().text()}`).toBe(200);
  return res.json();
}

async function refused(path: string): Promise<{ error: string; field?: string }> {
  const res = await fetch(`${server.url}/api/calc/${path}`);
  expect(res.status, path).toBe(400);
  return res.json();
}

describe('the cases issue 13 lists', () => {
  it('exposure at 130 dBA (OSHA) is not permitted: Table G-16 of 29 CFR 1910.95 ends at 115 dBA', async () => {
    expect(await get('exposure?level=130&standard=osha')).toMatchObject({ hours: 0, notPermitted: true, noDailyLimit: false });
    expect((await get('exposure?level=115&standard=osha')).hours).toBeCloseTo(0.25, 12); // Table G-16: 115 dBA ¼ h
  });

  it('exposure at 70 dBA has no daily limit rather than 128 h (the OSHA formula gives 8·2^4 = 128 h > 24 h)', async () => {
    const a = await get('exposure?level=70&standard=osha');
    expect(a).toMatchObject({ hours: null, noDailyLimit: true, notPermitted: false });
    expect(a.note).toMatch(/No daily limit/);
  });

  it('exposure offers the EU rule: 87 dB(A) for 8 h is the limit value (2003/10/EC Art. 3)', async () => {
    const eu = await get('exposure?level=87&standard=eu');
    expect(eu.hours).toBeCloseTo(8, 12);
    expect(eu.rule).toMatch(/2003\/10\/EC/);
  });

  it('background 64.1 / 61.1 is exactly 3 dB and accepted, with the ISO 3744 6 dB warning (K1 at 3 dB = 3.02 dB)', async () => {
    const b = await get('background?total=64.1&background=61.1');
    expect(b.source).toBeCloseTo(61.08, 2);
    expect(b.warning).toMatch(/6 dB/);
    expect((await get('background?total=96&background=88')).warning).toBeUndefined();
  });

  it('align main 10 / fill 12 says the main gets 5.827 ms; main 5 / fill 9 with 10 ms offset needs no delay (c = 343.2 m/s)', async () => {
    expect(await get('align?main=10&fill=12')).toMatchObject({ delayOn: 'main' });
    expect((await get('align?main=10&fill=12')).delayMs).toBeCloseTo(5.827, 3);
    const none = await get('align?main=5&fill=9&offset=10');
    expect(none).toMatchObject({ delayOn: 'none', delayMs: 0 });
    expect(none.note).toMatch(/No delay needed/);
    // latency: a fill feed 10 ms late behind a fill 20 m closer (58.27 ms) needs 48.27 ms.
    expect((await get('align?main=30&fill=10&latency=10')).delayMs).toBeCloseTo(48.27, 2);
  });

  it('spl-sum: 94 dB at 0° and 94 dB at 180° is a null (superposition)', async () => {
    const sum = await get('spl-sum?levels=94,94&mode=coherent&phases=0,180');
    expect(sum.isNull).toBe(true);
    expect(sum.note).toMatch(/null/);
    expect((await get('spl-sum?levels=94,94&mode=coherent&phases=0,0')).isNull).toBeUndefined();
  });

  it('delay with rh: 30 °C / 90 % over 34.32 m takes 97.71 ms (Cramer 1993, per the issue)', async () => {
    expect((await get('delay?distance=34.32&temp=30&rh=90')).ms).toBeCloseTo(97.71, 2);
    expect((await get('delay?distance=34.32&temp=30')).ms).toBeCloseTo(98.33, 2);
  });

  it('weighting at the nominal 16 Hz answers IEC 61672-1 Table 3’s −56.7 dB and says it used 15.85 Hz', async () => {
    const w = await get('weighting?freq=16&curve=A');
    expect(w.db).toBeCloseTo(-56.7, 1);
    expect(w.exactHz).toBeCloseTo(15.849, 3);
    expect(w.note).toMatch(/nominal/);
  });

  it('messages keep the unit typed and show bounds unrounded (60 °C = 140 °F; 2000 m = 6561.67979 ft)', async () => {
    expect((await refused('delay?distance=10&temp=150&tempUnit=F')).error).toMatch(/140 °F; got 150 °F/);
    expect((await refused('delay?distance=6561.68&unit=ft')).error).toMatch(/at most 6561\.67979\d* ft; got 6561\.68 ft/);
  });

  it('distance from 1e-320 m is refused with a sentence, not −6306 dB', async () => {
    expect((await refused('distance?level=100&from=1e-320&to=20')).error).toMatch(/outside -50 to 200 dB/);
  });

  it('"1/3" is accepted as a width: Q = 4.32 (Audio EQ Cookbook; RaneNote 170 table, from memory)', async () => {
    expect((await get('band?octaves=1/3')).q).toBeCloseTo(4.318, 3);
    expect((await refused('band?octaves=1/0')).field).toBe('octaves');
  });
});

describe('new routes against outside values', () => {
  it('sub-top at 80 Hz, 180°: a polarity flip first, the 6.25 ms delay and ±1 cycle after (φ = 360°·f·t)', async () => {
    const { candidates, periodMs } = await get('sub-top?freq=80&phase=180');
    expect(periodMs).toBeCloseTo(12.5, 12);
    expect(candidates[0]).toMatchObject({ invertPolarity: true, delayMs: 0, phaseErrorDeg: 0 });
    const delays = candidates.filter((c: { invertPolarity: boolean }) => !c.invertPolarity).map((c: { delayMs: number }) => c.delayMs);
    expect(delays).toEqual(expect.arrayContaining([6.25, 18.75]));
  });

  it('level: +4 dBu = 1.228 V = 1.78 dBV; −20 dBFS at +24 dBu full scale = +4 dBu; 28.28 V into 8 Ω = 100 W (definitions)', async () => {
    const l = await get('level?value=4&unit=dBu');
    expect(l.volts).toBeCloseTo(1.2277, 4);
    expect(l.dBV).toBeCloseTo(1.78, 2);
    expect(l.dBFS).toBeCloseTo(-20, 12);
    expect(l.proConsumerGapDb).toBeCloseTo(11.78, 2);
    expect((await get('level?value=-20&unit=dBFS&fullScaleDbu=24')).dBu).toBeCloseTo(4, 12);
    expect((await get('level?value=28.2842712&unit=V&ohms=8')).watts).toBeCloseTo(100, 4);
  });

  it('wavelength of 1 kHz at 20 °C is 0.3432 m (λ = c/f, Kinsler et al.)', async () => {
    const w = await get('wavelength?freq=1000');
    expect(w.meters).toBeCloseTo(0.34321, 5);
    expect(w.feet).toBeCloseTo(0.34321 / 0.3048, 4);
  });

  it('comb: 1 ms → nulls 500, 1500, 2500 Hz (issue 13); 0.3432 m of path at 20 °C is the same 1 ms', async () => {
    expect((await get('comb?delayMs=1&upTo=3000')).nulls).toEqual([500, 1500, 2500]);
    const byPath = await get('comb?distance=0.343214622&upTo=3000');
    expect(byPath.nulls.map((f: number) => Math.round(f))).toEqual([500, 1500, 2500]);
  });

  it('impedance: four 8 Ω in parallel are 2 Ω, below a 4 Ω minimum (Kirchhoff)', async () => {
    expect(await get('impedance?ohms=8,8,8,8&wiring=parallel&minLoad=4')).toMatchObject({ ohms: 2, belowMinimum: true });
    expect((await get('impedance?ohms=8,8&wiring=series')).ohms).toBe(16);
    expect((await get('impedance?ohms=8,8&wiring=series')).belowMinimum).toBeUndefined();
  });

  it('max-spl: 100 dB, 1000 W, 32 m → 99.90 dB (issue 13), with the power-compression caution', async () => {
    const m = await get('max-spl?sensitivity=100&power=1000&distance=32');
    expect(m.level).toBeCloseTo(99.9, 2);
    expect(m.caution).toMatch(/power compression/);
    expect((await get('max-spl?sensitivity=100&power=1000&distance=32&boxes=2')).level).toBeCloseTo(105.92, 2);
    expect((await get('max-spl?sensitivity=100&sensitivityRef=2.83V&ohms=4&power=1&distance=1')).level).toBeCloseTo(96.99, 2);
  });

  it('dose: OSHA App. A example → 93.8 %, TWA 89.5 (29 CFR 1910.95 App. A, from memory); NIOSH 88:4 → 100 %; EU 85:8 → upper', async () => {
    const osha = await get('dose?segments=110:0.25,100:0.5,90:1.5&standard=osha');
    expect(osha.dosePercent).toBeCloseTo(93.75, 2);
    expect(osha.twa).toBeCloseTo(89.5, 1);
    expect((await get('dose?segments=88:4&standard=niosh')).dosePercent).toBeCloseTo(100, 9);
    expect(await get('dose?segments=85:8&standard=eu')).toMatchObject({ lex8h: 85, actionLevel: 'upper' });
    expect((await get('dose?segments=120:0.1&standard=osha')).notPermitted).toBe(true);
  });

  it('leq: 90 and 100 dB average to 97.40 dB (IEC 61672-1 time-average level); over a 100 dB limit', async () => {
    const l = await get('leq?levels=90,100&limit=97');
    expect(l.leq).toBeCloseTo(97.404, 3);
    expect(l.overLimit).toBe(true);
  });

  it('air: 20 °C, 70 % RH, 1 kHz octave → 5.0 dB/km (ISO 9613-2 Table 2, from memory); α·d over 200 m', async () => {
    const a = await get('air?freq=1000&distance=200&temp=20&rh=70');
    expect(a.perKmDb).toBeCloseTo(5.0, 1);
    expect(a.attenuationDb).toBeCloseTo(a.perKmDb / 5, 12);
  });

  it('sub-array: 60 Hz gradient → 1.43 m, 4.17 ms, inverted (λ/4 and T/4; common practice)', async () => {
    expect(await get('sub-array?freq=60&kind=gradient')).toMatchObject({ invertPolarity: true, delayOn: 'rear' });
    const g = await get('sub-array?freq=60&kind=gradient');
    expect(g.spacing).toBeCloseTo(1.43, 2);
    expect(g.delayMs).toBeCloseTo(4.1667, 4);
    expect((await get('sub-array?freq=60&kind=end-fire')).invertPolarity).toBe(false);
  });
});
