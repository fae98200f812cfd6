import type { SectionRow, SectionsAnswer } from '~/lib/api-types';
import { request, venueApi } from './client';

export type { SectionRow };

const UNREACHABLE = 'Could not reach Throwline; nothing changed. Try again.';

function sectionsApi(venue: string) {
  return `${venueApi(venue)}/sections`;
}

function sectionApi(venue: string, section: string) {
  return `${sectionsApi(venue)}/${encodeURIComponent(section)}`;
}

export async function listSections(venue: string): Promise<SectionRow[]> {
  return (await request<SectionsAnswer>(sectionsApi(venue), { unreachable: UNREACHABLE })).sections;
}

export async function createSection(venue: string, title: string): Promise<void> {
  await request(sectionsApi(venue), { method: 'POST', body: { title }, unreachable: UNREACHABLE });
}

export async function updateSection(venue: string, section: string, change: { title: string } | { move: 'up' | 'down' }): Promise<void> {
  await request(sectionApi(venue, section), { method: 'PATCH', body: change, unreachable: UNREACHABLE });
}

export async function deleteSection(venue: string, section: string): Promise<void> {
  await request(sectionApi(venue, section), { method: 'DELETE', unreachable: UNREACHABLE });
}
