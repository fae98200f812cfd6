import { sql } from 'drizzle-orm';
import type { Db } from '~/db/client';
import { auditEvents, guestPasses, memberships, pages, revisions, sections, users, venues } from '~/db/schema';
import { demoPeople, demoVenues } from './seed-data';
import { docPlainText } from '~/lib/doc/render-html';
import { hashPassword } from '~/server/auth/password';
import { newSecretToken, tokenHash } from '~/server/secret-token';
import { reindexPage } from '~/server/search-index';

export interface SeedResult {
  seeded: boolean;
  accounts: { email: string; role: string }[];
  /** The demo guest pass's link (path only); printed once on first seed, never stored. */
  guestLink?: string;
}

/** Days ago each demo page was last checked on site; a power page past six months shows the warning. */
const CHECKED_DAYS_AGO: Record<string, number> = { 'power-distribution': 240, 'rigging-points': 45 };

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Fills an EMPTY database with the two invented demo venues and the demo accounts. A database
 * with any user in it is left alone, so restarting never duplicates or resets anything.
 */
export async function seedDemo(db: Db, password: string, now = Date.now()): Promise<SeedResult> {
  const [{ count }] = await db.select({ count: sql<number>`count(*)` }).from(users);
  if (count > 0) return { seeded: false, accounts: [] };

  const hash = await hashPassword(password);
  const guestToken = newSecretToken();
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

      let advancePosition = 0;
      for (const p of v.pages) {
        const last = p.revisions[p.revisions.length - 1];
        const checkedDays = CHECKED_DAYS_AGO[p.slug] ?? (p.section === 'power' || p.section === 'rigging' ? 30 : undefined);
        const [page] = await tx
          .insert(pages)
          .values({
            venueId: venue.id,
            sectionId: sectionIds[p.section],
            slug: p.slug,
            title: p.title,
            inAdvance: p.inAdvance,
            advancePosition: p.inAdvance ? advancePosition++ : 0,
            checkedAt: checkedDays === undefined ? null : new Date(now - checkedDays * DAY_MS),
            checkedBy: checkedDays === undefined ? null : ids.engineer,
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
        await reindexPage(tx, page.id);
        // The audit log tells the same story as the history.
        await tx.insert(auditEvents).values(
          p.revisions.map((r, i) => ({
            venueId: venue.id,
            actorId: ids[r.author] ?? ids.manager,
            action: i === 0 ? 'page.create' : 'page.save',
            targetType: 'page',
            targetId: page.id,
            detail: { slug: p.slug, revision: i + 1, summary: r.summary },
            createdAt: new Date(now - r.daysAgo * DAY_MS + i * 60_000),
          })),
        );
      }
      if (index === 0) {
        await tx.insert(auditEvents).values([
          { venueId: venue.id, actorId: ids.manager, action: 'member.role', targetType: 'member', targetId: ids.viewer, detail: { email: demoPeople.viewer.email, from: 'engineer', to: 'viewer' }, createdAt: new Date(now - 20 * DAY_MS) },
          { venueId: venue.id, actorId: ids.manager, action: 'pass.create', targetType: 'pass', targetId: null, detail: { label: 'The Lantern Choir — Friday show' }, createdAt: new Date(now - DAY_MS) },
        ]);
        // A pass for an invented touring act, running to the end of the day after tomorrow's show.
        await tx.insert(guestPasses).values({
          venueId: venue.id,
          label: 'The Lantern Choir — Friday show',
          tokenHash: tokenHash(guestToken),
          expiresAt: new Date(now + 3 * DAY_MS),
          createdBy: ids.manager,
          createdAt: new Date(now - DAY_MS),
        });
      }
    }
  });

  return {
    seeded: true,
    guestLink: `/advance/${guestToken}`,
    accounts: [
      { email: demoPeople.admin.email, role: 'instance admin' },
      { email: demoPeople.manager.email, role: `manager of both demo venues` },
      { email: demoPeople.engineer.email, role: `engineer at ${demoVenues[0].name}` },
      { email: demoPeople.viewer.email, role: `viewer at ${demoVenues[0].name}` },
      { email: demoPeople.othermanager.email, role: `manager of ${demoVenues[1].name} only` },
    ],
  };
}
