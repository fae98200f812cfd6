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
  | 'page.edit' // create, save, restore, sections
  | 'file.upload'
  | 'file.delete'
  | 'members.manage' // members, roles, guest passes, advance selection
  | 'audit.read'
  | 'venue.create' // instance-wide
  | 'admin.manage'; // make admins, read the outbox

export interface Actor {
  id: string;
  isAdmin: boolean;
}

/** What the actor is to one venue: their role there, or null when not a member. */
export interface VenueAccess {
  role: Role | null;
}

const ROLE_ACTIONS: Record<Role, ReadonlySet<Action>> = {
  manager: new Set<Action>(['venue.read', 'advance.read', 'page.edit', 'file.upload', 'file.delete', 'members.manage', 'audit.read']),
  engineer: new Set<Action>(['venue.read', 'advance.read', 'page.edit', 'file.upload', 'file.delete']),
  viewer: new Set<Action>(['venue.read', 'advance.read']),
};

const INSTANCE_ACTIONS = new Set<Action>(['venue.create', 'admin.manage']);

export function can(actor: Actor | null | undefined, action: Action, venue?: VenueAccess | null): boolean {
  if (!actor) return false;
  if (actor.isAdmin) return true;
  if (INSTANCE_ACTIONS.has(action)) return false;
  const role = venue?.role;
  return role ? ROLE_ACTIONS[role].has(action) : false;
}

const ACTION_WORDS: Record<Action, string> = {
  'venue.read': 'read this venue',
  'advance.read': 'read the advance sheet',
  'page.edit': 'edit pages',
  'file.upload': 'upload files',
  'file.delete': 'delete files',
  'members.manage': 'manage members and guest passes',
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
