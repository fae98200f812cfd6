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
    <div className="sticky z-20 -mx-4 border-t border-line bg-surface/95 px-3 py-2 backdrop-blur sm:mx-0 sm:rounded-lg sm:border sm:px-4 sm:py-3" style={{ bottom: 'var(--tl-keyboard-inset, 0px)' }} data-testid="save-bar">
      <form
        className="flex items-end gap-2 sm:flex-wrap"
        onSubmit={(e) => {
          e.preventDefault();
          if (!blocked && !saving) onSave();
        }}
      >
        <div className="min-w-0 flex-1 sm:basis-56">
          <label htmlFor="tl-summary" className="block text-sm font-semibold max-sm:sr-only">
            What changed <span className="font-normal text-muted">(one line, optional)</span>
          </label>
          <input
            id="tl-summary"
            value={summary}
            maxLength={SUMMARY_MAX}
            onChange={(e) => onSummary(e.target.value)}
            placeholder={isNew ? 'First version' : 'What changed (optional)'}
            className="min-h-11 w-full rounded-md border border-line bg-bg px-3 sm:mt-1"
            data-testid="summary-input"
          />
        </div>
        <a href={cancelHref} className="inline-flex min-h-11 shrink-0 items-center rounded-md px-2 no-underline hover:bg-sunken sm:px-4">
          Cancel
        </a>
        <button
          type="submit"
          disabled={saving || blocked}
          className="min-h-11 shrink-0 rounded-md bg-accent px-4 font-semibold text-accent-fg disabled:opacity-50 sm:px-6"
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
