import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { foldWord, indexText, queryTerms, TERM_ALIASES, termGroups } from './normalise-terms';

/** What FTS5's unicode61 tokenizer (remove_diacritics 2) makes of a string, closely enough for these texts. */
function ftsTokens(text: string): string[] {
  return (text.match(/[\p{L}\p{N}]+/gu) ?? []).map((t) => t.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase());
}

/** True when FTS5 would match every term of the query (as a phrase of its tokens) in the indexed text. */
function finds(query: string, text: string): boolean {
  const index = ftsTokens(indexText(text));
  return queryTerms(query).every((term) => {
    const phrase = ftsTokens(term);
    return index.some((_, i) => phrase.every((p, j) => index[i + j] === p));
  });
}

describe('the trade’s spellings find each other, both ways', () => {
  // Pairs an engineer writes for the same thing (invented model names, no real products).
  it.each([
    ['wifi', 'Venue Wi-Fi: ask the bar'],
    ['Wi-Fi', 'wifi password on the rack'],
    ['WIFI', 'The Wi‑Fi (non-breaking hyphen) is slow'],
    ['63A', 'Stage left: 63 A three-phase'],
    ['63 A', 'Stage left: 63A three-phase'],
    ['63 amps', 'a 63 A supply'],
    ['63A', 'the 63-A feed'],
    ['32 a', 'two 32A commandos'],
    ['db limit', 'Limit 98 dBA at FOH'],
    ['db limit', 'The limit is 98 dB(A) over 15 minutes'],
    ['dBA', 'limit 98 dB(A)'],
    ['dB(A)', 'limit 98 dBA'],
    ['dB A', 'limit 98 dB(A)'],
    ['98dBA', 'limit 98 dB(A)'],
    ['98 dB(A)', 'limit 98dBA'],
    ['dbc', 'peaks under 120 dB(C)'],
    ['dB SPL', 'at 105 dBSPL'],
    ['xr18', 'The XR-18 rack mixer'],
    ['XR-18', 'the xr18 at monitor world'],
    ['qx 220', 'QX-220 desk'],
    ['kx400b', 'amp rack: KX-400-B ×4'],
    ['kx-400', 'amp rack: KX-400-B ×4'],
    ['400b', 'amp rack: KX-400-B ×4'],
    ['fi', 'Wi-Fi'],
    ['48V', 'phantom 48 V on all inputs'],
    ['48 volts', 'phantom 48V'],
    ['100 hz', 'HPF at 100Hz'],
    ['100hz', 'HPF at 100 hertz'],
    ['8 ohm', 'cabs are 8 Ω'],
    ['8Ω', 'cabs are 8 ohms'],
    ['2.5mm²', 'a 2.5 mm² cable'],
    ['2.5 mm2', 'a 2.5mm² cable'],
    ['ohms', 'cabs are 8 Ω'],
    ['2.5 mm', 'a 2.5mm cable'],
    ['12 ms', 'delay the fills 12 milliseconds'],
    ['Café', 'the cafe stage'],
  ])('%j finds %j', (query, text) => {
    expect(finds(query, text)).toBe(true);
  });

  it.each([
    // A spelling is only joined where the trade joins it.
    ['a', 'bring amps'],
    ['wifi', 'wi fi'],
    ['63a', '63 and more'],
    ['dba', 'the db array'],
    ['xr18', 'xr 1 8'],
    ['kx400b', 'KX-400 B-side'],
  ])('%j does not find %j', (query, text) => {
    expect(finds(query, text)).toBe(false);
  });

  it('every text finds itself: its query terms are always in its index (any text)', () => {
    const fragment = fc.constantFrom('Wi-Fi', '63', 'A', 'amps', 'dB', '(A)', 'dBA', 'XR-18', '2.5', 'mm', '-', ' ', '  ', '.', '(', ')', 'Ω', '48V', 'SPL', 'é', '\n', '\u0002', 'x');
    fc.assert(
      fc.property(fc.array(fc.oneof(fragment, fc.string({ maxLength: 6 })), { maxLength: 12 }), (parts) => {
        const text = parts.join('');
        expect(finds(text, text)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('the index keeps every original word, so nothing findable before is lost', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 40 }), (text) => {
        const index = new Set(ftsTokens(indexText(text)));
        for (const t of ftsTokens(text.replace(/\p{Cc}/gu, ' '))) expect(index.has(t)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe('queryTerms', () => {
  it('reduces what was typed to one joined term per thing', () => {
    expect(queryTerms('Wi-Fi at 63 A, limit 98 dB(A)')).toEqual(['wifi', 'at', '63a', 'limit', '98dba']);
  });

  it('has no term for input without letters or digits, and never keeps a control character', () => {
    expect(queryTerms(' -*"() ')).toEqual([]);
    expect(queryTerms('a\u0000b')).toEqual(['a', 'b']);
    expect(queryTerms('"x" OR y*').join(' ')).not.toMatch(/["*()]/);
  });

  it('reads "amps" as a unit only after a number', () => {
    expect(queryTerms('amps')).toEqual(['amps']);
    expect(queryTerms('16 amps')).toEqual(['16a']);
  });

  it('survives hostile and huge input in bounded work', () => {
    const long = 'a-'.repeat(5000);
    const groups = termGroups(long);
    expect(groups).toHaveLength(1);
    // Runs are capped, so a 5,000-part hyphen chain does not index millions of joins.
    expect(groups[0].variants.length).toBeLessThan(5000 * 7);
  });
});

describe('foldWord', () => {
  it('folds case, width and diacritics as the index tokenizer does, then aliases', () => {
    expect(foldWord('Ｗｉ')).toBe('wi');
    expect(foldWord('Ärger')).toBe('arger');
    expect(foldWord('Ohms')).toBe('ohm');
    expect(foldWord('Ω')).toBe('ohm');
    expect(foldWord('Hertz')).toBe('hz');
  });
});

describe('indexText', () => {
  it('puts the joined spellings beside the words they join', () => {
    expect(indexText('Wi-Fi code')).toBe('Wi-Fi wifi  code');
    expect(indexText('plain words stay')).toBe('plain words stay');
  });

  it('turns control characters (the snippet markers) into spaces', () => {
    expect(indexText('a\u0002b\u0003c')).not.toMatch(/\p{Cc}/u);
  });
});

describe('the ASCII shortcut in foldWord', () => {
  // The full fold, as the shortcut must equal it: NFKD, marks dropped, lower case, NFKC
  // (the reading of FTS5's unicode61 tokenizer with remove_diacritics 2).
  const fullFold = (raw: string) => raw.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase().normalize('NFKC');

  it('gives the full fold for every ASCII character', () => {
    for (let c = 0; c < 128; c++) {
      const ch = String.fromCharCode(c);
      // An alias only ever maps a whole word; none is one character of ASCII.
      expect(foldWord(ch)).toBe(fullFold(ch));
    }
  });

  it('gives the full fold, then the alias, for any word (ASCII or not)', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ unit: 'binary-ascii', maxLength: 12 }), fc.constantFrom('Ohms', 'METRES', 'Hertz', 'ΩΩ', 'Ωhm', 'constructor', '__proto__', 'toString'), fc.string({ maxLength: 8 })), (raw) => {
        const folded = fullFold(raw);
        expect(foldWord(raw)).toBe(TERM_ALIASES.get(folded) ?? folded);
      }),
      { numRuns: 3000 },
    );
  });
});

describe('words that name things on an object', () => {
  // A lookup table written as an object literal answers "constructor" with a function; page text
  // holds any word, and indexing it must not break.
  it.each(['constructor', 'Constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf'])('%s is an ordinary word, alone, after a number and glued to one', (w) => {
    expect(foldWord(w)).toBe(w.toLowerCase());
    // "_" is not a word character, so "__proto__" is read as the word "proto".
    expect(queryTerms(w)).toEqual([w.replace(/_/g, '').toLowerCase()]);
    const text = `the ${w} 5 ${w} 5${w} of it`;
    expect(indexText(text)).toContain(w);
    expect(indexText(text)).not.toMatch(/function|native code|\[object/);
    expect(finds(w, text)).toBe(true);
  });
});
