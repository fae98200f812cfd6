import { describe, expect, it } from 'vitest';
import { parseTrace, TRACE_LIMITS, TraceParseError } from './parse-trace';

function refusal(text: string): TraceParseError {
  try {
    parseTrace(text);
  } catch (e) {
    expect(e).toBeInstanceOf(TraceParseError);
    return e as TraceParseError;
  }
  throw new Error('expected the trace to be refused');
}

describe('parseTrace: the layouts engineers export', () => {
  it('reads tab-separated columns with a header line and comments', () => {
    const t = parseTrace('# measured at mix position\nFreq(Hz)\tMag(dB)\n20\t-3.5\n25\t-2.25\n31.5\t-1\n');
    expect(t.freqHz).toEqual([20, 25, 31.5]);
    expect(t.magnitudeDb).toEqual([-3.5, -2.25, -1]);
    expect(t.phaseDeg).toBeUndefined();
  });

  it('reads semicolons with decimal commas', () => {
    const t = parseTrace('* export\nHz;dB;deg\n20,5;-3,5;120,25\n40;-1,0;-90\n');
    expect(t).toEqual({ freqHz: [20.5, 40], magnitudeDb: [-3.5, -1], phaseDeg: [120.25, -90] });
  });

  it('reads commas with decimal points, and CRLF line ends', () => {
    const t = parseTrace('frequency,magnitude,phase,coherence\r\n100,0.5,10,0.98\r\n200,-0.5,-10,0.4\r\n');
    expect(t).toEqual({ freqHz: [100, 200], magnitudeDb: [0.5, -0.5], phaseDeg: [10, -10], coherence: [0.98, 0.4] });
  });

  it('reads runs of spaces, with decimal points or decimal commas', () => {
    expect(parseTrace('  100    1.5\n 1000   -2.5e0 \n').magnitudeDb).toEqual([1.5, -2.5]);
    expect(parseTrace('100 1,5\n1000 -2,5\n').magnitudeDb).toEqual([1.5, -2.5]);
  });

  it('takes a third column as coherence when its header says so, else as phase', () => {
    expect(parseTrace('Hz\tdB\tCoherence\n100\t0\t0.9\n200\t1\t0.5\n').coherence).toEqual([0.9, 0.5]);
    expect(parseTrace('Hz\tdB\tPhase\n100\t0\t90\n200\t1\t45\n').phaseDeg).toEqual([90, 45]);
  });

  it('skips comment lines starting with # * ; and text lines anywhere', () => {
    const t = parseTrace('; a\n100\t1\n# note between points\nEND OF BLOCK\n200\t2\n');
    expect(t.freqHz).toEqual([100, 200]);
  });

  it('keeps a long header or comment line, but not a long data line', () => {
    expect(parseTrace(`# ${'x'.repeat(10_000)}\n100\t1\n200\t2\n`).freqHz).toHaveLength(2);
    expect(refusal(`100\t1\n${'1'.repeat(1000)}\n`).line).toBe(2);
  });
});

describe('parseTrace: refusals name the line and what was wrong', () => {
  it('refuses NaN, Infinity and numbers too large to be finite', () => {
    expect(refusal('100\t1\n200\tNaN\n').message).toMatch(/^Line 2: "NaN" is not a number/);
    expect(refusal('100\tInfinity\n').line).toBe(1);
    expect(refusal('100\t1\n200\t1e400\n').message).toMatch(/^Line 2:/);
  });

  it('refuses negative, zero and falling frequencies', () => {
    expect(refusal('-100\t1\n200\t2\n').message).toMatch(/^Line 1: the frequency -100 Hz is outside/);
    expect(refusal('0\t1\n200\t2\n').line).toBe(1);
    const falling = refusal('100\t1\n200\t2\n150\t3\n');
    expect(falling.message).toBe('Line 3: the frequency 150 Hz does not rise above the line before (200 Hz); frequencies must rise from line to line.');
    expect(refusal('100\t1\n100\t2\n').line).toBe(2);
  });

  it('refuses mixed separators and a changing column count', () => {
    expect(refusal('100\t1\n200,2\n').message).toMatch(/^Line 2: found 1 values where the file's first data line has 2 numbers separated by tabs/);
    expect(refusal('100;1,5\n200;2.5\n').message).toMatch(/^Line 2: "2\.5" is not a number/);
    expect(refusal('100\t1\t5\n200\t2\n').line).toBe(2);
  });

  it('refuses coherence outside 0–1 and magnitudes no analyser produces', () => {
    expect(refusal('100\t1\t0\t1.5\n').message).toMatch(/coherence 1\.5 is outside 0 to 1/);
    expect(refusal('100\t1000\n').message).toMatch(/magnitude 1000 dB is outside/);
  });

  it('refuses binary data and files without two points', () => {
    expect(refusal('100\t1\n\u0000\u0001\u0002').message).toMatch(/binary data/);
    expect(refusal('\uFFFD\uFFFDPNG').message).toMatch(/binary data/);
    expect(refusal('').message).toMatch(/fewer than two lines of numbers/);
    expect(refusal('# only a comment\n100\t1\n').message).toMatch(/fewer than two/);
    expect(refusal('100 200 300 400 500\n').message).toMatch(/^Line 1: expected 2 to 4 numbers/);
  });

  it('stops at the point cap on a file of a million lines, naming the first line past it', () => {
    const lines = Array.from({ length: 1_000_000 }, (_, i) => `${i + 1}\t0`);
    const e = refusal(lines.join('\n'));
    expect(e.line).toBe(TRACE_LIMITS.maxPoints + 1);
    expect(e.message).toMatch(/more than 100,000 points/);
  });

  it('accepts exactly the cap', () => {
    const lines = Array.from({ length: TRACE_LIMITS.maxPoints }, (_, i) => `${(i + 1) * 0.2}\t0`);
    expect(parseTrace(lines.join('\n')).freqHz).toHaveLength(TRACE_LIMITS.maxPoints);
  });

  it('refuses a single 25 MiB line quickly, without reading it as numbers', () => {
    const e = refusal('9'.repeat(25 * 1024 * 1024));
    expect(e.line).toBe(1);
    expect(e.message).toMatch(/characters long/);
  });
});
