/**
 * A stand-in origin for resolving a path the way a browser on this site would. Its name can never
 * be a real host (.invalid is reserved), so only a target that stays on "this site" matches it.
 */
const HERE = 'https://this-site.invalid';

/** How a link target is shown: on this site, or away from it (opened with noopener). */
export type LinkKind = 'internal' | 'external';

/**
 * Where a link may point: web or mail anywhere, or a path on this site. The target is resolved
 * with the URL parser, as a browser does, and a relative one must keep this site's origin, so
 * `/\host`, `\\host`, `\/host` and `//host` (which browsers all read as another host) are refused
 * along with javascript:, data: and the rest. Null when refused.
 */
export function linkKind(href: unknown): LinkKind | null {
  if (typeof href !== 'string' || href.length === 0 || href.length > 2048) return null;
  // Browsers ignore ASCII control characters and whitespace inside a scheme ("java\tscript:").
  if (/[\u0000-\u001f\u007f]/.test(href)) return null;
  const trimmed = href.trim();
  let resolved: URL;
  try {
    resolved = new URL(trimmed, HERE);
  } catch {
    return null;
  }
  const hasScheme = /^[a-z][a-z0-9+.-]*:/i.test(trimmed);
  if (hasScheme) {
    if (resolved.protocol === 'mailto:') return 'external';
    if (resolved.protocol !== 'http:' && resolved.protocol !== 'https:') return null;
    // "https:evil.example" and "https:/evil" are relative in the spec's eyes; spell hosts out.
    if (!/^https?:\/\/[^/\\]/i.test(trimmed)) return null;
    return 'external';
  }
  return resolved.origin === HERE ? 'internal' : null;
}

export function isSafeLinkHref(href: unknown): href is string {
  return linkKind(href) !== null;
}

export { isOwnFileUrl } from '~/lib/file-url';
