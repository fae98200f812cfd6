import argon2 from 'argon2';

/** argon2id with the library's defaults (OWASP-recommended memory and time costs). */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export async function verifyPassword(hash: string | null | undefined, password: string): Promise<boolean> {
  if (!hash) return false;
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/**
 * A valid hash of nothing anyone knows, verified when the account does not exist so that a
 * wrong e-mail and a wrong password take the same time.
 */
let decoy: Promise<string> | undefined;
export async function burnVerifyTime(password: string): Promise<void> {
  decoy ??= hashPassword(crypto.randomUUID());
  await verifyPassword(await decoy, password);
}
