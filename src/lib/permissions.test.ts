import { describe, expect, it } from 'vitest';
import { can, readScope, type Action, type Role } from './permissions';

// The expected matrix is DESIGN.md's roles table, written out independently of the implementation.
const table: Record<Action, Record<'admin' | Role | 'none', boolean>> = {
  'venue.read': { admin: true, manager: true, engineer: true, viewer: true, none: false },
  'advance.read': { admin: true, manager: true, engineer: true, viewer: true, none: false },
  'page.edit': { admin: true, manager: true, engineer: true, viewer: false, none: false },
  'page.check': { admin: true, manager: true, engineer: true, viewer: false, none: false },
  'file.upload': { admin: true, manager: true, engineer: true, viewer: false, none: false },
  'file.delete': { admin: true, manager: true, engineer: true, viewer: false, none: false },
  'members.manage': { admin: true, manager: true, engineer: false, viewer: false, none: false },
  'venue.settings': { admin: true, manager: true, engineer: false, viewer: false, none: false },
  'audit.read': { admin: true, manager: true, engineer: false, viewer: false, none: false },
  'venue.create': { admin: true, manager: false, engineer: false, viewer: false, none: false },
  'admin.manage': { admin: true, manager: false, engineer: false, viewer: false, none: false },
};

describe('can()', () => {
  for (const [action, row] of Object.entries(table) as [Action, (typeof table)[Action]][]) {
    for (const [who, expected] of Object.entries(row)) {
      it(`${who} ${expected ? 'may' : 'may not'} ${action}`, () => {
        const actor = { id: 'u1', isAdmin: who === 'admin' };
        const role = who === 'admin' || who === 'none' ? null : (who as Role);
        expect(can(actor, action, { role })).toBe(expected);
      });
    }
  }

  it('refuses everything to a signed-out visitor', () => {
    expect(can(null, 'venue.read', { role: 'manager' })).toBe(false);
  });

  it('does not let a role in one venue stand for another (no venue access given)', () => {
    expect(can({ id: 'u1', isAdmin: false }, 'venue.read', null)).toBe(false);
  });

  it('lets a guest read only the advance sheet of the venue their pass is for', () => {
    const guest = { guestPassId: 'p1', venueId: 'v1' };
    const actions = Object.keys(table) as Action[];
    for (const action of actions) {
      // The role a guest might claim is ignored; only the venue id of the pass counts.
      expect(can(guest, action, { role: 'manager', venueId: 'v1' })).toBe(action === 'advance.read');
      expect(can(guest, action, { role: 'manager', venueId: 'v2' })).toBe(false);
    }
    expect(can(guest, 'advance.read', { role: null })).toBe(false);
  });
});

describe('readScope()', () => {
  it('names one rule per kind of principal', () => {
    expect(readScope(null)).toEqual({ kind: 'none' });
    expect(readScope({ id: 'a', isAdmin: true })).toEqual({ kind: 'all' });
    expect(readScope({ id: 'u', isAdmin: false })).toEqual({ kind: 'memberships', userId: 'u' });
    expect(readScope({ guestPassId: 'p', venueId: 'v' })).toEqual({ kind: 'advance-of', venueId: 'v' });
  });
});
