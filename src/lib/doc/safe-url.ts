/**
 * Link targets a page may carry: web, mail, or a path on this site. Anything else
 * (javascript:, data:, vbscript:, protocol-relative //host) is refused.
 */
export function isSafeLinkHref(href: unknown): href is string {
  if (typeof href !== 'string' || href.length === 0 || href.length > 2048) return false;
  // Browsers ignore ASCII control characters and whitespace inside a scheme ("java\tscript:").
  if (/[\u0000-\u001f\u007f]/.test(href)) return false;
  const trimmed = href.trim();
  if (trimmed.startsWith('//')) return false;
  if (/^(https?:|mailto:)/i.test(trimmed)) return true;
  // Relative: no scheme before the first slash, question mark or hash.
  return !/^[^/?#]*:/.test(trimmed);
}

export { isOwnFileUrl } from '~/lib/file-url';
