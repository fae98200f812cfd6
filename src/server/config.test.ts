import { mkdtempSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, dataDirFor, parseConfig, resolveAuthSecret } from './config';

describe('parseConfig', () => {
  it('gives the documented defaults for an empty environment', () => {
    expect(parseConfig({})).toMatchObject({
      HOST: 'localhost',
      PORT: 4321,
      DATABASE_URL: 'file:./data/throwline.db',
      UPLOADS_DIR: './uploads',
      SEED_DEMO: true,
      DEMO_PASSWORD: 'throwline-demo',
    });
  });

  it('names every bad variable and what it must be', () => {
    let message = '';
    try {
      parseConfig({ PORT: 'eighty', DATABASE_URL: 'postgres://x', SEED_DEMO: 'yes', AUTH_SECRET: 'short' });
    } catch (err) {
      expect(err).toBeInstanceOf(ConfigError);
      message = (err as Error).message;
    }
    expect(message).toMatch(/PORT: must be a port number/);
    expect(message).toMatch(/DATABASE_URL: must be a libSQL URL/);
    expect(message).toMatch(/SEED_DEMO: must be 1 or 0/);
    expect(message).toMatch(/AUTH_SECRET: must be at least 32 characters/);
  });

  it('refuses a port out of range', () => {
    expect(() => parseConfig({ PORT: '70000' })).toThrow(/between 1 and 65535/);
  });

  it('treats empty strings as unset', () => {
    expect(parseConfig({ PORT: '', SMTP_URL: '' }).PORT).toBe(4321);
  });
});

describe('resolveAuthSecret', () => {
  it('generates a secret once, private to the owner, and reuses it', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tl-secret-'));
    const first = resolveAuthSecret(undefined, dir);
    expect(first.length).toBeGreaterThanOrEqual(40);
    expect(resolveAuthSecret(undefined, dir)).toBe(first);
    expect(readFileSync(join(dir, 'auth-secret'), 'utf8').trim()).toBe(first);
    expect(statSync(join(dir, 'auth-secret')).mode & 0o077).toBe(0);
  });

  it('prefers AUTH_SECRET from the environment', () => {
    expect(resolveAuthSecret('e'.repeat(40), '/nonexistent')).toBe('e'.repeat(40));
  });
});

describe('dataDirFor', () => {
  it('puts data beside a file database', () => {
    expect(dataDirFor('file:/srv/tl/db.sqlite')).toBe('/srv/tl');
  });
});
