import { describe, expect, it } from 'vitest';
import { diffStats, foldUnchanged, wordDiff } from './word-diff';

describe('wordDiff', () => {
  it('marks the words that changed', () => {
    const parts = wordDiff('Amp rack A feeds the mains', 'Amp rack B feeds the mains and subs');
    expect(parts.filter((p) => p.kind === 'removed').map((p) => p.text.trim())).toEqual(['A']);
    expect(parts.filter((p) => p.kind === 'added').map((p) => p.text.trim()).join(' ')).toMatch(/B.*and subs/);
    expect(diffStats(parts)).toEqual({ added: 3, removed: 1 });
  });

  it('keeps markup-looking text as plain text', () => {
    const parts = wordDiff('', '<script>alert(1)</script>');
    expect(parts.map((p) => p.text).join('')).toBe('<script>alert(1)</script>');
  });

  it('identical text is all "same"', () => {
    expect(wordDiff('a b c', 'a b c').every((p) => p.kind === 'same')).toBe(true);
  });
});

describe('foldUnchanged', () => {
  const lines = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => `line ${from + i}`).join('\n');

  it('keeps two lines of context around a change and folds the rest', () => {
    const before = lines(1, 30);
    const after = before.replace('line 15', 'line fifteen');
    const folded = foldUnchanged(wordDiff(before, after));
    const folds = folded.filter((p) => p.kind === 'fold');
    expect(folds).toHaveLength(2);
    const shown = folded.map((p) => (p.kind === 'fold' ? '[fold]' : p.text)).join('');
    expect(shown).toContain('line 13\nline 14\nline ');
    expect(shown).toContain('\nline 16\nline 17');
    expect(shown).not.toContain('line 5\n');
    expect(shown).not.toContain('line 25');
  });

  it('leaves short or unchanged texts whole', () => {
    expect(foldUnchanged(wordDiff('a\nb\nc', 'a\nB\nc')).some((p) => p.kind === 'fold')).toBe(false);
    const same = wordDiff(lines(1, 40), lines(1, 40));
    expect(foldUnchanged(same)).toEqual(same);
  });
});
