import { Auth } from '@auth/core';
import authConfig from '~/auth.config';

/**
 * An Auth.js CSRF token for a server-rendered form (sign-in, sign-out), with the cookie that
 * pairs with it, so those forms work without any client script.
 */
export async function issueCsrf(request: Request): Promise<{ token: string; setCookies: string[] }> {
  const url = new URL('/api/auth/csrf', request.url);
  const response = await Auth(new Request(url, { headers: request.headers }), authConfig);
  const body = (await response.json()) as { csrfToken?: string };
  return { token: body.csrfToken ?? '', setCookies: response.headers.getSetCookie() };
}
