import { RateLimiterMemory, type RateLimiterRes } from 'rate-limiter-flexible';

const WINDOW_SECONDS = 15 * 60;

/** Ten wrong passwords for one account from one address in 15 minutes; the 11th try is refused. */
const perAccountAndAddress = new RateLimiterMemory({ keyPrefix: 'signin-acct-addr', points: 10, duration: WINDOW_SECONDS });
/** A wider net for one address trying many accounts. */
const perAddress = new RateLimiterMemory({ keyPrefix: 'signin-addr', points: 50, duration: WINDOW_SECONDS });

function keys(email: string, address: string) {
  return { pair: `${email.trim().toLowerCase()}|${address}`, address };
}

/** Seconds to wait before another try is allowed, or 0 when one may try now. */
export async function signInRetryAfter(email: string, address: string): Promise<number> {
  const k = keys(email, address);
  const [pair, addr] = await Promise.all([perAccountAndAddress.get(k.pair), perAddress.get(k.address)]);
  const limited = [pair, addr].filter((r): r is RateLimiterRes => !!r && r.remainingPoints <= 0);
  if (!limited.length) return 0;
  return Math.max(1, Math.ceil(Math.max(...limited.map((r) => r.msBeforeNext)) / 1000));
}

export async function recordSignInFailure(email: string, address: string): Promise<void> {
  const k = keys(email, address);
  await Promise.all([perAccountAndAddress.penalty(k.pair, 1), perAddress.penalty(k.address, 1)]);
}

/** A right password clears the account's count from that address. */
export async function clearSignInFailures(email: string, address: string): Promise<void> {
  await perAccountAndAddress.delete(keys(email, address).pair);
}
