import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';

/** 256 random bits as base64url: 43 characters, fit for a URL path. */
export function newSecretToken(): string {
  return randomBytes(32).toString('base64url');
}

export const SECRET_TOKEN = /^[A-Za-z0-9_-]{43}$/;

/** Only this is stored: a leaked database does not hand out working links. */
export function tokenHash(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Constant-time comparison of two hex hashes of equal length. */
export function hashesEqual(a: string, b: string): boolean {
  const x = Buffer.from(a, 'hex');
  const y = Buffer.from(b, 'hex');
  return x.length === y.length && x.length > 0 && timingSafeEqual(x, y);
}
