import { describe, expect, it } from 'vitest';
import { processorBlockProblem } from '~/lib/schemas/processor-blocks';
import { renderDocHtml } from '~/lib/doc/render-html';
import { fileRefsInDoc } from '~/lib/doc/file-refs';
import { newEqBlock, newTraceRef, type EqBlockAttrs } from './block-data';
import { blockCurveText } from './block-curve-text';
import { parseTrace } from '~/lib/traces/parse-trace';

const freqHz = Array.from({ length: 600 }, (_, i) => 20 * 1000 ** (i / 599));
const flat = (db: number) => ({ trace: { freqHz, magnitudeDb: freqHz.map(() => db) }, originalName: 'sweep.txt' });

function eq(attrs: Partial<EqBlockAttrs>): EqBlockAttrs {
  return { ...newEqBlock(), bands: [], ...attrs };
}

/** The y coordinates of every point of the first path with this class. */
function pathYs(svg: string, cls: string): number[] {
  const m = new RegExp(`<path class="tl-curve ${cls}[^"]*" d="([^"]+)"`).exec(svg);
  if (!m) throw new Error(`no path ${cls}`);
  return [...m[1]!.matchAll(/[ML]\s*[-\d.]+[ ,]([-\d.]+)/g)].map((x) => Number(x[1]));
}

describe('measured traces on an EQ block', () => {
  it('draws a trace at its level plus the offset, on the plot’s own scale', () => {
    // A block with no bands is flat at 0 dB; an 80 dB trace moved by −80 dB must sit on that line.
    const block = eq({ traces: [{ ...newTraceRef('t1', 'before'), offsetDb: -80, smoothing: 0 }] });
    const html = renderDocHtml({ type: 'doc', content: [{ type: 'eqBlock', attrs: block }] }, { blockContext: { traces: new Map([['t1', flat(80)]]) } });
    const svg = html.slice(html.indexOf('<svg'), html.indexOf('</svg>') + 6);
    const zero = pathYs(svg, 'tl-curve-total')[0]!;
    const ys = pathYs(svg, 'tl-curve-trace ');
    expect(ys.length).toBeGreaterThan(100);
    for (const y of ys) expect(y).toBeCloseTo(zero, 0);
    expect(html).toContain('sweep.txt</a> (600 points)');
  });

  it('draws the difference of two traces: after 3 dB above before reads +3 dB', () => {
    const block = eq({
      traces: [newTraceRef('b', 'before'), newTraceRef('a', 'after')].map((t) => ({ ...t, smoothing: 0 as const })),
      compare: { before: 'b', after: 'a' },
    });
    const html = renderDocHtml({ type: 'doc', content: [{ type: 'eqBlock', attrs: block }] }, { blockContext: { traces: new Map([['b', flat(0)], ['a', flat(3)]]) } });
    const ys = pathYs(html, 'tl-curve-difference');
    const zero = pathYs(html, 'tl-curve-total')[0]!;
    // The plot range is fitted to the computed curves and the difference; +3 dB is above 0 dB.
    for (const y of ys) expect(y).toBeLessThan(zero);
    expect(html).toContain('data-label="after − before"');
  });

  it('lists a trace whose file is gone as unavailable instead of dropping it', () => {
    const block = eq({ traces: [newTraceRef('gone', 'mix position')] });
    const html = renderDocHtml({ type: 'doc', content: [{ type: 'eqBlock', attrs: block }] }, { blockContext: { traces: new Map() } });
    expect(html).toMatch(/mix position<\/th>.*unavailable: the file was removed/);
    expect(html).not.toContain('tl-curve-trace');
  });

  it('counts attached traces as files the page shows', () => {
    const doc = { type: 'doc', content: [{ type: 'eqBlock', attrs: eq({ traces: [newTraceRef('abc123', 'after')] }) }] };
    expect(fileRefsInDoc(doc)).toEqual([{ kind: 'trace', fileId: 'abc123', url: '/files/abc123', label: 'after' }]);
  });
});

describe('trace attributes are checked on the server', () => {
  const ref = newTraceRef('abc', 'before');
  it.each([
    [{ traces: [{ ...ref, fileId: '../etc' }] }, /trace 1, file must be the id of a trace file/],
    [{ traces: [{ ...ref, smoothing: 5 }] }, /trace 1, smoothing must be 0 \(none\), 3, 6 or 12/],
    [{ traces: [{ ...ref, offsetDb: Number.NaN }] }, /trace 1, level offset \(dB\) must be/],
    [{ traces: [{ ...ref, date: '2026-02-30' }] }, /trace 1, date must be a date written YYYY-MM-DD/],
    [{ traces: [ref, ref] }, /trace 2, file is attached twice/],
    [{ traces: Array.from({ length: 9 }, (_, i) => newTraceRef(`t${i}`)) }, /traces must hold 0 to 8 traces; got 9/],
    [{ traces: [ref], compare: { before: 'abc', after: 'nope' } }, /comparison must name two traces attached to this block/],
  ])('%j is refused', (patch, message) => {
    expect(processorBlockProblem('eqBlock', eq(patch as Partial<EqBlockAttrs>))).toMatch(message);
  });

  it('accepts blocks saved before traces existed, and a full set', () => {
    const { traces: _t, compare: _c, ...old } = newEqBlock();
    expect(processorBlockProblem('eqBlock', old)).toBeNull();
    expect(processorBlockProblem('eqBlock', eq({ traces: [ref, newTraceRef('def', 'after')], compare: { before: 'abc', after: 'def' } }))).toBeNull();
  });
});

describe('blockCurveText', () => {
  it('exports the computed curve as columns the trace parser reads back', () => {
    const block = eq({ bands: [{ type: 'peaking', freq: 1000, gain: 6, q: 1.41, on: true }] });
    const text = blockCurveText({ type: 'eqBlock', attrs: block }, 'Mains EQ')!;
    const back = parseTrace(text);
    const at1k = back.freqHz.reduce((best, f, i) => (Math.abs(Math.log(f / 1000)) < Math.abs(Math.log(back.freqHz[best]! / 1000)) ? i : best), 0);
    // Audio EQ Cookbook: a peaking band reads its full gain at f0.
    expect(back.magnitudeDb[at1k]).toBeGreaterThan(5.8);
    expect(blockCurveText({ type: 'delayBlock', attrs: {} }, 'x')).toBeNull();
  });
});

