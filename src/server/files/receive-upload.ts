import busboy from 'busboy';
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { MAX_CAPTION_CHARS, MAX_UPLOAD_BYTES } from '~/lib/schemas/file';
import { getConfig } from '~/server/config';
import { HttpError } from '~/server/http';
import { asStorageError } from './storage-errors';
import { newTempPath, tempDir } from './storage-paths';

/** Room for the part headers and the caption and page fields around the file itself. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;
export const MAX_BODY_BYTES = MAX_UPLOAD_BYTES + MULTIPART_OVERHEAD_BYTES;
/**
 * After refusing a body we keep reading (and dropping) up to this much of it, so the client
 * finishes sending and sees our answer instead of a reset connection. Past it, we hang up.
 */
const DRAIN_LIMIT_BYTES = 64 * 1024 * 1024;

export interface ReceivedUpload {
  /** The file's bytes, flushed, in UPLOADS_DIR/.tmp; the caller removes or publishes it. */
  tempPath: string;
  sizeBytes: number;
  sha256: string;
  /** The name from the part header, uncleaned (busboy has already cut it to its last segment). */
  filename: string;
  fields: Record<string, string>;
}

interface FilePart {
  tempPath: string;
  filename: string;
  stream: Readable;
  done: Promise<{ size: number; sha256: string }>;
}

export const tooLarge = () =>
  new HttpError(413, `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MiB. Send a smaller file (for a photo: a smaller size from the phone's share menu).`, 'file');

const stalled = (seconds: number) =>
  new HttpError(408, `The upload stopped sending for ${seconds} s; check the connection and upload the file again.`, 'file');

/** One read of the body, or a 408 when the client sends nothing for `idleMs`. */
async function readWithin(reader: ReadableStreamDefaultReader<Uint8Array>, idleMs: number) {
  let timer: NodeJS.Timeout | undefined;
  const idle = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(stalled(idleMs / 1000)), idleMs);
  });
  try {
    return await Promise.race([reader.read(), idle]);
  } finally {
    clearTimeout(timer);
  }
}

const interrupted = () => new HttpError(400, 'The upload stopped before it finished; upload the file again.', 'file');

function drainInBackground(reader: ReadableStreamDefaultReader<Uint8Array>): void {
  void (async () => {
    let drained = 0;
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) return;
        drained += value.byteLength;
        if (drained > DRAIN_LIMIT_BYTES) return void (await reader.cancel());
      }
    } catch {
      // The client went away; nothing left to drain.
    }
  })();
}

/**
 * Streams a multipart body into a temp file with a hard cap, hashing as it goes. Refuses
 * (413) before reading when the declared length is too big and while reading otherwise, so a
 * chunked body without a length cannot get past the cap either. A sender that goes quiet for
 * `idleMs` gets a 408 instead of holding a connection and a temp file. On any failure the temp
 * file is gone before this throws.
 */
export async function receiveUpload(request: Request, idleMs = getConfig().UPLOAD_IDLE_SECONDS * 1000): Promise<ReceivedUpload> {
  const contentType = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\b/i.test(contentType)) {
    throw new HttpError(415, 'Send the file as multipart/form-data, in a field named "file".', 'file');
  }
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > MAX_BODY_BYTES) {
    if (request.body) drainInBackground(request.body.getReader());
    throw tooLarge();
  }
  if (!request.body) throw new HttpError(400, 'The upload is empty; choose a file.', 'file');

  let bb: busboy.Busboy;
  try {
    bb = busboy({
      headers: { 'content-type': contentType },
      defParamCharset: 'utf8',
      // Busboy reports its limit on reaching it, so one byte more tells "exactly the cap" from "over".
      limits: { fileSize: MAX_UPLOAD_BYTES + 1, files: 1, fields: 6, parts: 8, fieldSize: MAX_CAPTION_CHARS * 4 + 64, fieldNameSize: 100 },
    });
  } catch {
    throw new HttpError(400, 'The upload has no multipart boundary; let the browser set the Content-Type header.', 'file');
  }
  await mkdir(tempDir(), { recursive: true });

  let failure: unknown = null;
  let signalFailure = () => {};
  const failed = new Promise<void>((resolve) => (signalFailure = resolve));
  const fail = (err: unknown) => {
    failure ??= err;
    signalFailure();
  };
  const fields: Record<string, string> = {};
  const state: { file: FilePart | null } = { file: null };

  bb.on('file', (name, stream, info) => {
    if (name !== 'file' || state.file) {
      // Busboy may destroy a skipped part with an error later; unheard, that would end the process.
      stream.on('error', () => undefined);
      stream.resume();
      fail(new HttpError(400, 'Send one file per upload, in the field named "file".', 'file'));
      return;
    }
    const tempPath = newTempPath('part');
    const hash = createHash('sha256');
    let size = 0;
    const hasher = new Transform({
      transform(chunk: Buffer, _enc, callback) {
        hash.update(chunk);
        size += chunk.byteLength;
        callback(null, chunk);
      },
    });
    stream.once('limit', () => fail(tooLarge()));
    // pipeline() reports this stream's errors while it runs; this covers a late destroy after.
    stream.on('error', () => undefined);
    const done = pipeline(stream, hasher, createWriteStream(tempPath, { flags: 'wx', mode: 0o640 })).then(() => ({ size, sha256: hash.digest('hex') }));
    done.catch((err) => fail(asStorageError(err)));
    state.file = { tempPath, filename: info.filename ?? '', stream, done };
  });
  bb.on('field', (name, value, info) => {
    if (info.valueTruncated) fail(new HttpError(400, `The ${name} field is too long.`, name));
    if (name === 'caption' || name === 'page') fields[name] = value;
  });
  bb.on('filesLimit', () => fail(new HttpError(400, 'Send one file per upload; the files screen sends several one after another.', 'file')));
  bb.on('partsLimit', () => fail(new HttpError(400, 'The upload has too many parts; send a file, a caption and a page at most.')));
  bb.on('fieldsLimit', () => fail(new HttpError(400, 'The upload has too many fields; send a caption and a page at most.')));
  const closed = new Promise<void>((resolve) => {
    bb.once('close', resolve);
    bb.on('error', () => {
      fail(new HttpError(400, 'The upload is not well-formed multipart data; upload the file again.', 'file'));
      resolve();
    });
  });

  const reader = request.body.getReader();
  let total = 0;
  let ended = false;
  let timedOut = false;
  try {
    while (!failure) {
      const { done, value } = await readWithin(reader, idleMs);
      if (done) {
        ended = true;
        bb.end();
        break;
      }
      total += value.byteLength;
      if (total > MAX_BODY_BYTES) fail(tooLarge());
      else if (!bb.write(value)) await Promise.race([drainedOrClosed(bb), failed]);
    }
    if (!failure) await Promise.race([closed, failed]);
    if (!failure && state.file) await state.file.done.catch(() => undefined);
  } catch (err) {
    timedOut = err instanceof HttpError && err.status === 408;
    fail(timedOut ? err : interrupted());
  }

  const received = state.file;
  if (failure || !received) {
    if (received) {
      // With an error: a plain destroy() of a stream that has pushed its end but not emitted it
      // leaves pipeline() waiting forever.
      received.stream.destroy(new Error('upload refused'));
      await received.done.catch(() => undefined);
      await rm(received.tempPath, { force: true });
    }
    bb.destroy();
    // A stalled sender is not waited for: hang up on it, the answer is already on its way.
    if (timedOut) void reader.cancel().catch(() => undefined);
    else if (!ended) drainInBackground(reader);
    throw failure ?? new HttpError(400, 'Choose a file to upload (the field named "file" is missing).', 'file');
  }
  const { size, sha256 } = await received.done;
  if (size === 0) {
    await rm(received.tempPath, { force: true });
    throw new HttpError(400, 'The file is empty; choose the photo or PDF again.', 'file');
  }
  return { tempPath: received.tempPath, sizeBytes: size, sha256, filename: received.filename, fields };
}

function drainedOrClosed(stream: busboy.Busboy): Promise<void> {
  return new Promise((resolve) => {
    const done = () => {
      stream.off('drain', done);
      stream.off('close', done);
      stream.off('error', done);
      resolve();
    };
    stream.on('drain', done);
    stream.on('close', done);
    stream.on('error', done);
  });
}
