import { scryptSync } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from './password';

describe('password hashing', () => {
  it('verifies the right password and refuses a wrong one', async () => {
    const stored = await hashPassword('throwline-demo');
    expect(stored).toMatch(/^scrypt\$17\$8\$1\$/);
    expect(await verifyPassword(stored, 'throwline-demo')).toBe(true);
    expect(await verifyPassword(stored, 'throwline-demO')).toBe(false);
  });

  it('salts: the same password never gives the same stored value', async () => {
    expect(await hashPassword('same')).not.toBe(await hashPassword('same'));
  });

  it('matches scrypt as RFC 7914 defines it (checked with a plain scryptSync call)', async () => {
    const salt = Buffer.from('0123456789abcdef');
    const key = scryptSync('pw', salt, 32, { N: 2 ** 10, r: 8, p: 1 });
    const stored = ['scrypt', 10, 8, 1, salt.toString('base64'), key.toString('base64')].join('$');
    expect(await verifyPassword(stored, 'pw')).toBe(true);
  });

  it('refuses malformed or hostile stored values instead of throwing', async () => {
    for (const bad of [null, '', 'plain', 'scrypt$99$8$1$AAAA$AAAA', 'argon2id$v=19$x', 'scrypt$x$y$z$a$b']) {
      expect(await verifyPassword(bad, 'pw')).toBe(false);
    }
  });
});
