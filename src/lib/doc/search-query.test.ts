import { describe, expect, it } from 'vitest';
import { toFtsQuery } from './search-query';

describe('toFtsQuery', () => {
  it('quotes each term and prefixes the last', () => {
    expect(toFtsQuery('stage box')).toBe('"stage" "box"*');
  });

  it.each([
    ["' OR 1=1--", '"OR" "1=1--"'],
    ['NEAR(a bc)', '"NEAR(a" "bc)"'],
    ['NEAR(a bcd)', '"NEAR(a" "bcd)"*'],
    ['a"bcd', '"a""bcd"*'],
    ['"unbalanced', '"""unbalanced"*'],
    ['-minus', '"-minus"*'],
    ['title:x', '"title:x"'],
    ['title:xlr', '"title:xlr"*'],
    ['x AND y', '"x" "AND" "y"'],
  ])('%s is searched as text', (input, expected) => {
    expect(toFtsQuery(input)).toBe(expected);
  });

  it.each(['', '   ', '*', '-', '"', "'", '* - " ^'])('%j has no words to search for', (input) => {
    expect(toFtsQuery(input)).toBeNull();
  });

  it('matches a last word of one or two letters whole, from three letters on as a prefix', () => {
    expect(toFtsQuery('s')).toBe('"s"');
    expect(toFtsQuery('st')).toBe('"st"');
    expect(toFtsQuery('s*')).toBe('"s*"');
    expect(toFtsQuery('sta')).toBe('"sta"*');
    expect(toFtsQuery('stage 2')).toBe('"stage" "2"');
    expect(toFtsQuery('stage-2')).toBe('"stage-2"');
    expect(toFtsQuery('2-sta')).toBe('"2-sta"*');
    expect(toFtsQuery('ü')).toBe('"ü"');
  });

  it('caps the number of terms', () => {
    expect(toFtsQuery(Array.from({ length: 40 }, (_, i) => `w${i}`).join(' '))!.split(' ').length).toBe(12);
  });

  it.each([
    // One-letter last terms are whole words only (SEARCH_MIN_CHARS), hence no `*` there.
    ['a\u0000b', '"a" "b"'],
    ['\u0000', null],
    ['stage\u0001box', '"stage" "box"*'],
    ['x\u007F\u001By', '"x" "y"'],
  ])('control characters in %j count as spaces, so FTS5 never meets them', (input, expected) => {
    expect(toFtsQuery(input)).toBe(expected);
  });
});
