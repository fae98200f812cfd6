import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { z } from 'zod';

const boolFlag = z
  .enum(['0', '1', 'true', 'false'], { error: 'must be 1 or 0' })
  .transform((v) => v === '1' || v === 'true');

export const ConfigSchema = z.object({
  HOST: z.string().min(1, 'must name a host or address, e.g. localhost or 0.0.0.0').default('localhost'),
  PORT: z.coerce
    .number({ error: 'must be a port number' })
    .int('must be a whole number')
    .min(1, 'must be between 1 and 65535')
    .max(65535, 'must be between 1 and 65535')
    .default(4321),
  DATABASE_URL: z
    .string()
    .regex(/^(file:|libsql:|https?:|wss?:)/, 'must be a libSQL URL such as file:./data/throwline.db or libsql://host')
    .default('file:./data/throwline.db'),
  UPLOADS_DIR: z.string().min(1, 'must be a folder path').default('./uploads'),
  AUTH_SECRET: z.string().min(32, 'must be at least 32 characters (e.g. `openssl rand -base64 33`)').optional(),
  SEED_DEMO: boolFlag.default(true),
  /** With SEED_DEMO: also put two demo drawings through the upload pipeline into demo pages. */
  SEED_DEMO_PHOTOS: boolFlag.default(true),
  DEMO_PASSWORD: z.string().min(8, 'must be at least 8 characters').default('throwline-demo'),
  SMTP_URL: z.string().regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL').optional(),
  /** Port of the local fake SMTP server started when SMTP_URL is unset (0 picks a free one). */
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  /** Set to 1 only behind a TLS-terminating proxy that sets X-Forwarded-Proto. */
  AUTH_TRUST_HOST: boolFlag.default(true),
  /**
   * Addresses of the reverse proxy in front of the server, comma-separated. Only a request whose
   * socket peer is one of these may name the client in X-Forwarded-For (read by src/cli/serve.mjs).
   */
  /**
   * The address people reach this server at (e.g. https://book.example.org). Links in e-mail are
   * built from it; without it they use the address of the request that caused the mail.
   */
  PUBLIC_URL: z.url('must be a full URL such as https://book.example.org').optional(),
  TRUST_PROXY: z.string().regex(/^[0-9a-fA-F:.,\s]*$/, 'must be IP addresses separated by commas').optional(),
  /** An upload body that sends nothing for this long is answered 408 and its temp file removed. */
  UPLOAD_IDLE_SECONDS: z.coerce.number({ error: 'must be a number of seconds' }).min(0.1, 'must be at least 0.1 s').max(600, 'must be at most 600 s').default(30),
  /**
   * Strict-Transport-Security max-age in seconds; 0 (the default) sends none. Set it only when
   * the site is reached over https (directly or behind a TLS-terminating proxy).
   */
  HSTS_MAX_AGE: z.coerce.number({ error: 'must be a number of seconds' }).int('must be a whole number of seconds').min(0, 'must be 0 or more').max(63_072_000, 'must be at most two years (63072000)').default(0),
});

export type Config = z.infer<typeof ConfigSchema> & { AUTH_SECRET: string; DATA_DIR: string };

export class ConfigError extends Error {}

/** Turns env into a typed config; the message names each bad variable and what it must be. */
export function parseConfig(env: Record<string, string | undefined>): z.infer<typeof ConfigSchema> {
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const result = ConfigSchema.safeParse(cleaned);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message} (got ${JSON.stringify(cleaned[String(i.path[0])])})`);
    throw new ConfigError(`Throwline cannot start: the configuration has ${lines.length} problem(s):\n${lines.join('\n')}`);
  }
  return result.data;
}

/** Folder for the local database and the generated secret; beside the database when it is a file. */
export function dataDirFor(databaseUrl: string): string {
  if (databaseUrl.startsWith('file:')) return dirname(resolve(databaseUrl.slice('file:'.length)));
  return resolve('data');
}

/**
 * The session secret: from AUTH_SECRET, or generated once into data/auth-secret so restarts keep
 * people signed in. Never written anywhere a build would pick it up.
 */
export function resolveAuthSecret(explicit: string | undefined, dataDir: string): string {
  if (explicit) return explicit;
  const file = resolve(dataDir, 'auth-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(33).toString('base64');
  writeFileSync(file, secret + '\n', { mode: 0o600, flag: 'wx' });
  return secret;
}

let cached: Config | undefined;

export function getConfig(): Config {
  if (cached) return cached;
  const parsed = parseConfig(process.env);
  const DATA_DIR = dataDirFor(parsed.DATABASE_URL);
  const AUTH_SECRET = resolveAuthSecret(parsed.AUTH_SECRET, DATA_DIR);
  process.env.AUTH_SECRET = AUTH_SECRET;
  cached = { ...parsed, AUTH_SECRET, DATA_DIR };
  return cached;
}
