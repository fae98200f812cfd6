import { sql } from 'drizzle-orm';
import type { Db } from '~/db/client';
import { memberships, pages, revisions, sections, users, venues } from '~/db/schema';
import { demoPeople, demoVenues } from './seed-data';
import { docPlainText } from '~/lib/doc/render-html';
import { hashPassword } from '~/server/auth/password';

export interface SeedResult {
  seeded: boolean;
  accounts: { email: string; role: string }[];
}

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Fills an EMPTY database with the two invented demo venues and the demo accounts. A database
 * with any user in it is left alone, so restarting never duplicates or resets anything.
 */
export async function seedDemo(db: Db, password: string, now = Date.now()): Promise<SeedResult> {
  const [{ count }] = await db.select({ count: sql<number>`count(*)` }).from(users);
  if (count > 0) return { seeded: false, accounts: [] };

  const hash = await hashPassword(password);
  await db.transaction(async (tx) => {
    const ids: Record<string, string> = {};
    for (const [key, person] of Object.entries(demoPeople)) {
      const [row] = await tx
        .insert(users)
        .values({ email: person.email, name: person.name, passwordHash: hash, isAdmin: key === 'admin' })
        .returning({ id: users.id });
      ids[key] = row.id;
    }

    for (const [index, v] of demoVenues.entries()) {
      const [venue] = await tx.insert(venues).values({ slug: v.slug, name: v.name, town: v.town }).returning({ id: venues.id });
      // The first venue is the demo's home: everyone is in it. The second has its own manager,
      // so the demo engineer and viewer can see what "not a member" looks like.
      const members: [string, 'manager' | 'engineer' | 'viewer'][] =
        index === 0
          ? [
              ['manager', 'manager'],
              ['engineer', 'engineer'],
              ['viewer', 'viewer'],
            ]
          : [
              ['manager', 'manager'],
              ['othermanager', 'manager'],
            ];
      await tx.insert(memberships).values(members.filter(([key]) => ids[key]).map(([key, role]) => ({ venueId: venue.id, userId: ids[key], role })));

      const sectionIds: Record<string, string> = {};
      for (const [position, s] of v.sections.entries()) {
        const [row] = await tx.insert(sections).values({ venueId: venue.id, slug: s.slug, title: s.title, position }).returning({ id: sections.id });
        sectionIds[s.slug] = row.id;
      }

      for (const p of v.pages) {
        const last = p.revisions[p.revisions.length - 1];
        const [page] = await tx
          .insert(pages)
          .values({
            venueId: venue.id,
            sectionId: sectionIds[p.section],
            slug: p.slug,
            title: p.title,
            inAdvance: p.inAdvance,
            currentRevision: p.revisions.length,
            createdAt: new Date(now - p.revisions[0].daysAgo * DAY_MS),
            updatedAt: new Date(now - last.daysAgo * DAY_MS),
          })
          .returning({ id: pages.id });
        await tx.insert(revisions).values(
          p.revisions.map((r, i) => ({
            pageId: page.id,
            number: i + 1,
            doc: JSON.stringify(r.doc),
            plainText: docPlainText(r.doc),
            summary: r.summary,
            authorId: ids[r.author] ?? ids.manager,
            createdAt: new Date(now - r.daysAgo * DAY_MS + i * 60_000),
          })),
        );
      }
    }
  });

  return {
    seeded: true,
    accounts: [
      { email: demoPeople.admin.email, role: 'instance admin' },
      { email: demoPeople.manager.email, role: `manager of both demo venues` },
      { email: demoPeople.engineer.email, role: `engineer at ${demoVenues[0].name}` },
      { email: demoPeople.viewer.email, role: `viewer at ${demoVenues[0].name}` },
      { email: demoPeople.othermanager.email, role: `manager of ${demoVenues[1].name} only` },
    ],
  };
}
