import type { Draft } from './draft-store';
import { formatDateTime } from '~/lib/format-date';

interface Props {
  draft: Draft;
  /** The revision the editor opened on; a draft on an older one needs comparing first. */
  base: number;
  onRestore: () => void;
  onDiscard: () => void;
}

/** Offers unsaved text found on this device from an earlier visit to the editor. */
export function DraftNotice({ draft, base, onRestore, onDiscard }: Props) {
  const stale = draft.base < base;
  return (
    <div role="alert" className="rounded-lg border border-accent bg-accent-soft p-3" data-testid="draft-notice">
      <p className="font-semibold">Unsaved text from {formatDateTime(draft.savedAt)} is kept on this device.</p>
      {stale && (
        <p className="mt-1 text-sm">
          It was written on revision {draft.base}; the page has been saved since (now revision {base}). Bringing it back shows both versions side by side.
        </p>
      )}
      <div className="mt-2 flex flex-wrap gap-2">
        <button type="button" onClick={onRestore} className="min-h-11 rounded-md bg-accent px-4 font-semibold text-accent-fg" data-testid="draft-restore">
          {stale ? 'Bring it back and compare' : 'Bring it back'}
        </button>
        <button type="button" onClick={onDiscard} className="min-h-11 rounded-md border border-line bg-surface px-4" data-testid="draft-discard">
          Discard it
        </button>
      </div>
    </div>
  );
}
