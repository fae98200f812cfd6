import { SUMMARY_MAX } from '~/lib/text-limits';

interface Props {
  summary: string;
  onSummary: (summary: string) => void;
  onSave: () => void;
  saving: boolean;
  /** While a conflict is open, saving goes through the conflict's own buttons. */
  blocked: boolean;
  error?: string;
  storageFailed: boolean;
  cancelHref: string;
  isNew: boolean;
}

/** The one-line summary of the change and the save button, kept in reach at the bottom. */
export function SaveBar({ summary, onSummary, onSave, saving, blocked, error, storageFailed, cancelHref, isNew }: Props) {
  return (
    <div className="sticky bottom-0 z-20 -mx-4 border-t border-line bg-surface/95 px-4 py-3 backdrop-blur sm:mx-0 sm:rounded-lg sm:border">
      <form
        className="flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          if (!blocked && !saving) onSave();
        }}
      >
        <div className="min-w-0 flex-1 basis-56">
          <label htmlFor="tl-summary" className="block text-sm font-semibold">
            What changed <span className="font-normal text-muted">(one line, optional)</span>
          </label>
          <input
            id="tl-summary"
            value={summary}
            maxLength={SUMMARY_MAX}
            onChange={(e) => onSummary(e.target.value)}
            placeholder={isNew ? 'First version' : 'e.g. New amp in rack B, patch updated'}
            className="mt-1 min-h-11 w-full rounded-md border border-line bg-bg px-3"
            data-testid="summary-input"
          />
        </div>
        <a href={cancelHref} className="inline-flex min-h-11 items-center rounded-md px-4 no-underline hover:bg-sunken">
          Cancel
        </a>
        <button
          type="submit"
          disabled={saving || blocked}
          className="min-h-11 rounded-md bg-accent px-6 font-semibold text-accent-fg disabled:opacity-50"
          data-testid="save-page"
        >
          {saving ? 'Saving…' : isNew ? 'Create page' : 'Save'}
        </button>
      </form>
      <div aria-live="polite" className="text-sm">
        {error && (
          <p className="mt-2 text-danger" data-testid="save-error">
            {error}
          </p>
        )}
        {storageFailed && <p className="mt-2 text-warn">This browser would not keep a copy of your text on the device; save soon.</p>}
        {blocked && <p className="mt-2 text-muted">Choose how to go on in the box about the other version.</p>}
      </div>
    </div>
  );
}
