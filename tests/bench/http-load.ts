/** A small closed-loop load generator: `concurrency` clients, each sending the next request when the last one answers. */
export interface LoadResult {
  requests: number;
  seconds: number;
  perSecond: number;
  p50ms: number;
  p95ms: number;
  failures: number;
}

export async function load(url: string, init: RequestInit, options: { seconds: number; concurrency: number }): Promise<LoadResult> {
  const latencies: number[] = [];
  let failures = 0;
  const end = performance.now() + options.seconds * 1000;
  const started = performance.now();
  async function client() {
    while (performance.now() < end) {
      const t0 = performance.now();
      const res = await fetch(url, init);
      await res.arrayBuffer();
      if (res.status >= 400) failures++;
      latencies.push(performance.now() - t0);
    }
  }
  await Promise.all(Array.from({ length: options.concurrency }, client));
  const seconds = (performance.now() - started) / 1000;
  latencies.sort((a, b) => a - b);
  const at = (q: number) => latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? 0;
  return { requests: latencies.length, seconds, perSecond: latencies.length / seconds, p50ms: at(0.5), p95ms: at(0.95), failures };
}
