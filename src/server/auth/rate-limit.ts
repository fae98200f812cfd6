import { blockedFor, clearHits, countHit, type ThrottleRule } from './throttle';

const WINDOW_MS = 15 * 60 * 1000;

/** Ten wrong passwords for one account from one address in 15 minutes; the 11th try is refused. */
const perAccountAndAddress: ThrottleRule = { prefix: 'signin-acct-addr', limit: 10, windowMs: WINDOW_MS };
/** A wider net for one address trying many accounts. */
const perAddress: ThrottleRule = { prefix: 'signin-addr', limit: 50, windowMs: WINDOW_MS };
/**
 * One account guessed at from many addresses. Higher than the per-address limit so a single
 * stranger cannot lock a person out, low enough that a botnet gets 30 guesses per 15 minutes.
 */
const perAccount: ThrottleRule = { prefix: 'signin-acct', limit: 30, windowMs: WINDOW_MS };

function normal(email: string): string {
  return email.trim().toLowerCase();
}

/** Seconds to wait before another try is allowed, or 0 when one may try now. */
export async function signInRetryAfter(email: string, address: string): Promise<number> {
  const e = normal(email);
  const waits = await Promise.all([blockedFor(perAccountAndAddress, `${e}|${address}`), blockedFor(perAddress, address), blockedFor(perAccount, e)]);
  const longest = Math.max(...waits);
  return longest > 0 ? Math.max(1, Math.ceil(longest / 1000)) : 0;
}

export async function recordSignInFailure(email: string, address: string): Promise<void> {
  const e = normal(email);
  await countHit(perAccountAndAddress, `${e}|${address}`);
  await countHit(perAddress, address);
  if (e) await countHit(perAccount, e);
}

/** A right password clears the account's count from that address (not the account-wide count). */
export async function clearSignInFailures(email: string, address: string): Promise<void> {
  await clearHits(perAccountAndAddress, `${normal(email)}|${address}`);
}

/** Wrong guest-pass tokens from one address: 20 per 15 minutes, then 429. */
export const guestTokenMisses: ThrottleRule = { prefix: 'guest-miss', limit: 20, windowMs: WINDOW_MS };

/** Mail we send on request (sign-in links, password resets, invitations), per address and per recipient. */
export const mailPerAddress: ThrottleRule = { prefix: 'mail-addr', limit: 10, windowMs: WINDOW_MS };
export const mailPerRecipient: ThrottleRule = { prefix: 'mail-to', limit: 3, windowMs: WINDOW_MS };
/** Wrong one-time e-mail tokens from one address. */
export const emailTokenMisses: ThrottleRule = { prefix: 'token-miss', limit: 20, windowMs: WINDOW_MS };
