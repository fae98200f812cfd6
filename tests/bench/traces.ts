import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { newEqBlock, newTraceRef } from '~/lib/doc/blocks/block-data';
import { eqPlotSvg } from '~/lib/doc/render-blocks';
import { parseTrace } from '~/lib/traces/parse-trace';

function timeIt(work: () => void, minMs = 600): number {
  let runs = 0;
  const start = performance.now();
  while (performance.now() - start < minMs) {
    work();
    runs++;
  }
  return (performance.now() - start) / runs;
}

/** An invented 100,000-point export: frequency, magnitude, phase, coherence, tab-separated. */
function bigTrace(points: number, tilt: number): string {
  const lines = ['# invented bench trace', 'Hz\tdB\tdeg\tcoh'];
  for (let i = 0; i < points; i++) {
    const hz = 20 * 1000 ** (i / (points - 1));
    lines.push(`${hz.toFixed(4)}\t${(80 + tilt * Math.log2(hz / 1000) + Math.sin(i / 50)).toFixed(3)}\t${((i * 7) % 360 - 180).toFixed(1)}\t${(0.6 + 0.4 * Math.cos(i / 300) ** 2).toFixed(3)}`);
  }
  return lines.join('\n');
}

/**
 * Parsing runs once per upload on the server; drawing runs on every read of the page. The
 * baseline is the least any reader must do with the same text: split it into lines and fields
 * and turn each field into a number.
 */
export function benchTraces(): void {
  const text = bigTrace(100_000, -1);
  const baselineMs = timeIt(() => {
    let sink = 0;
    for (const line of text.split('\n')) for (const f of line.split('\t')) sink += Number(f) || 0;
    if (Number.isNaN(sink)) throw new Error('unreachable');
  });
  const parseMs = timeIt(() => parseTrace(text));

  // Memory kept by one parsed trace: heap before and after holding ten of them, collected both
  // times (without a full collection the difference is noise, and could even come out negative).
  setFlagsFromString('--expose-gc');
  const gc = runInNewContext('gc') as () => void;
  gc();
  const heapBefore = process.memoryUsage().heapUsed;
  const kept = Array.from({ length: 10 }, () => parseTrace(text));
  gc();
  const perTraceMb = (process.memoryUsage().heapUsed - heapBefore) / 10 / 1024 / 1024;

  const before = kept[0]!;
  const after = parseTrace(bigTrace(100_000, 0));
  const lookup = new Map([
    ['a'.repeat(21), { trace: before, originalName: 'before.txt' }],
    ['b'.repeat(21), { trace: after, originalName: 'after.txt' }],
  ]);
  const block = { ...newEqBlock(), traces: [newTraceRef('a'.repeat(21), 'before retune'), newTraceRef('b'.repeat(21), 'after')], compare: { before: 'a'.repeat(21), after: 'b'.repeat(21) } };
  const bare = eqPlotSvg(newEqBlock(), 'bench');
  const withTraces = eqPlotSvg(block, 'bench', undefined, undefined, lookup);
  const drawMs = timeIt(() => eqPlotSvg(block, 'bench', undefined, undefined, lookup));
  const bareMs = timeIt(() => eqPlotSvg(newEqBlock(), 'bench'));

  console.log('\nMeasured traces (100,000 points, 4 columns, ' + (text.length / 1e6).toFixed(1) + ' MB of text)');
  console.log(`baseline: split lines and fields, Number() each   ${baselineMs.toFixed(1)} ms   ×1.00`);
  console.log(`parseTrace                                        ${parseMs.toFixed(1)} ms   ×${(parseMs / baselineMs).toFixed(2)} of baseline`);
  console.log(`heap kept per parsed trace                        ${perTraceMb.toFixed(2)} MB`);
  console.log(`EQ plot SVG: no traces ${(bare.length / 1024).toFixed(1)} KiB; two traces + difference ${(withTraces.length / 1024).toFixed(1)} KiB`);
  console.log(`drawing it: ${drawMs.toFixed(1)} ms   ×${(drawMs / bareMs).toFixed(2)} of the same plot without traces`);
}
