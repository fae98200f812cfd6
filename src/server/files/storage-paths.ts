import { randomUUID } from 'node:crypto';
import { join, resolve } from 'node:path';
import { getConfig } from '~/server/config';

/**
 * Where uploads live. Stored names are made only by this module from a SHA-256 hex digest, and
 * every path is checked against that shape again, so no text from a request ever reaches a path.
 */
export const STORED_NAME = /^[0-9a-f]{64}(\.(jpg|png|webp|pdf|txt)|-display\.(webp|json)|-thumb\.webp)$/;

export function uploadsDir(): string {
  return resolve(getConfig().UPLOADS_DIR);
}

/** Temporary files sit inside UPLOADS_DIR, on the same filesystem, so publishing is one rename. */
export function tempDir(): string {
  return join(uploadsDir(), '.tmp');
}

export function newTempPath(label: string): string {
  return join(tempDir(), `${randomUUID()}.${label}`);
}

export function storedPath(name: string): string {
  if (!STORED_NAME.test(name)) throw new Error(`Refusing an unexpected stored file name: ${JSON.stringify(name)}`);
  return join(uploadsDir(), name);
}

export type Rendition = 'original' | 'display' | 'thumb';

/** Names derive from the hash of the stored original; renditions are made from it deterministically. */
export function storedNameFor(sha256Hex: string, rendition: Rendition, ext: string): string {
  // A trace's display rendition is its parsed form (JSON); a photo's is a WebP.
  if (rendition === 'display') return `${sha256Hex}-display.${ext === 'json' ? 'json' : 'webp'}`;
  if (rendition === 'thumb') return `${sha256Hex}-thumb.webp`;
  return `${sha256Hex}.${ext}`;
}
