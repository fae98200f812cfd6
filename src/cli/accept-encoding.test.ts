import { describe, expect, it } from 'vitest';
import { acceptedWithoutBrotli } from './accept-encoding.mjs';

describe('acceptedWithoutBrotli', () => {
  it('drops br however it is written and keeps the rest with their weights', () => {
    expect(acceptedWithoutBrotli('gzip, deflate, br')).toBe('gzip, deflate');
    expect(acceptedWithoutBrotli('br;q=1.0, gzip;q=0.8, *;q=0.1')).toBe('gzip;q=0.8, *;q=0.1');
    expect(acceptedWithoutBrotli(' BR ,gzip')).toBe('gzip');
  });

  it('leaves codings that only contain the letters alone, and can leave nothing', () => {
    expect(acceptedWithoutBrotli('gzip, brotli-ish, zstd')).toBe('gzip, brotli-ish, zstd');
    expect(acceptedWithoutBrotli('br')).toBe('');
  });
});
