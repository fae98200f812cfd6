import { and, asc, eq, sql } from 'drizzle-orm';
import { pages, sections } from '~/db/schema';
import type { SectionCreate, SectionUpdate } from '~/lib/schemas/page';
import { slugify } from '~/lib/slug';
import { recordAudit } from './audit';
import { getDb, writeTx, type Tx } from './db';
import { HttpError } from './http';
import type { SessionUser } from './session';

const SECTION_NOT_FOUND = 'This venue has no such section.';

/** A venue's sections in reading order, with how many pages each holds. */
export async function listSectionsWithCounts(venueId: string) {
  const db = await getDb();
  return db
    .select({
      slug: sections.slug,
      title: sections.title,
      position: sections.position,
      // Spelled out: inside the subquery an unqualified "id" would be the page's.
      pageCount: sql<number>`(select count(*) from pages where pages.section_id = sections.id)`,
    })
    .from(sections)
    .where(eq(sections.venueId, venueId))
    .orderBy(asc(sections.position), asc(sections.title));
}

async function orderedInTx(tx: Tx, venueId: string) {
  return tx.select().from(sections).where(eq(sections.venueId, venueId)).orderBy(asc(sections.position), asc(sections.title));
}

export async function createSection(venueId: string, input: SectionCreate, actor: SessionUser) {
  const base = input.slug ?? (slugify(input.title) || 'section');
  return writeTx(async (tx) => {
    const existing = await orderedInTx(tx, venueId);
    const taken = new Set(existing.map((s) => s.slug));
    let slug = base;
    if (taken.has(slug)) {
      if (input.slug) throw new HttpError(409, `A section with the slug "${slug}" exists already; choose another.`, 'slug');
      for (let n = 2; taken.has(slug); n++) slug = `${base}-${n}`;
    }
    if (existing.length >= 50) throw new HttpError(400, 'A venue may have at most 50 sections; merge some first.');
    const position = existing.reduce((max, s) => Math.max(max, s.position), -1) + 1;
    const [section] = await tx.insert(sections).values({ venueId, slug, title: input.title, position }).returning();
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'section.create', targetType: 'section', targetId: section.id, detail: { slug, title: input.title } });
    return { slug: section.slug, title: section.title, position: section.position, pageCount: 0 };
  });
}

/** Renames a section and/or moves it one place up or down; positions are renumbered 0…n-1. */
export async function updateSection(venueId: string, sectionSlug: string | undefined, input: SectionUpdate, actor: SessionUser) {
  return writeTx(async (tx) => {
    const ordered = await orderedInTx(tx, venueId);
    const index = ordered.findIndex((s) => s.slug === sectionSlug);
    if (index < 0) throw new HttpError(404, SECTION_NOT_FOUND);
    const section = ordered[index];
    if (input.title !== undefined && input.title !== section.title) {
      await tx.update(sections).set({ title: input.title }).where(eq(sections.id, section.id));
    }
    if (input.move) {
      const target = input.move === 'up' ? index - 1 : index + 1;
      if (target >= 0 && target < ordered.length) {
        [ordered[index], ordered[target]] = [ordered[target], ordered[index]];
      }
      for (const [position, s] of ordered.entries()) {
        if (s.position !== position) await tx.update(sections).set({ position }).where(eq(sections.id, s.id));
      }
    }
    await recordAudit(tx, {
      venueId,
      actorId: actor.id,
      action: 'section.update',
      targetType: 'section',
      targetId: section.id,
      detail: { slug: section.slug, ...(input.title !== undefined ? { title: { from: section.title, to: input.title } } : {}), ...(input.move ? { move: input.move } : {}) },
    });
    return { slug: section.slug, title: input.title ?? section.title, position: ordered.findIndex((s) => s.id === section.id) };
  });
}

/** Only an empty section can go, so no page is ever left without one. */
export async function deleteSection(venueId: string, sectionSlug: string | undefined, actor: SessionUser) {
  return writeTx(async (tx) => {
    const [section] = await tx
      .select()
      .from(sections)
      .where(and(eq(sections.venueId, venueId), eq(sections.slug, sectionSlug ?? '')))
      .limit(1);
    if (!section) throw new HttpError(404, SECTION_NOT_FOUND);
    const [{ count }] = await tx.select({ count: sql<number>`count(*)` }).from(pages).where(eq(pages.sectionId, section.id));
    if (count > 0) throw new HttpError(409, `"${section.title}" still holds ${count} page${count === 1 ? '' : 's'}; move ${count === 1 ? 'it' : 'them'} to another section first.`);
    await tx.delete(sections).where(eq(sections.id, section.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'section.delete', targetType: 'section', targetId: section.id, detail: { slug: section.slug, title: section.title } });
  });
}
