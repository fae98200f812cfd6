import type { FileView } from '~/lib/schemas/file';
import { MAX_UPLOAD_BYTES } from '~/lib/upload-limits';

/** An upload the server (or the network) refused; `message` is a sentence to show as it is. */
export class UploadError extends Error {
  constructor(
    message: string,
    /** HTTP status; 0 when the connection failed or the upload was cancelled. */
    readonly status: number,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'UploadError';
  }
}

export interface UploadOptions {
  caption?: string;
  /** Slug of a page of the same venue the file is for (recorded with the file). */
  page?: string;
  /** Cancels the upload; the promise rejects with an UploadError of status 0. */
  signal?: AbortSignal;
}

/** Called as bytes leave the browser: fraction 0…1 of the request body sent. */
export type UploadProgress = (fraction: number, sentBytes: number, totalBytes: number) => void;

/**
 * Sends one photo or PDF to POST /api/venues/:venue/files with real progress (fetch cannot
 * report upload progress; XMLHttpRequest can). Resolves with the stored file: put
 * `file.displayUrl` (photos) or `file.url` (PDFs) into a page.
 */
export function uploadFile(venueSlug: string, file: Blob, options: UploadOptions = {}, onProgress?: UploadProgress): Promise<{ file: FileView }> {
  return new Promise((resolve, reject) => {
    if (file.size > MAX_UPLOAD_BYTES) {
      reject(new UploadError(`This file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MiB; choose a smaller one.`, 413, 'file'));
      return;
    }
    if (options.signal?.aborted) {
      reject(new UploadError('The upload was cancelled.', 0));
      return;
    }
    const form = new FormData();
    // Text fields first, so the server has them before the bytes.
    if (options.caption) form.append('caption', options.caption);
    if (options.page) form.append('page', options.page);
    form.append('file', file, file instanceof File ? file.name : 'upload');

    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/venues/${encodeURIComponent(venueSlug)}/files`);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total, event.loaded, event.total);
    };
    xhr.onload = () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status === 201 && body && typeof body === 'object' && 'file' in body) {
        resolve(body as { file: FileView });
        return;
      }
      const answer = (body ?? {}) as { error?: string; field?: string };
      reject(new UploadError(answer.error ?? `The upload failed (HTTP ${xhr.status}); try again.`, xhr.status, answer.field));
    };
    xhr.onerror = () => reject(new UploadError('The connection dropped during the upload; check the network and try again.', 0));
    xhr.onabort = () => reject(new UploadError('The upload was cancelled.', 0));
    options.signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}
