import { useEffect, useMemo, useRef } from 'react';
import { formatDateTime } from '~/lib/format-date';
import { renderDocHtml } from '~/lib/doc/render-html';
import type { CurrentRevision } from '~/components/api/pages';

interface Props {
  theirs: CurrentRevision;
  /** True when this comes from a draft found on reload rather than a refused save. */
  fromDraft: boolean;
  busy: boolean;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
  onCopyMine: () => void;
  copied: boolean;
}

/**
 * Shown when the page changed under the person's feet: the other version, rendered by the same
 * escaping renderer as the read view, and the three ways on. The person's own text stays in the
 * editor beside it, editable, so they can also merge by hand before saving.
 */
export function ConflictPanel({ theirs, fromDraft, busy, onKeepMine, onTakeTheirs, onCopyMine, copied }: Props) {
  const html = useMemo(() => renderDocHtml(theirs.doc), [theirs.doc]);
  const heading = useRef<HTMLHeadingElement>(null);
  // The save button is at the bottom of a long page; bring the news to the person.
  useEffect(() => {
    heading.current?.scrollIntoView({ block: 'start' });
    heading.current?.focus({ preventScroll: true });
  }, [theirs.number]);
  return (
    <section aria-labelledby="tl-conflict-title" className="rounded-lg border-2 border-warn bg-warn-soft p-3 sm:p-4" data-testid="conflict">
      <h2 id="tl-conflict-title" ref={heading} tabIndex={-1} className="scroll-mt-20 text-lg font-bold">
        {fromDraft ? 'You have unsaved text from an older revision' : 'Someone else saved this page while you were editing'}
      </h2>
      <p className="mt-1 text-sm">
        Revision {theirs.number} by {theirs.author.name}, {formatDateTime(theirs.createdAt)}
        {theirs.summary && <> — “{theirs.summary}”</>}. Your text is safe in the editor and on this device. Compare the two, merge by hand if you like,
        then choose:
      </p>
      <div className="mt-3 flex flex-wrap gap-2">
        <button type="button" disabled={busy} onClick={onKeepMine} className="min-h-11 rounded-md bg-accent px-4 font-semibold text-accent-fg disabled:opacity-50" data-testid="conflict-keep-mine">
          Save my text over revision {theirs.number}
        </button>
        <button type="button" disabled={busy} onClick={onTakeTheirs} className="min-h-11 rounded-md border border-line bg-surface px-4 font-semibold" data-testid="conflict-take-theirs">
          Use their version
        </button>
        <button type="button" onClick={onCopyMine} className="min-h-11 rounded-md border border-line bg-surface px-4" data-testid="conflict-copy-mine">
          {copied ? 'Copied ✓' : 'Copy my text'}
        </button>
      </div>
      <h3 className="mt-4 text-sm font-semibold uppercase tracking-wide text-muted">Their version (revision {theirs.number})</h3>
      <div
        className="prose-book mt-1 max-h-[60vh] overflow-auto rounded-md border border-line bg-surface p-3"
        data-testid="conflict-theirs"
        // Safe: renderDocHtml escapes all text and allowlists every tag and attribute.
        dangerouslySetInnerHTML={{ __html: html }}
      />
    </section>
  );
}
