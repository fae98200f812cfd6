import { useId, useState, type FormEvent } from 'react';
import { ApiError } from '~/components/api/client';
import { createSection, deleteSection, listSections, updateSection, type SectionRow } from '~/components/api/sections';
import { SECTION_TITLE_MAX } from '~/lib/text-limits';

interface Props {
  venue: string;
  initial: SectionRow[];
}

/** Add, rename, reorder and remove a venue's sections, through /api/venues/:venue/sections. */
export default function SectionManager({ venue, initial }: Props) {
  const id = useId();
  const [sections, setSections] = useState(initial);
  const [newTitle, setNewTitle] = useState('');
  const [editing, setEditing] = useState<{ slug: string; title: string } | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  /** Runs one change, then reloads the list so positions and counts are the server's. */
  async function call(change: () => Promise<void>, done?: string) {
    setBusy(true);
    setMessage(null);
    try {
      await change();
      setSections(await listSections(venue));
      if (done) setMessage({ ok: true, text: done });
      return true;
    } catch (err) {
      setMessage({ ok: false, text: err instanceof ApiError ? err.error : 'Something went wrong; nothing changed. Try again.' });
      return false;
    } finally {
      setBusy(false);
    }
  }

  async function add(e: FormEvent) {
    e.preventDefault();
    if (await call(() => createSection(venue, newTitle), `Added “${newTitle.trim()}”.`)) setNewTitle('');
  }

  async function rename(e: FormEvent) {
    e.preventDefault();
    if (editing && (await call(() => updateSection(venue, editing.slug, { title: editing.title }), 'Renamed.'))) setEditing(null);
  }

  const button = 'min-h-11 min-w-11 rounded-md border border-line px-3 text-sm hover:bg-sunken disabled:opacity-40';
  return (
    <div className="space-y-6" data-testid="section-manager">
      <p aria-live="polite" className={message ? (message.ok ? 'text-ok' : 'text-danger') : 'sr-only'}>
        {message?.text ?? ''}
      </p>
      <ol className="divide-y divide-line rounded-lg border border-line bg-surface">
        {sections.map((s, i) => (
          <li key={s.slug} className="flex flex-wrap items-center gap-2 p-3">
            {editing?.slug === s.slug ? (
              <form onSubmit={rename} className="flex flex-1 flex-wrap items-end gap-2">
                <label className="min-w-0 flex-1 text-sm font-semibold">
                  New title
                  <input
                    autoFocus
                    value={editing.title}
                    maxLength={SECTION_TITLE_MAX}
                    onChange={(e) => setEditing({ slug: s.slug, title: e.target.value })}
                    className="mt-1 block min-h-11 w-full rounded-md border border-line bg-bg px-3 font-normal"
                  />
                </label>
                <button type="submit" disabled={busy} className="min-h-11 rounded-md bg-accent px-4 font-semibold text-accent-fg">
                  Save
                </button>
                <button type="button" onClick={() => setEditing(null)} className="min-h-11 rounded-md px-3 hover:bg-sunken">
                  Cancel
                </button>
              </form>
            ) : (
              <>
                <span className="min-w-0 basis-full sm:flex-1 sm:basis-0">
                  <span className="font-semibold">{s.title}</span>
                  <span className="ml-2 text-sm whitespace-nowrap text-muted">
                    {s.pageCount} page{s.pageCount === 1 ? '' : 's'}
                  </span>
                </span>
                <button type="button" className={button} disabled={busy || i === 0} aria-label={`Move ${s.title} up`} onClick={() => call(() => updateSection(venue, s.slug, { move: 'up' }))}>
                  ↑
                </button>
                <button type="button" className={button} disabled={busy || i === sections.length - 1} aria-label={`Move ${s.title} down`} onClick={() => call(() => updateSection(venue, s.slug, { move: 'down' }))}>
                  ↓
                </button>
                <button type="button" className={button} disabled={busy} onClick={() => setEditing({ slug: s.slug, title: s.title })}>
                  Rename
                </button>
                <button
                  type="button"
                  className={button}
                  disabled={busy || s.pageCount > 0}
                  title={s.pageCount > 0 ? 'Move its pages to another section first' : undefined}
                  onClick={() => call(() => deleteSection(venue, s.slug), `Removed “${s.title}”.`)}
                >
                  Remove
                </button>
              </>
            )}
          </li>
        ))}
      </ol>
      <form onSubmit={add} className="flex flex-wrap items-end gap-2">
        <div className="min-w-0 flex-1">
          <label htmlFor={`${id}-new`} className="block text-sm font-semibold">
            New section
          </label>
          <input
            id={`${id}-new`}
            value={newTitle}
            maxLength={SECTION_TITLE_MAX}
            required
            onChange={(e) => setNewTitle(e.target.value)}
            placeholder="e.g. Backline"
            className="mt-1 min-h-11 w-full rounded-md border border-line bg-bg px-3"
          />
        </div>
        <button type="submit" disabled={busy} className="min-h-11 rounded-md bg-accent px-4 font-semibold text-accent-fg">
          Add section
        </button>
      </form>
    </div>
  );
}
