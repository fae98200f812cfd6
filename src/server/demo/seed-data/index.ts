/**
 * Demo content for the seed: two invented venues and the demo people.
 * Every venue, town, person, company and product named here is made up.
 */
import { haverkinHall } from './haverkin-hall';
import { nettlebox } from './nettlebox';
import type { SeedVenue } from './types';

export type { PmNode } from './doc-builder';
export type { SeedPage, SeedRevision, SeedSection, SeedVenue } from './types';

/** The main demo venue comes first. */
export const demoVenues: SeedVenue[] = [haverkinHall, nettlebox];

export interface DemoPerson {
  email: string;
  name: string;
}

/**
 * Demo sign-ins. Revision authors ('manager' | 'engineer' | 'admin') refer to the keys here.
 * `othermanager` is meant to be a member of the second venue only.
 */
export const demoPeople = {
  admin: { email: 'admin@throwline.test', name: 'Avery Quennell' },
  manager: { email: 'manager@throwline.test', name: 'Ines Calloway' },
  engineer: { email: 'engineer@throwline.test', name: 'Dario Fensome' },
  viewer: { email: 'viewer@throwline.test', name: 'Kit Ambrose' },
  othermanager: { email: 'othermanager@throwline.test', name: 'Joss Emberly' },
} satisfies Record<string, DemoPerson>;
