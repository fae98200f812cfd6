/**
 * Upload limits shared by the server and the browser. Kept apart from the zod schemas so the
 * uploader islands do not ship a validation library just to read three constants.
 */

/** One uploaded file may be at most 25 MiB; the server refuses more before or while reading. */
export const MAX_UPLOAD_BYTES = 25 * 1024 * 1024;

/** What the file picker offers; on a phone `image/*` opens the camera roll and the camera. */
export const UPLOAD_ACCEPT = 'image/*,application/pdf';

/** The files screen also takes measurement traces exported as text. */
export const UPLOAD_ACCEPT_WITH_TRACES = `${UPLOAD_ACCEPT},text/plain,text/csv,.txt,.csv,.tsv`;

export const MAX_CAPTION_CHARS = 500;
