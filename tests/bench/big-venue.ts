import { randomUUID } from 'node:crypto';
import { createClient } from '@libsql/client';

/**
 * Adds an invented venue of `count` pages to a copy of the seeded database, written straight into
 * SQLite (the search triggers index it as they would any save), with the demo manager as its
 * manager. Text is drawn from a fixed word list with a fixed seed, so every run searches the same
 * 10,000 pages: "stage" is in most of them, "quokkaphone" in three.
 */
const WORDS = (
  'stage amp rack monitor wedge sub array fill delay speaker cable patch input output channel desk ' +
  'processor crossover limiter gain level power mains distro phase circuit breaker rigging point motor ' +
  'truss load chain shackle bridle hang height trim angle coverage balcony floor front back side left ' +
  'right centre mix foh engineer band drum bass guitar keys vocal mic stand di box loom snake network ' +
  'switch fibre clock sample rate dante wireless antenna frequency battery spare fuse door dock parking'
).split(' ');

function random(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32);
}

export async function addBigVenue(dbPath: string, managerEmail: string, count = 10_000): Promise<string> {
  const db = createClient({ url: `file:${dbPath}` });
  const rnd = random(20261203);
  const word = () => WORDS[Math.floor(rnd() * WORDS.length)];
  try {
    const manager = (await db.execute({ sql: 'select id from users where email = ?', args: [managerEmail] })).rows[0];
    const venueId = randomUUID();
    const now = Date.now();
    const slug = 'bench-arena';
    await db.batch(
      [
        { sql: 'insert into venues (id, slug, name, town, created_at) values (?, ?, ?, ?, ?)', args: [venueId, slug, 'Bench Arena', 'Nowhere', now] },
        { sql: "insert into memberships (venue_id, user_id, role, created_at) values (?, ?, 'manager', ?)", args: [venueId, String(manager.id), now] },
      ],
      'write',
    );
    const sections = Array.from({ length: 8 }, (_, i) => ({ id: randomUUID(), slug: `part-${i}`, title: `Part ${i + 1}` }));
    await db.batch(
      sections.map((s, i) => ({ sql: 'insert into sections (id, venue_id, slug, title, position) values (?, ?, ?, ?, ?)', args: [s.id, venueId, s.slug, s.title, i] })),
      'write',
    );
    const statements = [];
    for (let i = 0; i < count; i++) {
      const pageId = randomUUID();
      const words = Array.from({ length: 60 + Math.floor(rnd() * 80) }, word);
      if (i % 3 !== 0) words.splice(Math.floor(rnd() * words.length), 0, 'stage');
      if (i === 17 || i === 4242 || i === 9001) words.push('quokkaphone');
      const text = words.join(' ');
      const docJson = JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });
      const title = `${word()} ${word()} ${i}`;
      statements.push(
        { sql: 'insert into pages (id, venue_id, section_id, slug, title, in_advance, current_revision, created_at, updated_at) values (?, ?, ?, ?, ?, 0, 1, ?, ?)', args: [pageId, venueId, sections[i % sections.length].id, `page-${i}`, title, now, now] },
        { sql: "insert into revisions (id, page_id, number, doc, plain_text, summary, author_id, created_at) values (?, ?, 1, ?, ?, '', ?, ?)", args: [randomUUID(), pageId, docJson, text, String(manager.id), now] },
      );
    }
    for (let i = 0; i < statements.length; i += 2000) await db.batch(statements.slice(i, i + 2000), 'write');
    return slug;
  } finally {
    db.close();
  }
}
