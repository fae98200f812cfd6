/**
 * Marks a calculator page rendered for nobody in particular. The service worker stores only
 * pages carrying this mark, so a page showing a signed-in person's name never lands in the
 * offline cache.
 */
export const OFFLINE_HEADER = 'x-throwline-offline';

export function markOfflineCacheable(user: unknown, headers: Headers): void {
  if (!user) headers.set(OFFLINE_HEADER, 'anonymous');
}
