/** Where to go after signing in: only a path on this site, never another host. */
export function safeNextPath(next: string | null | undefined, fallback = '/venues'): string {
  if (!next || next.length > 500) return fallback;
  if (!next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (/[\u0000-\u001f]/.test(next)) return fallback;
  if (next.startsWith('/signin') || next.startsWith('/signout') || next.startsWith('/api/')) return fallback;
  return next;
}
