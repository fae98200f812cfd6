import { describe, expect, it } from 'vitest';
import { snippetParts } from '~/lib/doc/marked-snippet';
import { toSearchQuery } from '~/lib/doc/search-query';
import { markAll, markedSnippet, markedSnippetOfWhole, type MatchQuery } from './mark-matches';

const hits = (marked: string) => snippetParts(marked).filter((p) => p.match).map((p) => p.text);
const q = (typed: string) => toSearchQuery(typed)!;

describe('markAll', () => {
  it('marks the text as written, whichever spelling was typed', () => {
    expect(hits(markAll('Venue Wi-Fi and guest wifi', q('wifi')))).toEqual(['Wi-Fi', 'wifi']);
    expect(hits(markAll('Feed: 63 A, spare 63A', q('63a')))).toEqual(['63 A', '63A']);
    expect(hits(markAll('Limit 98 dB(A), peaks 120 dBC', q('db')))).toEqual(['dB', 'dBC']);
    expect(hits(markAll('The QX-220 desk', q('qx220')))).toEqual(['QX-220']);
  });

  it('marks a part of a joined spelling on its own', () => {
    expect(hits(markAll('Wi-Fi', q('fi')))).toEqual(['Fi']);
  });

  it('marks prefixes only for the last term, as the search matched them', () => {
    expect(hits(markAll('stage box, stagehand', q('stag')))).toEqual(['stage', 'stagehand']);
    expect(hits(markAll('stage box, stagehand', q('stag box')))).toEqual(['box']);
  });

  it('leaves text without a hit unmarked', () => {
    expect(markAll('Nothing here', q('wifi'))).toBe('Nothing here');
  });
});

describe('markedSnippet', () => {
  const long = `${Array.from({ length: 40 }, (_, i) => `w${i}`).join(' ')} the Wi-Fi code ${Array.from({ length: 40 }, (_, i) => `z${i}`).join(' ')}`;

  it('cuts a window around the first hit, with ellipses where it cut', () => {
    const s = markedSnippet(long, q('wifi'));
    expect(s.startsWith('…')).toBe(true);
    expect(s.endsWith('…')).toBe(true);
    expect(hits(s)).toEqual(['Wi-Fi']);
    expect(s.split(' ').length).toBeLessThanOrEqual(16);
  });

  it('opens with the first words when only the title matched', () => {
    expect(markedSnippet(long, q('absentword'))).toMatch(/^w0 w1 /);
  });

  it('folds line breaks and runs of spaces to one space', () => {
    expect(markedSnippet('a\n\n  b', q('b'))).toBe(`a \u0002b\u0003`);
  });

  it('is empty for empty text, and a marker character in the text never opens a mark', () => {
    expect(markedSnippet('', q('x'))).toBe('');
    expect(hits(markedSnippet('plain \u0002fake\u0003 text', q('nothing')))).toEqual([]);
    expect(hits(markAll('plain \u0002fake\u0003 text', q('text')))).toEqual(['text']);
  });
});

describe('the shortest run that holds the hit', () => {
  it('marks dB(A) in "98 dB(A)" for dba, and all of it for 98dba', () => {
    expect(hits(markAll('limit 98 dB(A) here', q('dba')))).toEqual(['dB(A)']);
    expect(hits(markAll('limit 98 dB(A) here', q('98dba')))).toEqual(['98 dB(A)']);
  });
});

describe('reading the head of a long text first', () => {
  // A small seeded generator (mulberry32), so a failure can be replayed.
  function random(seed: number) {
    return () => {
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
  }
  const vocabulary = ['stage', 'backstage', 'Wi-Fi', 'wifi', '63', 'A', 'amps', 'dB(A)', 'dBA', '98', '2.5', 'mm', 'XR-18', 'rack', 'monitor', 'délai', 'Ohms', 'the', 'of', 'ω'];
  const glue = [' ', ' ', ' ', '  ', '\n', ', ', '. ', '-', ' ('];
  const queries: MatchQuery[] = [q('stage'), q('wifi'), q('63a'), q('dba'), q('db'), q('2.5mm'), q('xr18'), q('delai'), q('ohm'), { terms: ['mon'], prefixLast: true }, q('absentword')];

  it('gives exactly the snippet the whole text gives, for texts long enough to cut', () => {
    const next = random(20261203);
    let cases = 0;
    for (let n = 0; n < 100; n++) {
      const length = 3200 + Math.floor(next() * 6000);
      let text = '';
      // Hits early in most texts, late in some, absent in a few.
      const quietFor = next() < 0.7 ? Math.floor(next() * 400) : Math.floor(next() * length);
      while (text.length < length) {
        const quiet = text.length < quietFor;
        const word = quiet ? `w${Math.floor(next() * 1000)}` : vocabulary[Math.floor(next() * vocabulary.length)];
        text += word + glue[Math.floor(next() * glue.length)];
      }
      for (const query of queries) {
        expect(markedSnippet(text, query), `text ${n}, ${query.terms.join(' ')}`).toBe(markedSnippetOfWhole(text, query));
        cases++;
      }
    }
    expect(cases).toBe(100 * queries.length);
  });
});
