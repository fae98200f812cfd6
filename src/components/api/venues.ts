import type { VenueCreated } from '~/lib/api-types';
import { request } from './client';

/** POST /api/venues (instance admins): the new venue, or an ApiError naming the field at fault. */
export function createVenue(body: { name: string; town?: string }): Promise<VenueCreated> {
  return request<VenueCreated>('/api/venues', {
    method: 'POST',
    body,
    fallback: 'The venue could not be created.',
    unreachable: 'No connection to the server; try again when online.',
  });
}

/** A venue this person may read, with their role there (null: an administrator who is not a member). */
export interface VenueListed {
  slug: string;
  name: string;
  role: string | null;
}

/** GET /api/venues: the venues this person may read. */
export async function listMyVenues(): Promise<VenueListed[]> {
  return (await request<{ venues: VenueListed[] }>('/api/venues')).venues;
}
