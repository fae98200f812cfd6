import { describe, expect, it } from 'vitest';
import { toFtsQuery, toSearchQuery } from './search-query';

describe('toFtsQuery', () => {
  it('quotes each term and prefixes the last', () => {
    expect(toFtsQuery('stage box')).toBe('"stage" "box"*');
  });

  it.each([
    // Only letters, digits and a decimal point survive into a term, so nothing typed is FTS5 syntax.
    ["' OR 1=1--", '"or" "1" "1"'],
    ['NEAR(a bc)', '"near" "a" "bc"'],
    ['NEAR(a bcd)', '"near" "a" "bcd"*'],
    ['a"bcd', '"a" "bcd"*'],
    ['"unbalanced', '"unbalanced"*'],
    ['-minus', '"minus"*'],
    ['title:x', '"title" "x"'],
    ['title:xlr', '"title" "xlr"*'],
    ['x AND y', '"x" "and" "y"'],
    ['{title body}: x', '"title" "body" "x"'],
    ['a^b', '"a" "b"'],
  ])('%s is searched as text', (input, expected) => {
    expect(toFtsQuery(input)).toBe(expected);
  });

  it.each(['', '   ', '*', '-', '"', "'", '* - " ^'])('%j has no words to search for', (input) => {
    expect(toFtsQuery(input)).toBeNull();
  });

  it('matches a last word of one or two letters whole, from three letters on as a prefix', () => {
    expect(toFtsQuery('s')).toBe('"s"');
    expect(toFtsQuery('st')).toBe('"st"');
    expect(toFtsQuery('s*')).toBe('"s"');
    expect(toFtsQuery('sta')).toBe('"sta"*');
    expect(toFtsQuery('stage 2')).toBe('"stage" "2"');
    expect(toFtsQuery('stage-2')).toBe('"stage2"*');
    expect(toFtsQuery('2-st')).toBe('"2st"*');
    expect(toFtsQuery('ü')).toBe('"u"');
  });

  it.each([
    ['Wi-Fi password', '"wifi" "password"*'],
    ['wifi', '"wifi"*'],
    ['63 A', '"63a"*'],
    ['63A', '"63a"*'],
    ['63 amps', '"63a"*'],
    ['dB(A) limit', '"dba" "limit"*'],
    ['db limit', '"db" "limit"*'],
    ['2.5 mm', '"2.5mm"*'],
    ['QX-220 desk', '"qx220" "desk"*'],
  ])('%s is searched in the index spelling: %s', (input, expected) => {
    expect(toFtsQuery(input)).toBe(expected);
  });

  it('toSearchQuery hands back the terms for marking hits, and whether the last is a prefix', () => {
    expect(toSearchQuery('Wi-Fi pass')).toEqual({ match: '"wifi" "pass"*', terms: ['wifi', 'pass'], prefixLast: true });
    expect(toSearchQuery('db')).toEqual({ match: '"db"', terms: ['db'], prefixLast: false });
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
