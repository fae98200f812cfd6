import { createHash } from 'node:crypto';
import { rm } from 'node:fs/promises';
import { files } from '~/db/schema';
import { cleanDisplayName, withExtension } from '~/lib/file-name';
import { FileUploadFieldsSchema, type FileView } from '~/lib/schemas/file';
import { recordAudit } from '~/server/audit';
import { getDb, writeTx } from '~/server/db';
import type { VenueRow } from '~/server/guard';
import { HttpError, parseWith } from '~/server/http';
import { pageBySlug } from '~/server/pages';
import type { SessionUser } from '~/server/session';
import { fsyncFile, publish, writeDurably } from './durable-write';
import { loadVenueFile } from './file-records';
import { processImage } from './process-image';
import { receiveUpload } from './receive-upload';
import { readTraceUpload, TRACE_MIME } from './read-trace-upload';
import { NOT_ACCEPTED, sniffType } from './sniff-type';
import { asStorageError } from './storage-errors';
import { ensureStorageReady } from './storage-sweep';
import { newTempPath, storedNameFor, storedPath } from './storage-paths';

interface Prepared {
  /** Flushed temp files and the content-derived names they take. */
  moves: { temp: string; name: string }[];
  storageName: string;
  displayName: string | null;
  thumbName: string | null;
  mime: string;
  sizeBytes: number;
  width: number | null;
  height: number | null;
  originalName: string;
}

/**
 * The whole upload: stream to a temp file (capped) → decide the type from the bytes → for
 * photos, re-encode without metadata and make the display size and thumbnail → flush each temp
 * file → inside one write transaction, rename to content-derived names and insert the row.
 * Whatever fails, every temp file is removed before the answer goes out.
 */
export async function saveUpload(request: Request, venue: VenueRow, actor: SessionUser): Promise<FileView> {
  await ensureStorageReady();
  const temps: string[] = [];
  try {
    const received = await receiveUpload(request);
    temps.push(received.tempPath);
    const fields = parseWith(FileUploadFieldsSchema, received.fields);
    const pageId = fields.page ? await findPageId(venue.id, fields.page) : null;
    const prepared = await prepare(received, temps);
    const id = await writeTx(async (tx) => {
      const created: string[] = [];
      try {
        for (const move of prepared.moves) if (await publish(move.temp, storedPath(move.name))) created.push(move.name);
        const { moves: _moves, ...columns } = prepared;
        const [row] = await tx
          .insert(files)
          .values({ ...columns, venueId: venue.id, pageId, caption: fields.caption, uploadedBy: actor.id })
          .returning({ id: files.id });
        await recordAudit(tx, {
          venueId: venue.id,
          actorId: actor.id,
          action: 'file.upload',
          targetType: 'file',
          targetId: row.id,
          detail: { name: prepared.originalName, mime: prepared.mime, sizeBytes: prepared.sizeBytes },
        });
        return row.id;
      } catch (err) {
        for (const name of created) await rm(storedPath(name), { force: true });
        throw err;
      }
    });
    return await loadVenueFile(venue.id, id);
  } catch (err) {
    throw asStorageError(err);
  } finally {
    await Promise.all(temps.map((t) => rm(t, { force: true })));
  }
}

async function findPageId(venueId: string, slug: string): Promise<string> {
  const page = await pageBySlug(await getDb(), venueId, slug);
  if (!page) throw new HttpError(400, `This venue has no page "${slug}"; choose one of its pages or none.`, 'page');
  return page.id;
}

async function prepare(received: Awaited<ReturnType<typeof receiveUpload>>, temps: string[]): Promise<Prepared> {
  const type = await sniffType(received.tempPath);
  const name = cleanDisplayName(received.filename);
  if (type.kind === 'pdf') {
    // PDFs are kept byte for byte; the hash was taken while the bytes streamed in.
    await fsyncFile(received.tempPath);
    const storageName = storedNameFor(received.sha256, 'original', 'pdf');
    return {
      moves: [{ temp: received.tempPath, name: storageName }],
      storageName,
      displayName: null,
      thumbName: null,
      mime: 'application/pdf',
      sizeBytes: received.sizeBytes,
      width: null,
      height: null,
      originalName: name,
    };
  }
  if (type.kind === 'text') {
    // The original text is kept byte for byte (it is what the engineer exported); the parsed,
    // compact form is stored beside it as the trace's "display" rendition, read by every plot.
    const { compact } = await readTraceUpload(received.tempPath, NOT_ACCEPTED);
    await fsyncFile(received.tempPath);
    const storageName = storedNameFor(received.sha256, 'original', 'txt');
    const compactTemp = newTempPath('json');
    temps.push(compactTemp);
    await writeDurably(compactTemp, compact);
    const displayName = storedNameFor(received.sha256, 'display', 'json');
    return {
      moves: [
        { temp: received.tempPath, name: storageName },
        { temp: compactTemp, name: displayName },
      ],
      storageName,
      displayName,
      thumbName: null,
      mime: TRACE_MIME,
      sizeBytes: received.sizeBytes,
      width: null,
      height: null,
      originalName: name,
    };
  }
  const image = await processImage(received.tempPath, type.format);
  await rm(received.tempPath, { force: true });
  const hash = createHash('sha256').update(image.original.bytes).digest('hex');
  const renditions = [
    { rendition: image.original, name: storedNameFor(hash, 'original', image.original.ext) },
    { rendition: image.display, name: storedNameFor(hash, 'display', 'webp') },
    { rendition: image.thumb, name: storedNameFor(hash, 'thumb', 'webp') },
  ];
  const moves: Prepared['moves'] = [];
  for (const { rendition, name: storedName } of renditions) {
    const temp = newTempPath(rendition.ext);
    temps.push(temp);
    await writeDurably(temp, rendition.bytes);
    moves.push({ temp, name: storedName });
  }
  return {
    moves,
    storageName: moves[0].name,
    displayName: moves[1].name,
    thumbName: moves[2].name,
    mime: image.original.mime,
    sizeBytes: image.original.bytes.byteLength,
    width: image.width,
    height: image.height,
    originalName: type.format === 'heif' ? withExtension(name, 'jpg') : name,
  };
}
