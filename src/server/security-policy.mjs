// The security policy in plain JavaScript, so astro.config.mjs (which hashes the page scripts),
// the Astro middleware and the HTTP front in src/cli/serve.mjs all read the same lines.

/**
 * Everything the app needs is served by the app itself (fonts included), so the policy refuses
 * every other host. Scripts run only from this site or, inline, by the hash Astro computes for
 * each one at build time: no 'unsafe-inline' for scripts. Styles keep 'unsafe-inline': a style
 * cannot run code, and the editor and the plots set styles no hash could cover.
 */
export const CSP_DIRECTIVES = [
  "default-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "media-src 'self' blob:",
  "worker-src 'self'",
  "manifest-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
];
/**
 * Astro adds hashes to style-src, which switches 'unsafe-inline' off there; these name inline
 * styles separately (the editor injects a <style>, the plots set style=""). Astro's config does
 * not take them, so the middleware appends them to the policy Astro writes for a page.
 */
export const STYLE_INLINE_DIRECTIVES = ["style-src-elem 'self' 'unsafe-inline'", "style-src-attr 'unsafe-inline'"];
export const SCRIPT_SOURCES = ["'self'"];
export const STYLE_SOURCES = ["'self'", "'unsafe-inline'"];

/** The policy for a response Astro did not hash scripts for (JSON, files, assets). */
export const BASE_CSP = [...CSP_DIRECTIVES, `script-src ${SCRIPT_SOURCES.join(' ')}`, `style-src ${STYLE_SOURCES.join(' ')}`, ...STYLE_INLINE_DIRECTIVES].join('; ');

/** A page's policy as Astro wrote it (with its script hashes), completed with the style lines. */
export function completePagePolicy(csp) {
  if (csp.includes('style-src-attr')) return csp;
  return `${csp.trim().replace(/;$/, '')}; ${STYLE_INLINE_DIRECTIVES.join('; ')}`;
}

/**
 * The headers every response carries. `hstsMaxAge` > 0 adds Strict-Transport-Security: only
 * for a site reached over https, which is why it is a setting (HSTS_MAX_AGE) and off by default.
 */
export function securityHeaders(hstsMaxAge = 0) {
  return {
    'content-security-policy': BASE_CSP,
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'same-origin',
    'x-frame-options': 'DENY',
    'permissions-policy': 'camera=(), geolocation=(), microphone=(), payment=(), usb=()',
    'cross-origin-opener-policy': 'same-origin',
    ...(hstsMaxAge > 0 ? { 'strict-transport-security': `max-age=${hstsMaxAge}` } : {}),
  };
}

/** HSTS_MAX_AGE as the front reads it before the app's own config check runs. */
export function hstsFromEnv(env) {
  const n = Number(env.HSTS_MAX_AGE ?? 0);
  return Number.isInteger(n) && n > 0 ? n : 0;
}
