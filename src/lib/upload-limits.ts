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

const ACCEPTED_TYPES = /^(image\/(jpeg|png|webp|heic|heif)|application\/pdf|text\/(plain|csv|tab-separated-values))$/i;
const ACCEPTED_NAMES = /\.(jpe?g|png|webp|heic|heif|pdf|txt|csv|tsv)$/i;

/**
 * What the browser can tell before sending: too big, or plainly not a photo, PDF or trace. The
 * server decides from the bytes either way; this only spares a person a wait for a refusal that
 * was certain. Null means "send it".
 */
export function uploadPrecheck(file: { name: string; type: string; size: number }): string | null {
  if (file.size > MAX_UPLOAD_BYTES) return `${file.name} is larger than 25 MiB, so it will not be sent. Choose a smaller file.`;
  if (file.size === 0) return `${file.name} is empty, so it will not be sent.`;
  if (!ACCEPTED_TYPES.test(file.type) && !ACCEPTED_NAMES.test(file.name)) {
    return `${file.name} is not a photo, a PDF or a measurement trace, so it will not be sent.`;
  }
  return null;
}
