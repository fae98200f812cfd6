import { useEffect, useRef, useState } from 'react';
import { ApiError } from '~/components/api/client';
import { deleteFile } from '~/components/api/files';
import type { FileView, PageRef } from '~/lib/schemas/file';

interface Props {
  file: FileView;
  venueSlug: string;
  onClose: () => void;
  onDeleted: () => void;
}

/** Asks before deleting, naming every page that shows the file; the server checks again. */
export function ConfirmDelete({ file, venueSlug, onClose, onDeleted }: Props) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const [usedBy, setUsedBy] = useState<PageRef[]>(file.usedBy);
  const [error, setError] = useState<string | null>(null);
  const [working, setWorking] = useState(false);

  useEffect(() => {
    const dialog = dialogRef.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);

  async function remove() {
    setWorking(true);
    setError(null);
    try {
      const result = await deleteFile(venueSlug, file.id, usedBy.length > 0);
      if (result.kind === 'in-use') {
        // A page started using the file since the list was loaded: show the names and ask again.
        setUsedBy(result.usedBy);
        setError(result.message);
        return;
      }
      onClose();
      onDeleted();
    } catch (err) {
      setError(err instanceof ApiError ? err.error : 'The file was not deleted.');
    } finally {
      setWorking(false);
    }
  }

  const name = file.caption || file.originalName;
  return (
    <dialog ref={dialogRef} onCancel={onClose} aria-labelledby={`del-${file.id}`} className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-xl border border-line bg-surface p-5 text-fg backdrop:bg-black/50" data-testid="confirm-delete">
      <h2 id={`del-${file.id}`} className="text-lg font-semibold">
        Delete “{name}”?
      </h2>
      {usedBy.length ? (
        <div className="mt-2 text-sm">
          <p>It is shown on {usedBy.length === 1 ? 'this page' : 'these pages'}, which will have a gap where it was:</p>
          <ul className="mt-1 list-disc pl-5" data-testid="confirm-delete-pages">
            {usedBy.map((p) => (
              <li key={p.slug}>{p.title}</li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="mt-2 text-sm text-muted">No page shows it. This cannot be undone.</p>
      )}
      {error && (
        <p className="mt-2 text-sm text-danger" role="alert">
          {error}
        </p>
      )}
      <div className="mt-4 flex justify-end gap-2">
        <button type="button" onClick={onClose} className="min-h-11 rounded-lg border border-line px-4 hover:bg-sunken">
          Keep it
        </button>
        <button type="button" onClick={remove} disabled={working} className="min-h-11 rounded-lg bg-danger px-4 font-semibold text-bg disabled:opacity-50" data-testid="confirm-delete-button">
          {working ? 'Deleting…' : 'Delete file'}
        </button>
      </div>
    </dialog>
  );
}
