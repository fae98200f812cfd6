/**
 * Upload processing benchmark, run by hand: `npx tsx src/cli/bench-upload.ts`.
 *
 * Measures the server's photo pipeline (src/server/files/process-image.ts: header check, rotate,
 * metadata-free full-size JPEG, 1600 px WebP, 400 px WebP) on a synthetic 24-megapixel camera
 * JPEG, against baselines measured in the same run on the same machine:
 *   - "re-encode only": sharp decoding the same file and writing it back as JPEG, no resizing;
 *   - "2 MP photo": the same pipeline on a 1728 × 1152 photo.
 * Also the 24-MP photo tagged "rotate 90°" (a phone held upright), where the turn needs the
 * whole decoded image in memory.
 * Each measurement runs in its own child process, because peak RSS only ever grows within one.
 * Numbers are medians of RUNS; compare the ratios, not the absolute times, across machines.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';

const RUNS = 3;
type Mode = 'pipeline' | 'reencode';

interface Sample {
  ms: number;
  peakRssMb: number;
  idleRssMb: number;
}

async function child(mode: Mode, path: string): Promise<void> {
  const { processImage } = await import('~/server/files/process-image');
  // Load libvips and warm the code paths on a tiny image, so the sample is the work itself.
  const warm = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#888' } }).jpeg().toBuffer();
  await sharp(warm).jpeg().toBuffer();
  const idleRssMb = process.memoryUsage().rss / 1048576;
  const started = performance.now();
  if (mode === 'pipeline') await processImage(path, 'jpeg');
  else await sharp(path).jpeg({ quality: 90 }).toBuffer();
  const ms = performance.now() - started;
  const sample: Sample = { ms, peakRssMb: process.resourceUsage().maxRSS / 1024, idleRssMb };
  process.stdout.write(JSON.stringify(sample));
}

function measure(mode: Mode, path: string): Sample {
  const samples: Sample[] = [];
  for (let i = 0; i < RUNS; i++) {
    const res = spawnSync(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--child', mode, path], { encoding: 'utf8' });
    if (res.status !== 0) throw new Error(`benchmark child failed:\n${res.stderr}`);
    samples.push(JSON.parse(res.stdout) as Sample);
  }
  const median = (pick: (s: Sample) => number) => samples.map(pick).sort((a, b) => a - b)[Math.floor(samples.length / 2)];
  return { ms: median((s) => s.ms), peakRssMb: median((s) => s.peakRssMb), idleRssMb: median((s) => s.idleRssMb) };
}

/** Film-grain-like noise at half resolution, scaled up: it compresses like a real photo (~11 MB). */
async function syntheticPhoto(path: string, width: number, height: number, orientation = 1): Promise<void> {
  const w = width / 2;
  const h = height / 2;
  const grain = await sharp({ create: { width: w, height: h, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 120, sigma: 30 } } }).raw().toBuffer();
  await sharp(grain, { raw: { width: w, height: h, channels: 3 } }).resize(width, height, { kernel: 'cubic' }).jpeg({ quality: 90 }).withMetadata({ orientation }).toFile(path);
}

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'throwline-bench-'));
  try {
    const big = join(dir, 'photo-24mp.jpg');
    const small = join(dir, 'photo-2mp.jpg');
    const portrait = join(dir, 'photo-24mp-portrait.jpg');
    await syntheticPhoto(big, 6000, 4000);
    await syntheticPhoto(portrait, 6000, 4000, 6);
    await syntheticPhoto(small, 1728, 1152);
    const mb = (p: string) => (statSync(p).size / 1e6).toFixed(1);
    console.log(`Inputs: 6000×4000 JPEG ${mb(big)} MB; 1728×1152 JPEG ${mb(small)} MB. Node ${process.version}, sharp ${sharp.versions.sharp}, libvips ${sharp.versions.vips}, ${RUNS} runs each, medians.`);

    const pipeline = measure('pipeline', big);
    const reencode = measure('reencode', big);
    const pipelineSmall = measure('pipeline', small);
    const pipelinePortrait = measure('pipeline', portrait);
    const row = (label: string, s: Sample) =>
      `${label.padEnd(34)} ${s.ms.toFixed(0).padStart(6)} ms   peak RSS ${s.peakRssMb.toFixed(0).padStart(4)} MB (idle ${s.idleRssMb.toFixed(0)} MB, +${(s.peakRssMb - s.idleRssMb).toFixed(0)} MB)`;
    console.log(row('24 MP, upload pipeline', pipeline));
    console.log(row('24 MP, re-encode only (baseline)', reencode));
    console.log(row('2 MP, upload pipeline (baseline)', pipelineSmall));
    console.log(row('24 MP, EXIF "rotate 90°", pipeline', pipelinePortrait));
    const ratio = (a: number, b: number) => (a / b).toFixed(2);
    console.log(`Pipeline vs re-encode only: time ×${ratio(pipeline.ms, reencode.ms)}, peak RSS ×${ratio(pipeline.peakRssMb, reencode.peakRssMb)}, added memory ×${ratio(pipeline.peakRssMb - pipeline.idleRssMb, reencode.peakRssMb - reencode.idleRssMb)}`);
    console.log(`24 MP vs 2 MP pipeline:     time ×${ratio(pipeline.ms, pipelineSmall.ms)}, peak RSS ×${ratio(pipeline.peakRssMb, pipelineSmall.peakRssMb)} (pixels ×12)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const childAt = process.argv.indexOf('--child');
if (childAt >= 0) await child(process.argv[childAt + 1] as Mode, process.argv[childAt + 2]);
else await main();
