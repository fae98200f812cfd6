import type { ApiError } from '~/components/api/client';
import type { FileView } from '~/lib/schemas/file';

interface Props {
  files: FileView[] | undefined;
  error: ApiError | undefined;
  onPick: (file: FileView) => void;
}

/** The venue's stored photos and PDFs as a grid of thumbnails; tapping one puts it into the page. */
export function VenueFilePicker({ files, error, onPick }: Props) {
  if (error) {
    return (
      <p role="alert" className="text-sm text-danger">
        {error.error}
      </p>
    );
  }
  if (!files) return <p className="text-sm text-muted">Loading the venue’s files…</p>;
  if (files.length === 0) return <p className="text-sm text-muted">No photos or files in this venue yet.</p>;
  return (
    <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4" data-testid="photo-picker">
      {files.map((file) => {
        const name = file.caption || file.originalName;
        return (
          <li key={file.id}>
            <button
              type="button"
              onClick={() => onPick(file)}
              disabled={file.missing}
              aria-label={`Add “${name}” to the page`}
              title={file.missing ? 'Missing from storage; upload it again.' : name}
              className="flex w-full flex-col overflow-hidden rounded-lg border border-line bg-bg text-left hover:border-accent focus-visible:border-accent disabled:opacity-40"
              data-testid="photo-pick"
              data-file-id={file.id}
            >
              {file.thumbUrl ? (
                <img src={file.thumbUrl} alt="" loading="lazy" className="aspect-square w-full bg-sunken object-cover" />
              ) : (
                <span className="flex aspect-square w-full items-center justify-center bg-sunken text-lg font-bold text-muted">{file.kind === 'pdf' ? 'PDF' : file.kind === 'trace' ? 'Trace' : '—'}</span>
              )}
              <span className="truncate px-1.5 py-1 text-xs">{name}</span>
            </button>
          </li>
        );
      })}
    </ul>
  );
}
