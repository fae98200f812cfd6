import type { APIRoute } from 'astro';
import { requirePermission, requireUser } from '~/server/guard';
import { HttpError, handle, json } from '~/server/http';
import { sendMail } from '~/server/mail/mailer';

/**
 * Sends a test message to the signed-in administrator, to check the mail settings end to end.
 * A form post from the outbox page is answered with a redirect back to it.
 */
export const POST: APIRoute = ({ locals, request, redirect }) =>
  handle(async () => {
    const user = requireUser(locals.principal);
    requirePermission(user, 'admin.manage');
    try {
      await sendMail({
        to: user.email,
        subject: 'Throwline test message',
        text: `This is a test message from Throwline, sent at ${new Date().toISOString()} to check the mail settings.`,
      });
    } catch (err) {
      console.error('[throwline] test mail failed', err);
      throw new HttpError(502, 'The mail server did not accept the message. Check SMTP_URL and try again.');
    }
    const wantsHtml = (request.headers.get('accept') ?? '').includes('text/html');
    return wantsHtml ? redirect('/admin/outbox?sent=1', 303) : json({ sent: true, to: user.email });
  });
