import { DEFAULT_SECTIONS } from '~/lib/default-sections';
import type { SeedSection } from './types';

/** The demo venues use the sections every new venue starts with. */
export const standardSections: SeedSection[] = DEFAULT_SECTIONS.map((s) => ({ ...s }));

/** Calendar date (YYYY-MM-DD, UTC) a number of days before now, for dated log lines. */
export function dateDaysAgo(days: number): string {
  return new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);
}
