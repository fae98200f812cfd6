import { open } from 'node:fs/promises';
import { fileTypeFromBuffer } from 'file-type';
import { HttpError } from '~/server/http';

export type ImageFormat = 'jpeg' | 'png' | 'webp' | 'heif';
export type AcceptedType = { kind: 'image'; format: ImageFormat; detected: string } | { kind: 'pdf' };

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

const NOT_ACCEPTED =
  'Throwline takes photos (JPEG, PNG, WebP, or HEIC from a phone) and PDFs. This file is not one of them';

/**
 * Decides the type from the bytes alone: the name and the declared Content-Type are ignored.
 * SVG, HTML, archives, video and everything unrecognised are refused.
 */
export async function sniffType(path: string): Promise<AcceptedType> {
  const head = await readHead(path);
  const found = await fileTypeFromBuffer(head);
  if (found?.mime === 'application/pdf' && head.subarray(0, 5).toString('latin1') === '%PDF-') return { kind: 'pdf' };
  const format = found ? IMAGE_TYPES[found.mime] : undefined;
  if (format) return { kind: 'image', format, detected: found!.mime };
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
