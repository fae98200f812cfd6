import type { FileAnswer } from '~/lib/api-types';
import { MAX_UPLOAD_BYTES } from '~/lib/upload-limits';
import { ApiError, apiErrorFrom, UNREACHABLE } from './client';
import { filesKey } from './files';

const CANCELLED = 'The upload was cancelled.';

export interface UploadOptions {
  caption?: string;
  /** Slug of a page of the same venue the file is for (recorded with the file). */
  page?: string;
  /** Cancels the upload; the promise rejects with an ApiError of status 0. */
  signal?: AbortSignal;
}

/** Called as bytes leave the browser: fraction 0…1 of the request body sent. */
export type UploadProgress = (fraction: number, sentBytes: number, totalBytes: number) => void;

/**
 * Sends one photo or PDF to POST /api/venues/:venue/files with real progress (fetch cannot
 * report upload progress; XMLHttpRequest can). Resolves with the stored file: put
 * `file.displayUrl` (photos) or `file.url` (PDFs) into a page. Rejects with an ApiError, the same
 * shape every other request of the islands refuses with.
 */
export function uploadFile(venueSlug: string, file: Blob, options: UploadOptions = {}, onProgress?: UploadProgress): Promise<FileAnswer> {
  return new Promise((resolve, reject) => {
    if (file.size > MAX_UPLOAD_BYTES) {
      reject(new ApiError(413, `This file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MiB; choose a smaller one.`, 'file'));
      return;
    }
    if (options.signal?.aborted) {
      reject(new ApiError(UNREACHABLE, CANCELLED));
      return;
    }
    const form = new FormData();
    // Text fields first, so the server has them before the bytes.
    if (options.caption) form.append('caption', options.caption);
    if (options.page) form.append('page', options.page);
    form.append('file', file, file instanceof File ? file.name : 'upload');

    const xhr = new XMLHttpRequest();
    xhr.open('POST', filesKey(venueSlug));
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total, event.loaded, event.total);
    };
    xhr.onload = () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status === 201 && body && typeof body === 'object' && 'file' in body) {
        resolve(body as FileAnswer);
        return;
      }
      reject(apiErrorFrom(xhr.status, body, (status) => `The upload failed (HTTP ${status}); try again.`));
    };
    xhr.onerror = () => reject(new ApiError(UNREACHABLE, 'The connection dropped during the upload; check the network and try again.'));
    xhr.onabort = () => reject(new ApiError(UNREACHABLE, CANCELLED));
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
