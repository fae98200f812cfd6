import { cascadeResponse, logFrequencyGrid, type FilterSpec } from '~/lib/acoustics';

function timeIt(work: () => void, minMs = 400): number {
  let runs = 0;
  const start = performance.now();
  while (performance.now() - start < minMs) {
    work();
    runs++;
  }
  return (performance.now() - start) / runs;
}

/**
 * The filter plot is recomputed on every keystroke on a phone, so its cost matters. The
 * baseline is the bare complex arithmetic it cannot avoid: evaluating one biquad's transfer
 * function at the same points, written inline.
 */
export function benchAcoustics(): void {
  const freqs = logFrequencyGrid(10, 24_000, 512);
  const sampleRateHz = 48_000;
  const baselineMs = timeIt(() => {
    const [b0, b1, b2, a1, a2] = [0.2, 0.4, 0.2, -0.3, 0.1];
    let sink = 0;
    for (const f of freqs) {
      const w = (2 * Math.PI * f) / sampleRateHz;
      const c1 = Math.cos(w), s1 = Math.sin(w), c2 = Math.cos(2 * w), s2 = Math.sin(2 * w);
      const nr = b0 + b1 * c1 + b2 * c2, ni = -(b1 * s1 + b2 * s2);
      const dr = 1 + a1 * c1 + a2 * c2, di = -(a1 * s1 + a2 * s2);
      sink += Math.hypot(nr, ni) / Math.hypot(dr, di);
    }
    if (sink < 0) throw new Error('unreachable');
  });
  const tenBands: FilterSpec[] = [
    { type: 'crossover-high', freq: 90, family: 'linkwitz-riley', slope: 24 },
    ...[63, 125, 250, 500, 1000, 2000, 4000, 8000].map((freq) => ({ type: 'peaking' as const, freq, gain: -3, q: 2 })),
    { type: 'highshelf', freq: 10_000, gain: 2 },
  ];
  const cascadeMs = timeIt(() => cascadeResponse(tenBands, freqs, sampleRateHz));
  console.log('\nAcoustics core (512 log-spaced points)');
  console.log(`baseline: one biquad, inline arithmetic          ${(baselineMs * 1000).toFixed(1)} µs   ×1.00`);
  console.log(`cascadeResponse: LR24 + 8 peaking + shelf        ${(cascadeMs * 1000).toFixed(1)} µs   ×${(cascadeMs / baselineMs).toFixed(2)} of baseline (11 sections)`);
}
