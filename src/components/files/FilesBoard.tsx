import { useState } from 'react';
import useSWR from 'swr';
import { fetcher, type ApiError } from '~/components/api/client';
import { addToFiles, filesKey, type FilesAnswer } from '~/components/api/files';
import type { FileView, PageRef } from '~/lib/schemas/file';
import { FileCard } from './FileCard';
import { Uploader } from './Uploader';

interface Props {
  venueSlug: string;
  initialFiles: FileView[];
  pages: PageRef[];
  mayUpload: boolean;
  mayDelete: boolean;
}

/**
 * How many cards the grid shows before "Show more": a venue of many hundred photos would
 * otherwise lay out (and load thumbnails for) all of them on a phone at once.
 */
export const FILES_AT_ONCE = 60;

/** The venue's photos and files: an uploader for those who may, then the grid. */
export default function FilesBoard({ venueSlug, initialFiles, pages, mayUpload, mayDelete }: Props) {
  const { data, mutate, error } = useSWR<FilesAnswer, ApiError>(filesKey(venueSlug), fetcher, { fallbackData: { files: initialFiles }, revalidateOnMount: false });
  const files = data?.files ?? initialFiles;
  const [shown, setShown] = useState(FILES_AT_ONCE);
  const rest = files.length - shown;
  const change = (edit: (list: FileView[]) => FileView[]) => mutate((answer) => ({ files: edit(answer?.files ?? []) }), { revalidate: false });

  return (
    <div className="space-y-8">
      {mayUpload && (
        <section aria-labelledby="upload-heading" className="rounded-xl border border-line bg-sunken/40 p-4">
          <h2 id="upload-heading" className="mb-3 text-lg font-semibold">
            Add photos and files
          </h2>
          <Uploader venueSlug={venueSlug} pages={pages} onUploaded={(file) => addToFiles(mutate, file)} />
        </section>
      )}
      <section aria-labelledby="files-heading">
        <h2 id="files-heading" className="mb-3 text-lg font-semibold">
          {files.length === 1 ? '1 file' : `${files.length} files`}
        </h2>
        {error && (
          <p className="mb-3 text-sm text-danger" role="alert">
            {error.error}
          </p>
        )}
        {files.length === 0 ? (
          <p className="text-muted">No photos or files yet.{mayUpload ? ' Photograph the racks, the patch bays and the rigging points, and add them here.' : ''}</p>
        ) : (
          <ul className="grid grid-cols-1 gap-4 min-[420px]:grid-cols-2 md:grid-cols-3 lg:grid-cols-4" data-testid="file-grid">
            {files.slice(0, shown).map((file) => (
              <FileCard
                key={file.id}
                file={file}
                venueSlug={venueSlug}
                mayEdit={mayUpload}
                mayDelete={mayDelete}
                onChanged={(next) => change((list) => list.map((f) => (f.id === next.id ? next : f)))}
                onDeleted={() => change((list) => list.filter((f) => f.id !== file.id))}
              />
            ))}
          </ul>
        )}
        {rest > 0 && (
          <p className="mt-4 flex flex-wrap items-center gap-3 text-sm">
            <button type="button" className="min-h-11 rounded-lg border border-line px-4 font-semibold hover:bg-sunken" onClick={() => setShown((n) => n + FILES_AT_ONCE)} data-testid="files-more">
              Show {Math.min(FILES_AT_ONCE, rest)} more
            </button>
            <span className="text-muted" aria-live="polite">
              {shown} of {files.length} shown
            </span>
          </p>
        )}
      </section>
    </div>
  );
}
