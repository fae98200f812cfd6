import { eq } from 'drizzle-orm';
import { eqCurves } from '~/lib/doc/blocks/block-curves';
import { EQ_BLOCK, newTraceRef, type EqBlockAttrs } from '~/lib/doc/blocks/block-data';
import type { PmNode } from '~/lib/doc/types';
import { PageSaveSchema } from '~/lib/schemas/page';
import { users } from '~/db/schema';
import { getDb } from '~/server/db';
import { saveUpload } from '~/server/files/save-upload';
import { loadVenue } from '~/server/guard';
import { loadPageWithCurrent } from '~/server/pages';
import { saveRevision } from '~/server/revisions';

/**
 * Two invented measurements for the demo's mains EQ: "before" is an invented room (a low-end
 * build-up, a 2 kHz bump, air loss) measured with the EQ bypassed, "after" the same room through
 * the block's own computed curve, so after − before is exactly the EQ. Small seeded noise keeps
 * them looking measured and the same on every seed. Uploaded through the real pipeline.
 */

const PAGE = 'system-processing';

/** Mulberry32: a tiny seeded generator, so the demo is the same every time. */
function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function room(hz: number): number {
  const lowBuild = 6 / (1 + (hz / 120) ** 2);
  const bump = 3 * Math.exp(-((Math.log2(hz / 2000) / 0.5) ** 2));
  const air = -4 * (hz / 20_000) ** 1.5;
  return 82 + lowBuild + bump + air;
}

export function demoTraceText(block: EqBlockAttrs, withEq: boolean, seed: number): string {
  const curves = eqCurves(block);
  const rand = seeded(seed);
  const lines = ['# DEMO DATA: an invented measurement made up by the Throwline demo seed, not a real room', `# ${withEq ? 'after retune: room + the mains EQ' : 'before retune: room, EQ bypassed'}`, 'Hz\tdB\tcoherence'];
  curves.freqs.forEach((hz, i) => {
    if (hz < 20 || hz > 20_000) return;
    const noise = (rand() - 0.5) * 0.4;
    const db = room(hz) + (withEq ? curves.total[i]! : 0) + noise;
    const coherence = hz < 40 ? 0.35 + rand() * 0.2 : 0.85 + rand() * 0.14;
    lines.push(`${hz.toFixed(2)}\t${db.toFixed(2)}\t${coherence.toFixed(2)}`);
  });
  return lines.join('\n');
}

export async function seedDemoTraces(venueSlug: string, engineerEmail: string): Promise<number> {
  const db = await getDb();
  const engineer = await db.query.users.findFirst({ where: eq(users.email, engineerEmail), columns: { id: true, email: true, name: true, isAdmin: true } });
  if (!engineer) return 0;
  const { venue } = await loadVenue(engineer, venueSlug);
  const { page, revision } = await loadPageWithCurrent(venue.id, PAGE);
  if (!revision) return 0;
  const content = revision.doc.content ?? [];
  const at = content.findIndex((n) => n.type === EQ_BLOCK);
  if (at < 0) return 0;
  const block = content[at]!.attrs as unknown as EqBlockAttrs;
  const ids: string[] = [];
  for (const [withEq, name, seed] of [[false, 'demo-mains-before-retune.txt', 11], [true, 'demo-mains-after-retune.txt', 12]] as const) {
    const form = new FormData();
    form.set('caption', `Demo data (invented): mains ${withEq ? 'after' : 'before'} retune`);
    form.set('page', PAGE);
    form.set('file', new Blob([demoTraceText(block, withEq, seed)], { type: 'text/plain' }), name);
    const file = await saveUpload(new Request('http://seed.invalid/', { method: 'POST', body: form }), venue, engineer);
    ids.push(file.id);
  }
  const [before, after] = ids as [string, string];
  const traces = [
    { ...newTraceRef(before, 'before retune (demo)'), position: 'FOH mix position', smoothing: 6 as const },
    { ...newTraceRef(after, 'after retune (demo)'), position: 'FOH mix position', smoothing: 6 as const },
  ];
  const next: PmNode = { ...content[at]!, attrs: { ...block, traces, compare: { before, after } } };
  const doc: PmNode = { ...revision.doc, content: content.map((n, i) => (i === at ? next : n)) };
  const save = PageSaveSchema.parse({ doc, baseRevision: page.currentRevision, summary: 'Attached demo before/after measurements (invented data)' });
  await saveRevision(venue.id, page.slug, save, engineer);
  return 2;
}
