import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { structuralDiff } from './structural-diff';
import { docPlainText } from './render-html';
import { newCrossoverBlock, newDelayBlock, newEqBlock } from './blocks/block-data';
import type { PmNode } from './types';

const doc = (...content: PmNode[]): PmNode => ({ type: 'doc', content });
const para = (text: string, marks?: PmNode['marks']): PmNode => ({ type: 'paragraph', content: [{ type: 'text', text, ...(marks ? { marks } : {}) }] });
const cell = (text: string): PmNode => ({ type: 'tableCell', content: [para(text)] });
const table = (rows: string[][]): PmNode => ({ type: 'table', content: rows.map((r) => ({ type: 'tableRow', content: r.map(cell) })) });
const lines = (a: PmNode, b: PmNode) => structuralDiff(a, b).flatMap((c) => [c.title, ...c.lines]);

describe('structural diff names every kind of change', () => {
  it('EQ bands in words: "Band 3: 250 → 315 Hz, −3.0 → −4.5 dB, Q 1.4 → 2.0"', () => {
    const eq = newEqBlock();
    const bands = [eq.bands[0]!, eq.bands[1]!, { type: 'peaking' as const, freq: 250, gain: -3, q: 1.4, on: true }];
    const before = { type: 'eqBlock', attrs: { ...eq, label: 'Mains', bands } };
    const after = { type: 'eqBlock', attrs: { ...eq, label: 'Mains', bands: [bands[0], { ...bands[1]!, on: false }, { ...bands[2]!, freq: 315, gain: -4.5, q: 2 }] } };
    const changes = structuralDiff(doc(before), doc(after));
    expect(changes[0]!.title).toBe('EQ "Mains": 2 changes');
    expect(changes[0]!.lines).toEqual(['Band 2: switched off', 'Band 3: 250 → 315 Hz, −3.0 → −4.5 dB, Q 1.4 → 2.0']);
    expect(changes[0]!.block?.before).toEqual(before.attrs);
  });

  it('crossover ways: "Sub delay 4.1 → 5.3 ms", polarity, edges; bands added and removed', () => {
    const x = newCrossoverBlock();
    const before = { ...x, ways: [{ ...x.ways[0]!, delayMs: 4.1 }, x.ways[1]!] };
    const after = { ...x, ways: [{ ...x.ways[0]!, delayMs: 5.3 }, { ...x.ways[1]!, polarity: 'inverted' as const, highPass: { family: 'linkwitz-riley' as const, slope: 24, freq: 100 } }] };
    expect(lines(doc({ type: 'crossoverBlock', attrs: before }), doc({ type: 'crossoverBlock', attrs: after }))).toEqual([
      'Crossover "Sub / main crossover": 3 changes',
      'Sub delay 4.1 → 5.3 ms',
      'Main high-pass LR24 at 90 Hz → LR24 at 100 Hz',
      'Main polarity normal → inverted',
    ]);
    const eq = newEqBlock();
    const more = { ...eq, bands: [...eq.bands, { type: 'notch' as const, freq: 3150, gain: 0, q: 8, on: true }] };
    expect(lines(doc({ type: 'eqBlock', attrs: eq }), doc({ type: 'eqBlock', attrs: more }))).toContain('Band 3 added: Notch 3.15 kHz Q 8');
    expect(lines(doc({ type: 'eqBlock', attrs: more }), doc({ type: 'eqBlock', attrs: eq }))).toContain('Band 3 removed: Notch 3.15 kHz Q 8');
  });

  it('delay rows and whole blocks added or removed', () => {
    const d = newDelayBlock();
    const after = { ...d, rows: [{ ...d.rows[0]!, distance: 12 }] };
    const l = lines(doc({ type: 'delayBlock', attrs: d }), doc({ type: 'delayBlock', attrs: after }));
    expect(l[1]).toMatch(/^Front fill: distance 10 m → 12 m, delay 29\.\d\d → 34\.\d\d ms$/);
    expect(lines(doc(para('x')), doc(para('x'), { type: 'delayBlock', attrs: d }))).toEqual(['Delays "Delays" block added']);
    expect(lines(doc(para('x'), { type: 'delayBlock', attrs: d }), doc(para('x')))).toEqual(['Delays "Delays" block removed']);
  });

  it('tables row by row, naming row and column', () => {
    const a = table([['Ch', 'Source', 'Mic'], ['1', 'Kick', 'Beta 91'], ['2', 'Snare', 'SM57']]);
    const b = table([['Ch', 'Source', 'Mic'], ['1', 'Kick', 'Beta 91'], ['2', 'Snare', 'e906'], ['3', 'Hat', 'KM184']]);
    expect(lines(doc(a), doc(b))).toEqual(['Table 1: 2 cells changed', 'row 3 (2), column "Mic": "SM57" → "e906"', 'row 4 (3) added: 3 | Hat | KM184']);
  });

  it('photos added and removed, link targets changed, checklist ticks', () => {
    const img = (src: string, alt: string): PmNode => ({ type: 'image', attrs: { src, alt } });
    expect(lines(doc(img('/files/a/display', 'Rack A')), doc(img('/files/b/display', 'Rack B')))).toEqual(['Photos: 2 changes', 'Photo added: "Rack B"', 'Photo removed: "Rack A"']);
    const link = (href: string) => para('rigging plot', [{ type: 'link', attrs: { href } }]);
    expect(lines(doc(link('/files/x')), doc(link('/files/y')))).toEqual(['Links: 1 change', 'Link "rigging plot" now points to /files/y (was /files/x)']);
    const task = (checked: boolean): PmNode => ({ type: 'taskList', content: [{ type: 'taskItem', attrs: { checked }, content: [para('Ring out wedges')] }] });
    expect(lines(doc(task(false)), doc(task(true)))).toEqual(['Checklist: 1 tick changed', 'Ticked: "Ring out wedges"']);
    expect(lines(doc(task(true)), doc(task(false)))).toContain('Unticked: "Ring out wedges"');
  });

  it('identical documents have no changes; formatting-only changes are still named', () => {
    expect(structuralDiff(doc(para('a')), doc(para('a')))).toEqual([]);
    expect(lines(doc(para('a')), doc(para('a', [{ type: 'bold' }])))[0]).toBe('Formatting or layout changed');
  });
});

// Random documents and random edits: whenever two documents differ, either their text differs or
// the structural diff names at least one change, so history can never say "the same text" for them.
const word = fc.constantFrom('kick', 'snare', 'FOH', 'amp', '48V', 'sub', 'x');
const inline = fc.record({ text: word, bold: fc.boolean(), href: fc.option(fc.constantFrom('/a', '/b', 'https://example.org'), { nil: undefined }) });
const paragraphArb = fc.array(inline, { minLength: 1, maxLength: 3 }).map((parts): PmNode => ({
  type: 'paragraph',
  content: parts.map((p) => ({ type: 'text', text: p.text, ...(p.bold || p.href ? { marks: [...(p.bold ? [{ type: 'bold' }] : []), ...(p.href ? [{ type: 'link', attrs: { href: p.href } }] : [])] } : {}) })),
}));
const taskArb = fc.tuple(word, fc.boolean()).map(([t, checked]): PmNode => ({ type: 'taskList', content: [{ type: 'taskItem', attrs: { checked }, content: [para(t)] }] }));
const tableArb = fc.array(fc.array(word, { minLength: 2, maxLength: 2 }), { minLength: 1, maxLength: 3 }).map(table);
const imageArb = fc.constantFrom('/files/a', '/files/b').map((src): PmNode => ({ type: 'image', attrs: { src, alt: '' } }));
const eqArb = fc.tuple(fc.constantFrom(100, 250, 1000), fc.constantFrom(-3, 0, 2), fc.boolean()).map(([freq, gain, on]): PmNode => ({ type: 'eqBlock', attrs: { ...newEqBlock(), bands: [{ type: 'peaking', freq, gain, q: 1.4, on }] } }));
const blockArb = fc.oneof(paragraphArb, taskArb, tableArb, imageArb, eqArb);

describe('never "the same text" for different documents (property)', () => {
  it('over random documents and edits', () => {
    fc.assert(
      fc.property(fc.array(blockArb, { minLength: 1, maxLength: 5 }), fc.array(blockArb, { minLength: 1, maxLength: 5 }), (a, b) => {
        const before = doc(...a);
        const after = doc(...b);
        const textChanged = docPlainText(before) !== docPlainText(after);
        const changes = structuralDiff(before, after, textChanged);
        if (JSON.stringify(before) !== JSON.stringify(after)) expect(textChanged || changes.length > 0).toBe(true);
        else expect(changes).toEqual([]);
      }),
      { seed: 20261203, numRuns: 400 },
    );
  });
  it('single edits of one part (property)', () => {
    fc.assert(
      fc.property(fc.array(blockArb, { minLength: 1, maxLength: 5 }), fc.nat(), blockArb, (parts, at, replacement) => {
        const i = at % parts.length;
        const before = doc(...parts);
        const after = doc(...parts.map((p, j) => (j === i ? replacement : p)));
        const textChanged = docPlainText(before) !== docPlainText(after);
        const changes = structuralDiff(before, after, textChanged);
        if (JSON.stringify(before) !== JSON.stringify(after)) expect(textChanged || changes.length > 0).toBe(true);
      }),
      { seed: 7, numRuns: 400 },
    );
  });
});
