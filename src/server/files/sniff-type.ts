import { open } from 'node:fs/promises';
import { fileTypeFromBuffer } from 'file-type';
import { HttpError } from '~/server/http';

export type ImageFormat = 'jpeg' | 'png' | 'webp' | 'heif';
export type AcceptedType = { kind: 'image'; format: ImageFormat; detected: string } | { kind: 'pdf' } | { kind: 'text' };

/** Enough for file-type's signatures (it reads at most ~4 KiB for the formats we take). */
const SNIFF_BYTES = 16 * 1024;

const IMAGE_TYPES: Record<string, ImageFormat> = {
  'image/jpeg': 'jpeg',
  'image/png': 'png',
  'image/apng': 'png',
  'image/webp': 'webp',
  'image/heic': 'heif',
  'image/heif': 'heif',
};

export const NOT_ACCEPTED =
  'Throwline takes photos (JPEG, PNG or WebP; an iPhone\'s HEIC photos shared as JPEG), PDFs and measurement traces (plain-text columns). This file is not one of them';

/**
 * Decides the type from the bytes alone: the name and the declared Content-Type are ignored.
 * SVG, HTML, archives, video and everything unrecognised are refused; unrecognised text goes on
 * to the trace reader, which refuses anything that is not columns of numbers.
 */
export async function sniffType(path: string): Promise<AcceptedType> {
  const head = await readHead(path);
  const found = await fileTypeFromBuffer(head);
  if (found?.mime === 'application/pdf' && head.subarray(0, 5).toString('latin1') === '%PDF-') return { kind: 'pdf' };
  const format = found ? IMAGE_TYPES[found.mime] : undefined;
  if (format) return { kind: 'image', format, detected: found!.mime };
  // Unrecognised bytes that look like text may be a measurement trace; the trace reader decides.
  if (!found && looksLikeText(head)) return { kind: 'text' };
  const what = found ? ` (it looks like ${found.ext.toUpperCase()})` : '';
  throw new HttpError(415, `${NOT_ACCEPTED}${what}. Export it as JPEG or PDF and upload it again.`, 'file');
}

async function readHead(path: string): Promise<Buffer> {
  const handle = await open(path, 'r');
  try {
    const buffer = Buffer.alloc(SNIFF_BYTES);
    const { bytesRead } = await handle.read(buffer, 0, SNIFF_BYTES, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/** No NUL and no C0 controls but tab, CR, LF and form feed in the first bytes: text, not binary. */
function looksLikeText(head: Buffer): boolean {
  if (head.length === 0) return false;
  if (head.subarray(0, 256).toString('latin1').trimStart().startsWith('<')) return false; // markup: SVG, HTML, XML
  for (const byte of head) if (byte < 0x20 && byte !== 0x09 && byte !== 0x0a && byte !== 0x0d && byte !== 0x0c) return false;
  return true;
}
