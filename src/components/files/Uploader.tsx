import { useEffect, useId, useRef, useState } from 'react';
import type { FileView, PageRef } from '~/lib/schemas/file';
import { UPLOAD_ACCEPT_WITH_TRACES, uploadPrecheck } from '~/lib/upload-limits';
import { UploadRow, type QueuedUpload } from './UploadRow';
import { ApiError } from '~/components/api/client';
import { uploadFile } from '~/components/api/upload-file';

export interface UploaderProps {
  venueSlug: string;
  /** The venue's pages; the person may say which one the files are for. */
  pages?: PageRef[];
  /** Called once per stored file, in the order they finish. */
  onUploaded?: (file: FileView) => void;
}

let nextKey = 1;

/**
 * Choose several photos or PDFs (a phone offers its camera roll and camera), give each a
 * caption, and send them one after another, each with its own progress bar.
 */
export function Uploader({ venueSlug, pages, onUploaded }: UploaderProps) {
  const [queue, setQueue] = useState<QueuedUpload[]>([]);
  const [pagePick, setPagePick] = useState('');
  const [busy, setBusy] = useState(false);
  const inputRef = useRef<HTMLInputElement>(null);
  const queueRef = useRef(queue);
  queueRef.current = queue;
  const inputId = useId();

  useEffect(() => () => queueRef.current.forEach((q) => q.preview && URL.revokeObjectURL(q.preview)), []);

  const update = (key: number, patch: Partial<QueuedUpload>) => setQueue((list) => list.map((q) => (q.key === key ? { ...q, ...patch } : q)));

  function add(fileList: FileList | null) {
    if (!fileList?.length) return;
    const added = Array.from(fileList).map<QueuedUpload>((file) => {
      const refusal = uploadPrecheck(file);
      return {
      key: nextKey++,
      file,
      caption: '',
      // Flagged on arrival, not when its turn comes: the person can remove it before sending.
      status: refusal ? 'refused' : 'ready',
      error: refusal ?? undefined,
      progress: 0,
      preview: !refusal && file.type.startsWith('image/') && !/heic|heif/i.test(file.type) ? URL.createObjectURL(file) : null,
      };
    });
    setQueue((list) => [...list.filter((q) => q.status !== 'done'), ...added]);
    if (inputRef.current) inputRef.current.value = '';
  }

  function remove(key: number) {
    setQueue((list) => {
      const gone = list.find((q) => q.key === key);
      if (gone?.preview) URL.revokeObjectURL(gone.preview);
      return list.filter((q) => q.key !== key);
    });
  }

  async function sendAll() {
    setBusy(true);
    // One at a time: on a venue's Wi-Fi, parallel uploads only make every bar crawl.
    for (const item of queueRef.current.filter((q) => q.status === 'ready' || q.status === 'error')) {
      update(item.key, { status: 'sending', progress: 0, error: undefined });
      try {
        const { file } = await uploadFile(venueSlug, item.file, { caption: item.caption.trim(), page: pagePick || undefined }, (fraction) =>
          update(item.key, { progress: fraction, status: fraction >= 1 ? 'processing' : 'sending' }),
        );
        update(item.key, { status: 'done', result: file });
        onUploaded?.(file);
      } catch (err) {
        update(item.key, { status: 'error', error: err instanceof ApiError ? err.error : 'The upload failed; try again.' });
      }
    }
    setBusy(false);
  }

  const pending = queue.filter((q) => q.status === 'ready' || q.status === 'error').length;
  return (
    <div className="space-y-3" data-testid="uploader">
      <div className="flex flex-wrap items-center gap-3">
        <input
          ref={inputRef}
          id={inputId}
          type="file"
          accept={UPLOAD_ACCEPT_WITH_TRACES}
          multiple
          className="peer sr-only"
          onChange={(e) => add(e.currentTarget.files)}
          data-testid="file-input"
        />
        <label
          htmlFor={inputId}
          className="inline-flex min-h-11 cursor-pointer items-center rounded-lg border border-line bg-surface px-4 py-2 font-semibold hover:bg-sunken peer-focus-visible:outline-3 peer-focus-visible:outline-focus"
        >
          Choose photos or PDFs
        </label>
        <span className="text-sm text-muted">JPEG, PNG, WebP, PDF, or a measurement trace as text columns; up to 25 MiB each (an iPhone's HEIC photos: share them as JPEG). Location data is removed from photos.</span>
      </div>

      {queue.length > 0 && (
        <>
          <ul className="space-y-2" aria-label="Files to upload">
            {queue.map((item) => (
              <UploadRow key={item.key} item={item} busy={busy} onCaption={(caption) => update(item.key, { caption })} onRemove={() => remove(item.key)} />
            ))}
          </ul>
          <div className="flex flex-wrap items-end gap-3">
            {pages && pages.length > 0 && (
              <label className="flex flex-col text-sm">
                <span className="text-muted">For page (optional)</span>
                <select value={pagePick} onChange={(e) => setPagePick(e.currentTarget.value)} disabled={busy} className="min-h-11 rounded-lg border border-line bg-surface px-3">
                  <option value="">No page</option>
                  {pages.map((p) => (
                    <option key={p.slug} value={p.slug}>
                      {p.title}
                    </option>
                  ))}
                </select>
              </label>
            )}
            <button
              type="button"
              onClick={sendAll}
              disabled={busy || pending === 0}
              className="min-h-11 rounded-lg bg-accent px-5 py-2 font-semibold text-accent-fg disabled:opacity-50"
              data-testid="upload-start"
            >
              {busy ? 'Uploading…' : pending === 1 ? 'Upload 1 file' : `Upload ${pending} files`}
            </button>
          </div>
        </>
      )}
    </div>
  );
}
