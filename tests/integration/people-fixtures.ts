import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { createClient, type Client as DbClient } from '@libsql/client';
import { simpleParser } from 'mailparser';
import { DEMO } from '../helpers/paths';
import type { TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';

export type Member = keyof typeof DEMO;
export type Who = Member | 'signedOut';

export interface People {
  as: Record<Who, Client>;
  /** The demo's home venue (everyone is a member) and the second venue (managers only). */
  venue: string;
  otherVenue: string;
  db: DbClient;
}

export async function signInEveryone(server: TestServer): Promise<People> {
  const as = {} as Record<Who, Client>;
  for (const who of Object.keys(DEMO) as Member[]) as[who] = await signIn(server.url, DEMO[who]);
  as.signedOut = anonymous(server.url);
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  const all = (await (await as.admin.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  const venue = mine.venues[0].slug;
  return { as, venue, otherVenue: all.venues.find((v) => v.slug !== venue)!.slug, db: createClient({ url: `file:${server.dbPath}` }) };
}

export interface ReceivedMail {
  to: string;
  subject: string;
  text: string;
  headers: Map<string, unknown>;
}

/** Every message the local stand-in SMTP server received, oldest first, parsed from the wire bytes. */
export async function outbox(server: TestServer): Promise<ReceivedMail[]> {
  const dir = join(server.dir, 'outbox');
  let names: string[] = [];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith('.eml') && !n.startsWith('.')).sort();
  } catch {
    return [];
  }
  return Promise.all(
    names.map(async (n) => {
      const parsed = await simpleParser(readFileSync(join(dir, n)));
      const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
      return { to, subject: parsed.subject ?? '', text: parsed.text ?? '', headers: parsed.headers };
    }),
  );
}

/** Waits for a message to this address (mail is sent before the route answers, but be kind to slow disks). */
export async function mailTo(server: TestServer, address: string, count = 1): Promise<ReceivedMail> {
  for (let i = 0; i < 50; i++) {
    // Exact address: "engineer@…" must not match "new.engineer@…".
    const mine = (await outbox(server)).filter((m) => m.to.split(/[\s,<>]+/).includes(address));
    if (mine.length >= count) return mine[count - 1];
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`No mail #${count} to ${address} arrived`);
}

export function linkIn(text: string, path: string): string {
  const match = new RegExp(`https?://[^\\s]+${path}[A-Za-z0-9_-]+`).exec(text);
  if (!match) throw new Error(`No ${path} link in: ${text}`);
  return match[0];
}

export async function userIdOf(db: DbClient, email: string): Promise<string> {
  const { rows } = await db.execute({ sql: 'select id from users where email = ?', args: [email] });
  return String(rows[0].id);
}
