import type { Editor } from '@tiptap/react';
import { useEffect, useRef, useState } from 'react';
import useSWR from 'swr';
import { fetcher, type ApiError } from '~/components/api/client';
import { addToFiles, filesKey, type FilesAnswer } from '~/components/api/files';
import { insertFile } from './insert-file';
import { PhotoUpload } from './PhotoUpload';
import { VenueFilePicker } from './VenueFilePicker';

export interface PhotoTarget {
  venueSlug: string;
  /** Absent while the page is being created. */
  pageSlug?: string;
  /** From `can(user, 'file.upload', access)` on the server-rendered page. */
  mayUpload: boolean;
}

interface Props extends PhotoTarget {
  editor: Editor;
  /** True when the person never put the cursor into the text: add at the end, not before line one. */
  atEnd: boolean;
  onClose: () => void;
}

/** "Add a photo": a new one from this device, or one the venue already has, put in at the cursor. */
export function PhotoDialog({ editor, venueSlug, pageSlug, mayUpload, atEnd, onClose }: Props) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const [added, setAdded] = useState(false);
  const { data, error, mutate } = useSWR<FilesAnswer, ApiError>(filesKey(venueSlug), fetcher, { revalidateOnFocus: false });

  useEffect(() => {
    const dialog = dialogRef.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);

  return (
    <dialog
      ref={dialogRef}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      aria-labelledby="tl-photo-title"
      className="m-auto max-h-[calc(100dvh-1rem)] w-[min(36rem,calc(100vw-1rem))] overflow-y-auto rounded-xl border border-line bg-surface p-4 text-fg backdrop:bg-black/50 sm:p-5"
      data-testid="photo-dialog"
    >
      <div className="flex items-start justify-between gap-3">
        <h2 id="tl-photo-title" className="text-lg font-semibold">
          Add a photo or PDF
        </h2>
        <button type="button" onClick={onClose} className="-mt-2 -mr-2 min-h-11 min-w-11 rounded-md px-2 hover:bg-sunken" aria-label="Close without adding" data-testid="photo-close">
          ✕
        </button>
      </div>
      <p className="mb-4 text-sm text-muted">It goes where the cursor is in the text.</p>
      {mayUpload && (
        <section aria-labelledby="tl-photo-new" className="mb-5 rounded-lg border border-line bg-sunken/40 p-3">
          <h3 id="tl-photo-new" className="mb-2 font-semibold">
            From this device
          </h3>
          <PhotoUpload
            venueSlug={venueSlug}
            pageSlug={pageSlug}
            onStored={(file) => {
              insertFile(editor, file, atEnd);
              setAdded(true);
              void addToFiles(mutate, file);
            }}
            onDone={onClose}
          />
        </section>
      )}
      <section aria-labelledby="tl-photo-stored">
        <h3 id="tl-photo-stored" className="mb-2 font-semibold">
          Already in this venue
        </h3>
        <VenueFilePicker
          files={data?.files}
          error={error}
          onPick={(file) => {
            insertFile(editor, file, atEnd);
            onClose();
          }}
        />
      </section>
      <div className="mt-4 flex justify-end">
        <button type="button" onClick={onClose} className="min-h-11 rounded-lg border border-line px-4 hover:bg-sunken" data-testid="photo-cancel">
          {added ? 'Close' : 'Cancel'}
        </button>
      </div>
    </dialog>
  );
}
