import type { KeyedMutator } from 'swr';
import type { FileAnswer, FileDeleted, FileInUseBody, FilesAnswer } from '~/lib/api-types';
import type { FileView, PageRef } from '~/lib/schemas/file';
import { ApiError, request, venueApi } from './client';

export type { FilesAnswer };

/** SWR key of a venue's files (GET). */
export function filesKey(venue: string): string {
  return `${venueApi(venue)}/files`;
}

function fileApi(venue: string, fileId: string) {
  return `${filesKey(venue)}/${encodeURIComponent(fileId)}`;
}

export async function saveCaption(venue: string, fileId: string, caption: string): Promise<FileView> {
  const answer = await request<FileAnswer>(fileApi(venue, fileId), {
    method: 'PATCH',
    body: { caption },
    fallback: (status) => `The caption was not saved (HTTP ${status}).`,
    unreachable: 'Could not reach Throwline; the caption was not saved. Try again.',
  });
  return answer.file;
}

export type DeleteResult = { kind: 'deleted' } | { kind: 'in-use'; usedBy: PageRef[]; message: string };

/**
 * Deletes a file. Without `confirmed`, a file some page shows is kept and the answer names those
 * pages (the server's 409), so the person can be asked again.
 */
export async function deleteFile(venue: string, fileId: string, confirmed: boolean): Promise<DeleteResult> {
  try {
    await request<FileDeleted>(`${fileApi(venue, fileId)}${confirmed ? '?confirm=1' : ''}`, {
      method: 'DELETE',
      fallback: (status) => `The file was not deleted (HTTP ${status}).`,
      unreachable: 'Could not reach Throwline; the file was not deleted. Try again.',
    });
    return { kind: 'deleted' };
  } catch (err) {
    const usedBy = err instanceof ApiError && err.status === 409 ? (err.body as Partial<FileInUseBody>).usedBy : undefined;
    if (usedBy) return { kind: 'in-use', usedBy, message: (err as ApiError).error };
    throw err;
  }
}

/** Puts a freshly stored file at the head of a cached list, so it shows up without a refetch. */
export function addToFiles(mutate: KeyedMutator<FilesAnswer>, file: FileView) {
  return mutate((answer) => ({ files: [file, ...(answer?.files ?? []).filter((f) => f.id !== file.id)] }), { revalidate: false });
}
