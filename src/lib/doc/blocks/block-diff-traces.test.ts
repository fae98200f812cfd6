import { describe, expect, it } from 'vitest';
import { blockChanges } from './block-diff';
import { CROSSOVER_BLOCK, EQ_BLOCK, newCrossoverBlock, newEqBlock, newTraceRef } from './block-data';

const A = 'a'.repeat(21);
const B = 'b'.repeat(21);

describe('history diff of the traces a block carries', () => {
  const base = newEqBlock();
  const before = { ...newTraceRef(A, 'before retune') };
  const after = { ...newTraceRef(B, 'after') };

  it('names a trace attached by its label', () => {
    expect(blockChanges(EQ_BLOCK, { ...base, traces: [before] }, { ...base, traces: [before, after] })).toEqual(['Trace "after" attached']);
  });

  it('names a trace removed by its label, and the comparison that went with it', () => {
    const changes = blockChanges(EQ_BLOCK, { ...base, traces: [before, after], compare: { before: A, after: B } }, { ...base, traces: [before], compare: null });
    expect(changes).toEqual(['Trace "after" removed', 'Comparison "after" − "before retune" → none']);
  });

  it('says so when a trace is relabelled or its offset changes, and nothing when nothing did', () => {
    expect(blockChanges(EQ_BLOCK, { ...base, traces: [before] }, { ...base, traces: [{ ...before, label: 'old tune' }] })).toEqual(['Trace renamed "before retune" → "old tune"']);
    expect(blockChanges(EQ_BLOCK, { ...base, traces: [before] }, { ...base, traces: [{ ...before, offsetDb: 3 }] })).toEqual(['Trace "before retune" changed']);
    expect(blockChanges(EQ_BLOCK, { ...base, traces: [before] }, { ...base, traces: [before] })).toEqual([]);
  });

  it('treats a block saved before traces existed as carrying none', () => {
    const { traces: _t, compare: _c, ...old } = base;
    expect(blockChanges(EQ_BLOCK, old, { ...base, traces: [newTraceRef(A)] })).toEqual(['Trace an unlabelled trace attached']);
    expect(blockChanges(EQ_BLOCK, old, base)).toEqual([]);
  });

  it('covers crossover blocks too', () => {
    const x = newCrossoverBlock();
    expect(blockChanges(CROSSOVER_BLOCK, { ...x, traces: [before] }, { ...x, traces: [] })).toEqual(['Trace "before retune" removed']);
  });

  it('does not throw on hostile stored attributes', () => {
    expect(blockChanges(EQ_BLOCK, { ...base, traces: 'nonsense' }, { ...base, traces: [null] })).toEqual(['Settings changed']);
  });
});
