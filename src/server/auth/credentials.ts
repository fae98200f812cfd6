import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { users } from '~/db/schema';
import { getDb } from '~/server/db';
import { burnVerifyTime, verifyPassword } from './password';

export const CredentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter the e-mail address of your account.').max(254),
  password: z.string().min(1, 'Enter your password.').max(1024, 'That password is too long.'),
});

/** The account for these credentials, or null; unknown e-mails cost the same time as wrong passwords. */
export async function verifyCredentials(input: unknown): Promise<{ id: string; email: string; name: string; sessionEpoch: number } | null> {
  const parsed = CredentialsSchema.safeParse(input);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const db = await getDb();
  const user = await db.query.users.findFirst({ where: eq(users.email, email) });
  if (!user) {
    await burnVerifyTime(password);
    return null;
  }
  if (!(await verifyPassword(user.passwordHash, password))) return null;
  return { id: user.id, email: user.email, name: user.name, sessionEpoch: user.sessionEpoch };
}
