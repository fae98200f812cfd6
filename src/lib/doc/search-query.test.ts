import { describe, expect, it } from 'vitest';
import { toFtsQuery } from './search-query';

describe('toFtsQuery', () => {
  it('quotes each term and prefixes the last', () => {
    expect(toFtsQuery('stage box')).toBe('"stage" "box"*');
  });

  it.each([
    ["' OR 1=1--", '"OR" "1=1--"*'],
    ['NEAR(a b)', '"NEAR(a" "b)"*'],
    ['a"b', '"a""b"*'],
    ['"unbalanced', '"""unbalanced"*'],
    ['-minus', '"-minus"*'],
    ['title:x', '"title:x"*'],
    ['x AND y', '"x" "AND" "y"*'],
  ])('%s is searched as text', (input, expected) => {
    expect(toFtsQuery(input)).toBe(expected);
  });

  it.each(['', '   ', '*', '-', '"', "'", '* - " ^'])('%j has no words to search for', (input) => {
    expect(toFtsQuery(input)).toBeNull();
  });

  it('caps the number of terms', () => {
    expect(toFtsQuery(Array.from({ length: 40 }, (_, i) => `w${i}`).join(' '))!.split(' ').length).toBe(12);
  });

  it.each([
    ['a\u0000b', '"a" "b"*'],
    ['\u0000', null],
    ['stage\u0001box', '"stage" "box"*'],
    ['x\u007F\u001By', '"x" "y"*'],
  ])('control characters in %j count as spaces, so FTS5 never meets them', (input, expected) => {
    expect(toFtsQuery(input)).toBe(expected);
  });
});
