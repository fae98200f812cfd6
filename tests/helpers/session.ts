import { DEMO_PASSWORD } from './paths';

/** A tiny cookie jar: enough for Auth.js's csrf and session cookies. */
export class CookieJar {
  private cookies = new Map<string, string>();

  absorb(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      if (!value || /max-age=0/i.test(line) || /expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  header(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }
}

export interface SignInAttempt {
  status: number;
  location: string | null;
  jar: CookieJar;
}

/** Signs in through Auth.js's own credentials callback, exactly as the sign-in form does. */
export async function attemptSignIn(baseUrl: string, email: string, password: string, headers: Record<string, string> = {}): Promise<SignInAttempt> {
  const jar = new CookieJar();
  const csrfRes = await fetch(`${baseUrl}/api/auth/csrf`);
  jar.absorb(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: baseUrl, cookie: jar.header(), ...headers },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: `${baseUrl}/venues` }),
  });
  jar.absorb(res);
  return { status: res.status, location: res.headers.get('location'), jar };
}

export async function signIn(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<Client> {
  const attempt = await attemptSignIn(baseUrl, email, password);
  if (!attempt.jar.header().includes('session-token')) {
    throw new Error(`Sign-in as ${email} failed: ${attempt.status} → ${attempt.location}`);
  }
  return new Client(baseUrl, attempt.jar);
}

/** fetch with a session, JSON helpers, and an Origin header like a browser's. */
export class Client {
  constructor(
    readonly baseUrl: string,
    readonly jar: CookieJar = new CookieJar(),
  ) {}

  fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.jar.header()) headers.set('cookie', this.jar.header());
    if (!headers.has('origin')) headers.set('origin', this.baseUrl);
    return fetch(`${this.baseUrl}${path}`, { redirect: 'manual', ...init, headers });
  }

  getJson(path: string) {
    return this.fetch(path);
  }

  sendJson(method: string, path: string, body: unknown) {
    return this.fetch(path, { method, headers: { 'content-type': 'application/json' }, body: typeof body === 'string' ? body : JSON.stringify(body) });
  }
}

export const anonymous = (baseUrl: string) => new Client(baseUrl);
