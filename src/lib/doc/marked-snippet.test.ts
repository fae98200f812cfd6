import { describe, expect, it } from 'vitest';
import { MATCH_CLOSE as C, MATCH_OPEN as O, snippetHtml, snippetParts } from './marked-snippet';

describe('marked snippets', () => {
  it('turns markers into <mark> and escapes everything else', () => {
    expect(snippetHtml(`<b>x</b> ${O}stage${C} & "box"`)).toBe('&lt;b&gt;x&lt;/b&gt; <mark>stage</mark> &amp; &quot;box&quot;');
  });

  it('always balances marks, even with stray markers', () => {
    expect(snippetHtml(`${C}a${O}b${O}c`)).toBe('a<mark>b</mark><mark>c</mark>');
  });

  it('gives parts for rendering as text', () => {
    expect(snippetParts(`a ${O}b${C}`)).toEqual([
      { text: 'a ', match: false },
      { text: 'b', match: true },
    ]);
  });
});
