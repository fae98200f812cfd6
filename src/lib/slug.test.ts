import { describe, expect, it } from 'vitest';
import { SLUG_PATTERN, slugify } from './slug';

describe('slugify', () => {
  it.each([
    ['Stage I/O & Patch', 'stage-i-o-and-patch'],
    ['  Über Hall — Main Room ', 'uber-hall-main-room'],
    ['<script>alert(1)</script>', 'script-alert-1-script'],
    ['***', ''],
  ])('%s → %s', (input, expected) => {
    expect(slugify(input)).toBe(expected);
  });

  it('always yields a slug that matches the pattern or nothing', () => {
    for (const s of ['a--b', '-x-', 'Power 63A 3-phase', '日本語']) {
      const slug = slugify(s);
      expect(slug === '' || SLUG_PATTERN.test(slug)).toBe(true);
    }
  });
});
