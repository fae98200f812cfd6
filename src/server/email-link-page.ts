import type { AstroGlobal } from 'astro';
import { EmailSchema, PasswordSchema } from '~/lib/schemas/people';
import { emailTokenMisses } from './auth/rate-limit';
import { blockedFor, countHit } from './auth/throttle';
import { LINK_SENT, peekEmailLink, requestEmailLink, spendEmailLink, type LinkPurpose } from './email-links';
import { HttpError } from './http';
import { sessionCookieFor } from './session';

export interface AskResult {
  sent: string | null;
  error: string | null;
}

/**
 * The "e-mail me a link" forms (sign-in link, forgot password): POST one address, answer the same
 * sentence whether or not an account uses it. Exactly one `email` field: a repeated one is refused
 * rather than guessed at.
 */
export async function askForLink(Astro: AstroGlobal, purpose: LinkPurpose): Promise<AskResult> {
  if (Astro.request.method !== 'POST') return { sent: null, error: null };
  const form = await Astro.request.formData().catch(() => null);
  const emails = form?.getAll('email') ?? [];
  try {
    if (emails.length !== 1 || typeof emails[0] !== 'string') throw new HttpError(400, 'Enter one e-mail address.');
    const parsed = EmailSchema.safeParse(emails[0]);
    if (!parsed.success) throw new HttpError(400, parsed.error.issues[0]?.message ?? 'Enter a complete e-mail address.');
    await requestEmailLink(purpose, parsed.data, Astro.clientAddress, Astro.request);
    return { sent: LINK_SENT, error: null };
  } catch (err) {
    if (!(err instanceof HttpError)) throw err;
    Astro.response.status = err.status;
    return { sent: null, error: err.message };
  }
}

export type OpenLink =
  | { state: 'open'; email: string; error: string | null }
  | { state: 'dead' | 'throttled' }
  | { state: 'done'; response: Response };

/**
 * A link page (/signin/link/<token>, /signin/reset/<token>). GET only shows what the link opens,
 * so a mail scanner that follows it spends nothing; the page's own form POSTs to use it, and the
 * answer is an ordinary Auth.js session cookie. Wrong tokens count against the sender's address.
 */
export async function openLinkPage(Astro: AstroGlobal, purpose: LinkPurpose): Promise<OpenLink> {
  const token = Astro.params.token ?? '';
  const address = Astro.clientAddress;
  if ((await blockedFor(emailTokenMisses, address)) > 0) {
    Astro.response.status = 429;
    return { state: 'throttled' };
  }
  const link = await peekEmailLink(purpose, token);
  if (!link) {
    await countHit(emailTokenMisses, address);
    Astro.response.status = 404;
    return { state: 'dead' };
  }
  if (Astro.request.method !== 'POST') return { state: 'open', email: link.email, error: null };
  try {
    let password: string | undefined;
    if (purpose === 'reset') {
      const form = await Astro.request.formData().catch(() => null);
      const parsed = PasswordSchema.safeParse(String(form?.get('password') ?? ''));
      if (!parsed.success) throw new HttpError(400, parsed.error.issues[0]?.message ?? 'Choose a password of at least 10 characters.');
      if (form?.get('confirm') !== parsed.data) throw new HttpError(400, 'The two passwords differ; type the same one twice.');
      password = parsed.data;
    }
    const userId = await spendEmailLink(purpose, token, password);
    const cookie = await sessionCookieFor(userId, Astro.request);
    return { state: 'done', response: new Response(null, { status: 303, headers: { location: '/venues', 'set-cookie': cookie } }) };
  } catch (err) {
    if (!(err instanceof HttpError)) throw err;
    Astro.response.status = err.status;
    if (err.status === 404) return { state: 'dead' };
    return { state: 'open', email: link.email, error: err.message };
  }
}
