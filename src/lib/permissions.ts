/**
 * The one permission policy. Pages, islands and routes all ask `can()`; nothing else decides.
 * Pure: no database, no framework, so the UI can hide a button for exactly the reason the
 * server would refuse the request.
 */

export const ROLES = ['manager', 'engineer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export type Action =
  | 'venue.read' // the venue, its pages, history, photos
  | 'advance.read'
  | 'page.edit' // create, save, restore, sections, archive, move
  | 'page.check' // stamp a page "checked on site"
  | 'file.upload'
  | 'file.delete'
  | 'members.manage' // members, roles, guest passes, advance selection
  | 'venue.settings' // the venue's name, town and check interval
  | 'audit.read'
  | 'venue.create' // instance-wide
  | 'admin.manage'; // make admins, read the outbox

/** A signed-in person: a user with roles per venue, or an instance administrator. */
export interface Actor {
  id: string;
  isAdmin: boolean;
}

/** Someone holding a guest pass: may read one venue's advance sheet, nothing else. */
export interface Guest {
  guestPassId: string;
  venueId: string;
}

/** Who is asking: signed out (null), a member, or a guest. */
export type Principal = Actor | Guest | null;

export function isGuest(principal: Principal | undefined): principal is Guest {
  return !!principal && 'guestPassId' in principal;
}

export function isMember(principal: Principal | undefined): principal is Actor {
  return !!principal && 'id' in principal && !('guestPassId' in principal);
}

/**
 * Which venues a principal may read at all, as a rule the server turns into SQL: every venue,
 * the venues the user is a member of, only the advance sheet of one venue, or nothing.
 * Every list, search, guard and file route asks this, so the rule lives only here.
 */
export type ReadScope =
  | { kind: 'all' }
  | { kind: 'memberships'; userId: string }
  | { kind: 'advance-of'; venueId: string }
  | { kind: 'none' };

export function readScope(principal: Principal | undefined): ReadScope {
  if (isGuest(principal)) return { kind: 'advance-of', venueId: principal.venueId };
  if (!isMember(principal)) return { kind: 'none' };
  return principal.isAdmin ? { kind: 'all' } : { kind: 'memberships', userId: principal.id };
}

/** What the actor is to one venue: their role there, or null when not a member. */
export interface VenueAccess {
  role: Role | null;
  /** The venue's id; needed to match a guest's pass. */
  venueId?: string;
}

const ROLE_ACTIONS: Record<Role, ReadonlySet<Action>> = {
  manager: new Set<Action>(['venue.read', 'advance.read', 'page.edit', 'page.check', 'file.upload', 'file.delete', 'members.manage', 'venue.settings', 'audit.read']),
  engineer: new Set<Action>(['venue.read', 'advance.read', 'page.edit', 'page.check', 'file.upload', 'file.delete']),
  viewer: new Set<Action>(['venue.read', 'advance.read']),
};

const INSTANCE_ACTIONS = new Set<Action>(['venue.create', 'admin.manage']);

const GUEST_ACTIONS = new Set<Action>(['advance.read']);

/**
 * May this principal do this, in this venue? A guest may only read the advance sheet of the
 * venue their pass is for; `venue.venueId` must name that venue for a guest to pass.
 */
export function can(actor: Principal | undefined, action: Action, venue?: VenueAccess | null): boolean {
  if (!actor) return false;
  if (isGuest(actor)) return GUEST_ACTIONS.has(action) && !!venue?.venueId && venue.venueId === actor.venueId;
  if (actor.isAdmin) return true;
  if (INSTANCE_ACTIONS.has(action)) return false;
  const role = venue?.role;
  return role ? ROLE_ACTIONS[role].has(action) : false;
}

const ACTION_WORDS: Record<Action, string> = {
  'venue.read': 'read this venue',
  'advance.read': 'read the advance sheet',
  'page.edit': 'edit pages',
  'page.check': 'mark pages checked on site',
  'file.upload': 'upload files',
  'file.delete': 'delete files',
  'members.manage': 'manage members and guest passes',
  'venue.settings': "change this venue's settings",
  'audit.read': 'read the audit log',
  'venue.create': 'create venues',
  'admin.manage': 'administer this instance',
};

/** A refusal a person can act on: what they tried, what role they have, whom to ask. */
export function refusalMessage(action: Action, venue?: VenueAccess | null): string {
  const what = ACTION_WORDS[action];
  if (INSTANCE_ACTIONS.has(action)) return `Only an instance administrator may ${what}.`;
  const role = venue?.role;
  return role
    ? `Your role here is ${role}, which may not ${what}. Ask a manager of this venue for a different role.`
    : `You may not ${what}.`;
}
