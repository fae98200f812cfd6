import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import type { PmNode } from '~/lib/doc/types';
import { getDb } from '~/server/db';
import { saveUpload } from '~/server/files/save-upload';
import { loadVenue } from '~/server/guard';
import { loadPageWithCurrent } from '~/server/pages';
import { PageSaveSchema } from '~/lib/schemas/page';
import { saveRevision } from '~/server/revisions';
import { users } from '~/db/schema';

/**
 * Two demo drawings (invented: a tail layout and a rack front), put into the demo venue exactly
 * as an engineer would: uploaded through the real upload pipeline, then inserted into a page by
 * a saved revision. Drawn as SVG here and rasterised to PNG before upload, because the upload
 * pipeline itself refuses SVG.
 */

const INK = '#1d1f24';
const PAPER = '#f6f4ef';
const LINE = '#8a857a';
const ACCENT = '#b3471d';

function label(x: number, y: number, text: string, size = 20, anchor = 'middle', fill = INK) {
  return `<text x="${x}" y="${y}" font-family="DejaVu Sans, sans-serif" font-size="${size}" text-anchor="${anchor}" fill="${fill}">${text}</text>`;
}

function tailLayoutSvg(): string {
  const tails: [string, number, number, string][] = [
    ['A', 560, 170, 'Drums'],
    ['B', 250, 300, 'Bass'],
    ['C', 560, 420, 'DS centre'],
    ['D', 850, 300, 'Guitars'],
    ['E', 1100, 330, 'Loose'],
  ];
  return `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="640">
  <rect width="1200" height="640" fill="${PAPER}"/>
  ${label(600, 44, 'Stage box tails — house layout (audience at the bottom)', 26)}
  <rect x="100" y="80" width="920" height="440" fill="#e6e1d6" stroke="${INK}" stroke-width="4"/>
  <rect x="440" y="110" width="240" height="120" fill="#d3ccbd" stroke="${LINE}" stroke-width="2"/>
  ${label(560, 140, 'Drum riser 2.4 × 2 m', 18)}
  <rect x="1030" y="80" width="140" height="300" fill="#ddd6c9" stroke="${INK}" stroke-width="3"/>
  ${label(1100, 110, 'SL wing', 18)}
  <rect x="1045" y="200" width="110" height="46" fill="${INK}"/>${label(1100, 230, 'SB1 48/16', 16, 'middle', PAPER)}
  <rect x="1045" y="260" width="110" height="36" fill="${INK}"/>${label(1100, 284, 'SB2 16/8', 16, 'middle', PAPER)}
  ${tails
    .map(
      ([name, x, y, where]) => `<path d="M1045 223 Q ${(x + 1045) / 2} ${y - 60} ${x} ${y}" fill="none" stroke="${ACCENT}" stroke-width="3" stroke-dasharray="8 6"/>
  <circle cx="${x}" cy="${y}" r="26" fill="${ACCENT}"/>${label(x, y + 8, name, 24, 'middle', '#fff')}${label(x, y + 52, where, 18)}`,
    )
    .join('\n')}
  <rect x="100" y="520" width="920" height="22" fill="${INK}"/>${label(560, 537, 'Stage edge', 16, 'middle', PAPER)}
  ${label(600, 600, 'Tails are labelled A–E at both ends; see the Stage box patch page for ports.', 18)}
</svg>`;
}

function rackFrontSvg(): string {
  const units: [string, string, string][] = [
    ['B1', 'Halvard HX4-10', 'Main R + subs S1–S3'],
    ['B2', 'Halvard HX4-10 (former spare)', 'Fills FF-C, subs S5–S6'],
    ['B3', 'Halvard HX4-10', 'Sub S4, three spare channels'],
  ];
  return `<svg xmlns="http://www.w3.org/2000/svg" width="900" height="700">
  <rect width="900" height="700" fill="${PAPER}"/>
  ${label(450, 50, 'Amp rack B, stage right — front view', 28)}
  <rect x="180" y="90" width="540" height="560" rx="8" fill="#2a2c31" stroke="${INK}" stroke-width="4"/>
  ${units
    .map(
      ([id, model, feeds], i) => `<rect x="210" y="${120 + i * 150}" width="480" height="120" rx="4" fill="#3b3e45" stroke="#595d66" stroke-width="2"/>
  ${label(240, 165 + i * 150, id, 30, 'start', '#f08a4b')}
  ${label(310, 160 + i * 150, model, 20, 'start', '#e9e6df')}
  ${label(310, 192 + i * 150, feeds, 18, 'start', '#a3a6ae')}
  ${[0, 1, 2, 3].map((c) => `<circle cx="${600 + c * 22}" cy="${215 + i * 150}" r="6" fill="#5cc48c"/>`).join('')}`,
    )
    .join('\n')}
  <rect x="210" y="570" width="480" height="56" rx="4" fill="#3b3e45" stroke="#595d66" stroke-width="2"/>
  ${label(450, 606, 'Power distribution 32 A (audio L3)', 18, 'middle', '#e9e6df')}
</svg>`;
}

async function png(svg: string): Promise<Blob> {
  const bytes = await sharp(Buffer.from(svg)).png().toBuffer();
  return new Blob([new Uint8Array(bytes)], { type: 'image/png' });
}

interface DemoPhoto {
  pageSlug: string;
  fileName: string;
  caption: string;
  summary: string;
  svg: () => string;
}

const PHOTOS: DemoPhoto[] = [
  { pageSlug: 'stage-box-patch', fileName: 'stage-box-tails.png', caption: 'Where the stage box tails land (house layout)', summary: 'Added a drawing of the tail layout', svg: tailLayoutSvg },
  { pageSlug: 'amp-racks', fileName: 'amp-rack-b-front.png', caption: 'Amp rack B after the B2 swap', summary: 'Added a front view of rack B', svg: rackFrontSvg },
];

export async function seedDemoPhotos(venueSlug: string, engineerEmail: string): Promise<number> {
  const db = await getDb();
  const engineer = await db.query.users.findFirst({ where: eq(users.email, engineerEmail), columns: { id: true, email: true, name: true, isAdmin: true } });
  if (!engineer) return 0;
  const { venue } = await loadVenue(engineer, venueSlug);
  // All drawings are rasterised first: the upload pipeline blocks sharp's SVG loader for the
  // rest of the process as soon as it handles its first file.
  const images = await Promise.all(PHOTOS.map((photo) => png(photo.svg())));
  let added = 0;
  for (const [index, photo] of PHOTOS.entries()) {
    const form = new FormData();
    form.set('caption', photo.caption);
    form.set('page', photo.pageSlug);
    form.set('file', images[index], photo.fileName);
    const file = await saveUpload(new Request('http://seed.invalid/', { method: 'POST', body: form }), venue, engineer);
    const { page, revision } = await loadPageWithCurrent(venue.id, photo.pageSlug);
    if (!revision || !file.displayUrl) continue;
    const image: PmNode = { type: 'image', attrs: { src: file.displayUrl, alt: photo.caption, title: null } };
    const doc: PmNode = { ...revision.doc, content: [...(revision.doc.content ?? []), image] };
    const save = PageSaveSchema.parse({ doc, baseRevision: page.currentRevision, summary: photo.summary });
    await saveRevision(venue.id, page.slug, save, engineer);
    added++;
  }
  return added;
}
