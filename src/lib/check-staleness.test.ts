import { describe, expect, it } from 'vitest';
import { isCheckStale } from './check-staleness';

describe('isCheckStale', () => {
  const now = new Date('2026-12-03T12:00:00Z');
  it('warns on power and rigging pages checked longer ago than the setting, or never', () => {
    expect(isCheckStale('power', new Date('2026-06-02T12:00:00Z'), now, 6)).toBe(true);
    expect(isCheckStale('power', new Date('2026-06-04T12:00:00Z'), now, 6)).toBe(false);
    expect(isCheckStale('rigging', null, now, 6)).toBe(true);
    expect(isCheckStale('rigging', new Date('2026-10-01T00:00:00Z'), now, 1)).toBe(true);
  });
  it('never warns on other sections', () => {
    expect(isCheckStale('pa-system', null, now, 6)).toBe(false);
    expect(isCheckStale('contacts', new Date('2010-01-01'), now, 6)).toBe(false);
  });
});
