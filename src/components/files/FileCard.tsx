import { useId, useState } from 'react';
import { ApiError } from '~/components/api/client';
import { saveCaption as sendCaption } from '~/components/api/files';
import type { FileView } from '~/lib/schemas/file';
import { MAX_CAPTION_CHARS } from '~/lib/upload-limits';
import { ConfirmDelete } from './ConfirmDelete';
import { formatBytes } from './format-bytes';

interface Props {
  file: FileView;
  venueSlug: string;
  mayEdit: boolean;
  mayDelete: boolean;
  onChanged: (file: FileView) => void;
  onDeleted: () => void;
}

export function FileCard({ file, venueSlug, mayEdit, mayDelete, onChanged, onDeleted }: Props) {
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(file.caption);
  const [saving, setSaving] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const captionId = useId();

  async function saveCaption(event: React.FormEvent) {
    event.preventDefault();
    setSaving(true);
    setError(null);
    try {
      onChanged(await sendCaption(venueSlug, file.id, draft));
      setEditing(false);
    } catch (err) {
      setError(err instanceof ApiError ? err.error : 'The caption was not saved.');
    } finally {
      setSaving(false);
    }
  }

  const label = file.caption || file.originalName;
  const dims = file.width && file.height ? ` · ${file.width} × ${file.height}` : '';
  return (
    <li className="flex flex-col overflow-hidden rounded-xl border border-line bg-surface" data-testid="file-card" data-file-id={file.id}>
      <a href={file.url} className="block bg-sunken no-underline" aria-label={`Open ${label}`}>
        {file.thumbUrl && !file.missing ? (
          <img src={file.thumbUrl} alt={file.caption || ''} loading="lazy" className="aspect-[4/3] w-full object-cover" data-testid="file-thumb" />
        ) : (
          <span className="flex aspect-[4/3] w-full items-center justify-center text-2xl font-bold text-muted">{file.kind === 'pdf' ? 'PDF' : file.kind === 'trace' ? 'Trace' : '—'}</span>
        )}
      </a>
      <div className="flex flex-1 flex-col gap-2 p-3 text-sm">
        {file.missing && <p className="rounded bg-warn-soft px-2 py-1 text-xs font-semibold text-warn">Missing from storage; upload it again.</p>}
        {editing ? (
          <form onSubmit={saveCaption} className="space-y-2">
            <label htmlFor={captionId} className="text-xs text-muted">
              Caption
            </label>
            <textarea id={captionId} value={draft} maxLength={MAX_CAPTION_CHARS} rows={2} onChange={(e) => setDraft(e.currentTarget.value)} className="w-full rounded-md border border-line bg-bg p-2" autoFocus />
            <div className="flex gap-2">
              <button type="submit" disabled={saving} className="min-h-11 rounded-lg bg-accent px-3 font-semibold text-accent-fg disabled:opacity-50">
                {saving ? 'Saving…' : 'Save caption'}
              </button>
              <button type="button" onClick={() => (setEditing(false), setDraft(file.caption), setError(null))} className="min-h-11 rounded-lg border border-line px-3 hover:bg-sunken">
                Cancel
              </button>
            </div>
          </form>
        ) : (
          <p className={file.caption ? 'font-medium' : 'italic text-muted'} data-testid="file-caption">
            {file.caption || 'No caption'}
          </p>
        )}
        <p className="break-words text-xs text-muted">
          {file.originalName} · {formatBytes(file.sizeBytes)}
          {dims}
        </p>
        <p className="text-xs" data-testid="file-used-by">
          {file.usedBy.length ? (
            <>
              <span className="text-muted">Shown on </span>
              {file.usedBy.map((p, i) => (
                <span key={p.slug}>
                  {i > 0 && ', '}
                  <a href={`/venues/${venueSlug}/${p.slug}`} className="underline">
                    {p.title}
                  </a>
                </span>
              ))}
            </>
          ) : (
            <span className="text-muted">Not shown on any page{file.page ? ` (uploaded for ${file.page.title})` : ''}</span>
          )}
        </p>
        {error && (
          <p className="text-danger" role="alert">
            {error}
          </p>
        )}
        {(mayEdit || mayDelete) && !editing && (
          <div className="mt-auto flex flex-wrap gap-2 pt-1">
            {mayEdit && (
              <button type="button" onClick={() => (setDraft(file.caption), setEditing(true))} className="min-h-11 rounded-lg border border-line px-3 hover:bg-sunken" data-testid="edit-caption">
                Edit caption
              </button>
            )}
            {mayDelete && (
              <button type="button" onClick={() => setConfirming(true)} className="min-h-11 rounded-lg border border-line px-3 text-danger hover:bg-sunken" data-testid="delete-file">
                Delete
              </button>
            )}
          </div>
        )}
      </div>
      {confirming && <ConfirmDelete file={file} venueSlug={venueSlug} onClose={() => setConfirming(false)} onDeleted={onDeleted} />}
    </li>
  );
}
