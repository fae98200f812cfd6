import { describe, expect, it } from 'vitest';
import { defaultPassExpiry, EmailSchema, InvitationCreateSchema, passExpiryProblem, PersonNameSchema } from './people';

describe('people schemas', () => {
  it('refuses e-mail addresses that would add mail headers or recipients', () => {
    for (const bad of ['a@b.test\r\nBcc: x@evil.test', 'a@b.test,c@d.test', 'Name <a@b.test>', 'a@b.test\nSubject: hi', 'a b@c.test']) {
      expect(EmailSchema.safeParse(bad).success, bad).toBe(false);
    }
    expect(EmailSchema.parse('  New.Person@Example.ORG ')).toBe('new.person@example.org');
  });

  it('refuses names with line breaks and unknown roles', () => {
    expect(PersonNameSchema.safeParse('Ada\r\nBcc: x@y.test').success).toBe(false);
    expect(InvitationCreateSchema.safeParse({ email: 'a@b.test', role: 'admin' }).success).toBe(false);
  });

  it('a pass runs to the end of the day after the show, at most 90 days', () => {
    const now = new Date('2026-12-03T10:00:00Z');
    expect(defaultPassExpiry(now, '2026-12-05').toISOString()).toBe('2026-12-06T23:59:59.000Z');
    expect(defaultPassExpiry(now).toISOString()).toBe('2026-12-04T23:59:59.000Z');
    expect(passExpiryProblem(now, new Date('2027-03-02T09:00:00Z'))).toBeNull(); // 89 days
    expect(passExpiryProblem(now, new Date('2027-03-04T10:00:01Z'))).toMatch(/at most 90 days/);
    expect(passExpiryProblem(now, new Date('2026-12-01T00:00:00Z'))).toMatch(/past/);
  });
});
