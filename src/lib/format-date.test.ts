import { describe, expect, it } from 'vitest';
import { formatDateTimeSecondsUtc, formatDateTimeUtc, formatDayUtc } from './format-date';

describe('UTC formats for server-rendered screens', () => {
  // 23:30 UTC on 3 December is already 4 December east of Greenwich: the day must stay the 3rd.
  const lateEvening = Date.UTC(2026, 11, 3, 23, 30, 9);

  it('writes the UTC day, whatever the server’s zone', () => {
    expect(formatDayUtc(lateEvening)).toBe('3 Dec 2026');
    expect(formatDayUtc(new Date(lateEvening).toISOString())).toBe('3 Dec 2026');
  });

  it('writes minutes, or seconds where order within a minute matters', () => {
    expect(formatDateTimeUtc(lateEvening)).toBe('3 Dec 2026, 23:30');
    expect(formatDateTimeSecondsUtc(lateEvening)).toBe('3 Dec 2026, 23:30:09');
  });
});
