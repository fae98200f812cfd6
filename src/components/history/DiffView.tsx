import { useMemo, useState } from 'react';
import useSWR from 'swr';
import { diffStats, foldUnchanged, wordDiff } from '~/lib/doc/word-diff';
import { fetcher, type ApiError } from '~/components/api/client';
import { revisionKey, type RevisionAnswer } from '~/components/api/revisions';
import { docPlainText } from '~/lib/doc/render-html';
import { structuralDiff } from '~/lib/doc/structural-diff';
import { StructuralChanges } from './StructuralChanges';

interface Props {
  venue: string;
  page: string;
  older: number;
  newer: number;
}

/**
 * The word-level difference between two revisions' text. Parts are rendered as React text, so
 * whatever a page contains is shown, never interpreted.
 */
export function DiffView({ venue, page, older, newer }: Props) {
  const a = useSWR<RevisionAnswer, ApiError>(revisionKey(venue, page, older), fetcher);
  const b = useSWR<RevisionAnswer, ApiError>(revisionKey(venue, page, newer), fetcher);
  const [whole, setWhole] = useState(false);
  // Text from the documents themselves, so blocks saved before their words were indexed still compare.
  const texts = useMemo(
    () => (a.data && b.data ? [docPlainText(a.data.revision.doc), docPlainText(b.data.revision.doc)] : null),
    [a.data, b.data],
  );
  const parts = useMemo(() => (texts ? wordDiff(texts[0]!, texts[1]!) : null), [texts]);
  const changes = useMemo(
    () => (a.data && b.data && texts ? structuralDiff(a.data.revision.doc, b.data.revision.doc, texts[0] !== texts[1]) : []),
    [a.data, b.data, texts],
  );
  if (a.error || b.error) return <p className="text-danger">{(a.error ?? b.error)?.error}</p>;
  if (!parts) return <p className="text-muted">Comparing…</p>;
  const stats = diffStats(parts);
  const changed = stats.added + stats.removed > 0;
  const shown = whole ? parts : foldUnchanged(parts);
  const folded = shown.length !== parts.length;
  return (
    <div>
      <p className="text-sm text-muted" data-testid="diff-stats">
        {changed ? (
          <>
            From revision {older} to {newer}: <span className="font-semibold text-ok">{stats.added} {stats.added === 1 ? 'word' : 'words'} added</span>,{' '}
            <span className="font-semibold text-danger">{stats.removed} removed</span>.
          </>
        ) : changes.length > 0 ? (
          <>From revision {older} to {newer} the words are the same; what changed is listed below.</>
        ) : (
          <>Revisions {older} and {newer} are identical.</>
        )}
      </p>
      <StructuralChanges changes={changes} />
      <div className="mt-2 max-h-[70vh] overflow-auto whitespace-pre-wrap rounded-lg border border-line bg-surface p-3 leading-relaxed" tabIndex={0} role="region" aria-label="Changes between the two revisions" data-testid="diff">
        {shown.map((p, i) =>
          p.kind === 'fold' ? (
            <button key={i} type="button" onClick={() => setWhole(true)} className="my-1 block min-h-11 w-full rounded-md bg-sunken px-2 py-2 text-left text-sm text-muted hover:text-fg">
              ⋯ {p.lines} unchanged line{p.lines === 1 ? '' : 's'} (show)
            </button>
          ) : p.kind === 'added' ? (
            <ins key={i} className="rounded-sm bg-ok/20 text-fg underline decoration-ok decoration-2" title="added">
              {p.text}
            </ins>
          ) : p.kind === 'removed' ? (
            <del key={i} className="rounded-sm bg-danger/15 text-fg decoration-danger decoration-2" title="removed">
              {p.text}
            </del>
          ) : (
            <span key={i}>{p.text}</span>
          ),
        )}
      </div>
      {(folded || whole) && changed && (
        <button type="button" onClick={() => setWhole((w) => !w)} className="mt-1 min-h-11 rounded-md px-2 text-sm underline">
          {whole ? 'Show only the changes' : 'Show the whole text'}
        </button>
      )}
      <p className="mt-1 text-xs text-muted">
        <ins className="bg-ok/20 text-fg underline decoration-ok">Underlined</ins> words were added, <del className="bg-danger/15 text-fg decoration-danger">struck-through</del> words removed.
      </p>
    </div>
  );
}
