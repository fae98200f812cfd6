import { describe, expect, it } from 'vitest';
import { fileIdOfUrl, isFileId, isOwnFileUrl } from './file-url';

describe('file ids and addresses', () => {
  it('takes ids of letters, digits, _ and -, up to 80 characters', () => {
    expect(isFileId('3f2b8c1e-9a7d-4c21-b0e5-6d4a2f1c8e90')).toBe(true);
    expect(isFileId('a'.repeat(80))).toBe(true);
    for (const bad of ['', 'a'.repeat(81), 'a.b', '../x', 'a/b', 'a b', 'ä', 42, null]) expect(isFileId(bad)).toBe(false);
  });

  it('reads the id from an address with or without a variant, query or fragment', () => {
    expect(fileIdOfUrl('/files/abc')).toBe('abc');
    expect(fileIdOfUrl('/files/abc/display')).toBe('abc');
    expect(fileIdOfUrl('/files/abc?download=1')).toBe('abc');
    expect(fileIdOfUrl('/files/abc#page=2')).toBe('abc');
    for (const bad of ['/files/', '/files/a.b', '/filesx/abc', 'https://example.org/files/abc', ' /files/abc', '/files/../x', 7]) expect(fileIdOfUrl(bad)).toBeNull();
  });

  it('accepts as an image only the original or a known variant', () => {
    expect(isOwnFileUrl('/files/abc')).toBe(true);
    for (const v of ['display', 'thumb', 'original']) expect(isOwnFileUrl(`/files/abc/${v}`)).toBe(true);
    for (const bad of ['/files/abc/huge', '/files/abc?x=1', '/files/abc/display/', 'https://evil.example/a.png', '/files/../etc/passwd']) expect(isOwnFileUrl(bad)).toBe(false);
  });
});
