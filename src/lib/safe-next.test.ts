import { describe, expect, it } from 'vitest';
import { safeNextPath } from './safe-next';

describe('safeNextPath', () => {
  it.each([
    ['/venues/x', '/venues/x'],
    ['https://evil.test/', '/venues'],
    ['//evil.test', '/venues'],
    ['/\\evil.test', '/venues'],
    ['/signin', '/venues'],
    [null, '/venues'],
    ['/calc?q=1', '/calc?q=1'],
  ])('%s → %s', (input, expected) => expect(safeNextPath(input)).toBe(expected));
});
