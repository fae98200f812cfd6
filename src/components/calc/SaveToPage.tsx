import { useState } from 'react';
import { ApiError } from '~/components/api/client';
import { getPage, listPages, putPage } from '~/components/api/pages';
import { listMyVenues, type VenueListed as Venue } from '~/components/api/venues';
import type { PmNode } from '~/lib/doc/types';

interface PageRow {
  slug: string;
  title: string;
}
type Step =
  | { kind: 'closed' }
  | { kind: 'loading' }
  | { kind: 'signed-out' }
  | { kind: 'pick'; venues: Venue[]; venue: string; pages: PageRow[]; page: string }
  | { kind: 'saving' }
  | { kind: 'done'; url: string; title: string; revision: number }
  | { kind: 'error'; message: string };

interface Props {
  /** The blocks to append and the revision summary; null while the result is not valid. */
  build: () => { nodes: PmNode[]; summary: string } | null;
  testId: string;
}

const EDITING_ROLES = ['engineer', 'manager'];

const UNREACHABLE = 'Could not reach Throwline; nothing was saved.';

/**
 * "Save into a page": a signed-in engineer picks a venue and a page, and the result is appended
 * as a block and saved as a new revision through the page's compare-and-set save. The server
 * decides who may edit; the list only offers venues where this person's role edits.
 */
export default function SaveToPage({ build, testId }: Props) {
  const [step, setStep] = useState<Step>({ kind: 'closed' });

  async function loadPages(venues: Venue[], venue: string) {
    // A list that cannot be loaded offers no page, as an empty venue would.
    const pages: PageRow[] = await listPages(venue).catch(() => []);
    setStep({ kind: 'pick', venues, venue, pages, page: pages[0]?.slug ?? '' });
  }

  async function open() {
    setStep({ kind: 'loading' });
    try {
      const venues = (await listMyVenues()).filter((v) => v.role === null || EDITING_ROLES.includes(v.role));
      if (venues.length === 0) return setStep({ kind: 'error', message: 'You have no venue where you may edit pages.' });
      await loadPages(venues, venues[0]!.slug);
    } catch (err) {
      if (err instanceof ApiError && err.status === 401) return setStep({ kind: 'signed-out' });
      setStep({ kind: 'error', message: err instanceof ApiError && err.status !== 0 ? err.error : UNREACHABLE });
    }
  }

  async function save(venue: string, page: string, title: string) {
    const made = build();
    if (!made) return setStep({ kind: 'error', message: 'Fix the values above first; nothing was saved.' });
    setStep({ kind: 'saving' });
    try {
      const { revision } = await getPage(venue, page);
      if (!revision) return setStep({ kind: 'error', message: 'That page has no text yet; nothing was saved.' });
      const doc = { ...revision.doc, content: [...(revision.doc.content ?? []), ...made.nodes] };
      const answer = await putPage(venue, page, { doc, baseRevision: revision.number, summary: made.summary });
      setStep({ kind: 'done', url: `/venues/${venue}/${page}`, title, revision: answer.revision.number });
    } catch (err) {
      if (!(err instanceof ApiError) || err.status === 0) return setStep({ kind: 'error', message: UNREACHABLE });
      if (err.status === 409) return setStep({ kind: 'error', message: 'Someone saved that page a moment ago; nothing was saved. Press Save again to add it to the new version.' });
      setStep({ kind: 'error', message: err.error });
    }
  }

  const button = 'min-h-11 rounded-lg border border-line px-3 text-sm font-semibold';
  if (step.kind === 'closed')
    return (
      <button type="button" className={`${button} self-start`} onClick={open} data-testid={testId}>
        Save into a page
      </button>
    );
  return (
    <div className="flex flex-col gap-2 rounded-lg border border-line p-3" data-testid={`${testId}-panel`} aria-live="polite">
      {step.kind === 'loading' || step.kind === 'saving' ? <p className="text-sm text-muted">{step.kind === 'loading' ? 'Loading your venues…' : 'Saving…'}</p> : null}
      {step.kind === 'signed-out' && (
        <p className="text-sm">
          <a className="underline" href={`/signin?next=${encodeURIComponent(location.pathname + location.search)}`}>
            Sign in
          </a>{' '}
          to save this into a venue's page.
        </p>
      )}
      {step.kind === 'pick' && (
        <>
          <label className="flex flex-col text-xs font-semibold">
            Venue
            <select className="min-h-11 rounded-md border border-line bg-surface px-2 text-base" value={step.venue} onChange={(e) => loadPages(step.venues, e.target.value)} data-testid={`${testId}-venue`}>
              {step.venues.map((v) => (
                <option key={v.slug} value={v.slug}>
                  {v.name}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col text-xs font-semibold">
            Page
            <select className="min-h-11 rounded-md border border-line bg-surface px-2 text-base" value={step.page} onChange={(e) => setStep({ ...step, page: e.target.value })} data-testid={`${testId}-page`}>
              {step.pages.map((p) => (
                <option key={p.slug} value={p.slug}>
                  {p.title}
                </option>
              ))}
            </select>
          </label>
          <button type="button" className={button} disabled={!step.page} onClick={() => save(step.venue, step.page, step.pages.find((p) => p.slug === step.page)?.title ?? step.page)} data-testid={`${testId}-save`}>
            Add to the end of this page
          </button>
        </>
      )}
      {step.kind === 'done' && (
        <p className="text-sm" data-testid={`${testId}-done`}>
          Saved as revision {step.revision} of{' '}
          <a className="underline" href={step.url}>
            {step.title}
          </a>
          .
        </p>
      )}
      {step.kind === 'error' && (
        <p className="text-sm text-danger" role="alert" data-testid={`${testId}-error`}>
          {step.message}
        </p>
      )}
      <button type="button" className="self-start text-sm underline" onClick={() => setStep({ kind: 'closed' })}>
        Close
      </button>
    </div>
  );
}
