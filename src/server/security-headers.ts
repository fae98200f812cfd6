import { hstsFromEnv, securityHeaders as policyHeaders } from './security-policy.mjs';

export { completePagePolicy } from './security-policy.mjs';

/**
 * The headers every response carries (the values live in security-policy.mjs, shared with the
 * build's script hashing and the HTTP front). A page's own content-security-policy, which Astro
 * writes with the hashes of its scripts, is kept; so is any header a route set itself.
 */
export const securityHeaders: Record<string, string> = policyHeaders(hstsFromEnv(process.env));
