import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import { outboxDir } from './mailer';

export interface OutboxEntry {
  id: string;
  from: string;
  to: string;
  subject: string;
  date: Date | null;
  text: string;
}

/** The newest messages the local fake SMTP server kept, newest first. */
export async function listOutbox(limit = 50): Promise<OutboxEntry[]> {
  const dir = outboxDir();
  const names = (await readdir(dir).catch(() => [] as string[])).filter((n) => n.endsWith('.eml') && !n.startsWith('.'));
  names.sort().reverse();
  return Promise.all(
    names.slice(0, limit).map(async (name) => {
      const parsed = await simpleParser(await readFile(join(dir, name)));
      const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
      return { id: name.replace(/\.eml$/, ''), from: parsed.from?.text ?? '', to, subject: parsed.subject ?? '(no subject)', date: parsed.date ?? null, text: parsed.text ?? '' };
    }),
  );
}
