import { randomBytes, scrypt as scryptCallback, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/**
 * Passwords are hashed with scrypt from Node's own crypto module, at OWASP's recommended cost
 * (N = 2^17, r = 8, p = 1: 128 MiB and a few hundred milliseconds a hash). Node's scrypt needs no
 * native add-on, so a fresh install cannot end up with a binary that does not match the machine
 * (the argon2 package's prebuilt binary crashed on this one).
 * Stored as `scrypt$<log2 N>$<r>$<p>$<salt base64>$<hash base64>` so the cost can rise later.
 */
const COST = { log2N: 17, r: 8, p: 1 };
const KEY_BYTES = 32;

function scrypt(password: string, salt: Buffer, log2N: number, r: number, p: number): Promise<Buffer> {
  const N = 2 ** log2N;
  const options: ScryptOptions = { N, r, p, maxmem: 256 * N * r };
  return new Promise((resolve, reject) =>
    scryptCallback(password.normalize('NFC'), salt, KEY_BYTES, options, (err, key) => (err ? reject(err) : resolve(key))),
  );
}

export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await scrypt(password, salt, COST.log2N, COST.r, COST.p);
  return ['scrypt', COST.log2N, COST.r, COST.p, salt.toString('base64'), key.toString('base64')].join('$');
}

export async function verifyPassword(stored: string | null | undefined, password: string): Promise<boolean> {
  if (!stored) return false;
  const [scheme, log2N, r, p, salt, hash] = stored.split('$');
  if (scheme !== 'scrypt' || !salt || !hash) return false;
  const params = [Number(log2N), Number(r), Number(p)];
  if (!params.every((n) => Number.isInteger(n) && n > 0) || params[0] > 20) return false;
  const expected = Buffer.from(hash, 'base64');
  const actual = await scrypt(password, Buffer.from(salt, 'base64'), params[0], params[1], params[2]);
  return expected.length === actual.length && timingSafeEqual(expected, actual);
}

/**
 * A valid hash of nothing anyone knows, verified when the account does not exist so that a
 * wrong e-mail and a wrong password take the same time.
 */
let decoy: Promise<string> | undefined;
export async function burnVerifyTime(password: string): Promise<void> {
  decoy ??= hashPassword(randomBytes(16).toString('hex'));
  await verifyPassword(await decoy, password);
}
