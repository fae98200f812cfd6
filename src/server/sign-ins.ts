import { eq } from 'drizzle-orm';
import { users } from '~/db/schema';
import { recordSignIn } from './audit';
import { getDb, writeTx } from './db';

/**
 * Records a password sign-in that Auth.js accepted. Auth.js answers before we know the account's
 * id, so it is looked up by the e-mail Auth.js used; a failure to log never fails the sign-in.
 */
export async function recordPasswordSignIn(email: string): Promise<void> {
  try {
    const db = await getDb();
    const account = await db.query.users.findFirst({ where: eq(users.email, email.trim().toLowerCase()), columns: { id: true } });
    if (account) await writeTx((tx) => recordSignIn(tx, account.id, 'password'));
  } catch (err) {
    console.error('[throwline] could not record a sign-in', err);
  }
}
