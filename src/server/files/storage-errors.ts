import { HttpError } from '~/server/http';

const FULL_CODES = new Set(['ENOSPC', 'EDQUOT', 'EFBIG']);

export function isStorageFull(err: unknown): boolean {
  return typeof err === 'object' && err !== null && FULL_CODES.has(String((err as { code?: unknown }).code));
}

export const STORAGE_FULL_MESSAGE =
  "The server's file storage is full, so nothing was saved. Ask whoever runs this Throwline to free some space, then upload again.";

/** A full disk is the server's problem, not the person's: 507 with a sentence, never a 500. */
export function asStorageError(err: unknown): unknown {
  return isStorageFull(err) ? new HttpError(507, STORAGE_FULL_MESSAGE) : err;
}
