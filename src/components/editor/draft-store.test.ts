import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { clearDrafts, readDrafts, writeDraft, type Draft } from './draft-store';

/** A Map-backed stand-in for the browser's localStorage, with a switch to make writes fail. */
class MemoryStorage {
  items = new Map<string, string>();
  full = false;
  get length() {
    return this.items.size;
  }
  key(i: number) {
    return [...this.items.keys()][i] ?? null;
  }
  getItem(k: string) {
    return this.items.get(k) ?? null;
  }
  setItem(k: string, v: string) {
    if (this.full) throw new DOMException('full', 'QuotaExceededError');
    this.items.set(k, v);
  }
  removeItem(k: string) {
    this.items.delete(k);
  }
}

const draft = (base: number, savedAt: number, text = 'x'): Draft => ({
  base,
  savedAt,
  title: 'T',
  section: 'stage',
  summary: '',
  doc: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] },
});

let storage: MemoryStorage;
beforeEach(() => {
  storage = new MemoryStorage();
  (globalThis as { localStorage?: unknown }).localStorage = storage;
});
afterEach(() => {
  delete (globalThis as { localStorage?: unknown }).localStorage;
});

describe('draft-store', () => {
  it('keeps one draft per base revision and lists them newest first', () => {
    writeDraft('hall', 'patch', draft(3, 100, 'old'));
    writeDraft('hall', 'patch', draft(4, 200, 'new'));
    writeDraft('hall', 'patch', draft(4, 300, 'newer'));
    expect(readDrafts('hall', 'patch').map((d) => [d.base, d.savedAt])).toEqual([
      [4, 300],
      [3, 100],
    ]);
  });

  it('keeps pages and venues apart, and clears only the page asked for', () => {
    writeDraft('hall', 'patch', draft(1, 1));
    writeDraft('hall', 'patch-2', draft(1, 1));
    writeDraft('annex', 'patch', draft(1, 1));
    clearDrafts('hall', 'patch');
    expect(readDrafts('hall', 'patch')).toEqual([]);
    expect(readDrafts('hall', 'patch-2')).toHaveLength(1);
    expect(readDrafts('annex', 'patch')).toHaveLength(1);
  });

  it('skips damaged entries and reports a full storage instead of throwing', () => {
    storage.setItem('throwline.draft:hall/patch@9', '{not json');
    writeDraft('hall', 'patch', draft(2, 5));
    expect(readDrafts('hall', 'patch').map((d) => d.base)).toEqual([2]);
    storage.full = true;
    expect(writeDraft('hall', 'patch', draft(3, 6))).toBe(false);
  });
});
