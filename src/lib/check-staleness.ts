/** Sections where an out-of-date page can hurt someone: power and flown loads. */
export const SAFETY_SECTIONS: ReadonlySet<string> = new Set(['power', 'rigging']);

/**
 * Whether a page's "checked on site" stamp is too old to lean on. Only power and rigging pages
 * warn; a page never checked counts as stale there.
 */
export function isCheckStale(sectionSlug: string, checkedAt: Date | null, now: Date, staleMonths: number): boolean {
  if (!SAFETY_SECTIONS.has(sectionSlug)) return false;
  if (!checkedAt) return true;
  const limit = new Date(now);
  limit.setUTCMonth(limit.getUTCMonth() - staleMonths);
  return checkedAt.getTime() < limit.getTime();
}
