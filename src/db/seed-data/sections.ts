import type { SeedSection } from './types';

/** The eight sections every demo venue uses, in reading order. */
export const standardSections: SeedSection[] = [
  { slug: 'pa-system', title: 'PA system' },
  { slug: 'control', title: 'Control and FOH' },
  { slug: 'stage', title: 'Stage I/O and patch' },
  { slug: 'monitors', title: 'Monitors' },
  { slug: 'power', title: 'Power' },
  { slug: 'rigging', title: 'Rigging' },
  { slug: 'logistics', title: 'Logistics and access' },
  { slug: 'contacts', title: 'Contacts' },
];

/** Calendar date (YYYY-MM-DD, UTC) a number of days before now, for dated log lines. */
export function dateDaysAgo(days: number): string {
  return new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);
}
