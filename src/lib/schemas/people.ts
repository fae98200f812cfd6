import { z } from 'zod';
import { ROLES } from '~/lib/permissions';

/** E-mail addresses that can go into a mail header as they are: no line breaks, commas or angle brackets. */
export const EmailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .refine((v) => !/[\r\n,;<>"\s]/.test(v), 'An e-mail address cannot contain spaces, line breaks, commas or angle brackets.')
  .pipe(z.email('Enter a complete e-mail address, such as name@example.org.'));

export const RoleSchema = z.enum(ROLES, { error: 'Choose a role: manager, engineer or viewer.' });

export const InvitationCreateSchema = z.object({ email: EmailSchema, role: RoleSchema }).strict();

export const MemberUpdateSchema = z.object({ role: RoleSchema }).strict();

/** A person's display name; it appears in mail text, so no control characters. */
export const PersonNameSchema = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, 'Enter your name.')
  .max(80, 'Keep the name under 80 characters.')
  .refine((v) => !/[\u0000-\u001f\u007f]/.test(v), 'A name cannot contain line breaks or control characters.');

export const PasswordSchema = z.string().min(10, 'Choose a password of at least 10 characters.').max(1024, 'That password is too long.');

export const AcceptInvitationSchema = z.object({ name: PersonNameSchema, password: PasswordSchema }).strict();

const DAY_MS = 24 * 60 * 60 * 1000;
export const PASS_MAX_DAYS = 90;

export const PassCreateSchema = z
  .object({
    label: z.string({ error: 'Give the pass a label, such as the act and show date.' }).trim().min(1, 'Give the pass a label, such as the act and show date.').max(120, 'Keep the label under 120 characters.'),
    /** The show date (YYYY-MM-DD); the pass then runs to the end of the next day unless expiresAt says otherwise. */
    showDate: z.iso.date('Give the show date as YYYY-MM-DD.').optional(),
    expiresAt: z.iso.datetime({ offset: true, error: 'Give the expiry as an ISO 8601 date and time, e.g. 2026-12-05T23:59:00Z.' }).optional(),
  })
  .strict();

/** End of the day after the show (UTC), or of tomorrow when no show date is given. */
export function defaultPassExpiry(now: Date, showDate?: string): Date {
  const base = showDate ? new Date(`${showDate}T00:00:00Z`) : new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()));
  return new Date(base.getTime() + 2 * DAY_MS - 1000);
}

export function passExpiryProblem(now: Date, expiresAt: Date): string | null {
  if (expiresAt.getTime() <= now.getTime()) return 'The expiry is in the past; choose a later date.';
  if (expiresAt.getTime() > now.getTime() + PASS_MAX_DAYS * DAY_MS) return `A guest pass lasts at most ${PASS_MAX_DAYS} days; choose an earlier expiry.`;
  return null;
}

export const AdvanceSelectionSchema = z
  .object({
    pages: z.array(z.string().min(1).max(100), { error: 'Send pages as a list of page slugs, in sheet order.' }).max(500, 'An advance sheet holds at most 500 pages.'),
  })
  .strict();

export const SinceSchema = z.object({
  since: z.iso.datetime({ offset: true, error: 'Give "since" as an ISO 8601 date, e.g. 2026-11-01T00:00:00Z.' }).or(z.iso.date('Give "since" as a date, e.g. 2026-11-01.')).optional(),
});

export const AUDIT_KINDS = ['page', 'file', 'member', 'invitation', 'pass', 'venue', 'signin'] as const;

export const AuditQuerySchema = z.object({
  actor: z.string().max(100).optional(),
  kind: z.enum(AUDIT_KINDS, { error: `Filter by one kind: ${AUDIT_KINDS.join(', ')}.` }).optional(),
  page: z.coerce.number({ error: 'Give the page number as a whole number.' }).int().min(1, 'Pages start at 1.').max(10_000).default(1),
});
