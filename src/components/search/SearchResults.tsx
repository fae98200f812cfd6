import type { SearchHit } from '~/components/api/search';
import type { SnippetPart } from '~/lib/doc/marked-snippet';

interface Props {
  listId: string;
  hits: SearchHit[];
  active: number;
  pending: boolean;
  error?: string;
  onHover: (index: number) => void;
}

/** Matched words come back as parts and are rendered as text inside <mark>, never as HTML. */
function Marked({ parts }: { parts: SnippetPart[] }) {
  return (
    <>
      {parts.map((p, i) =>
        p.match ? (
          <mark key={i} className="rounded-sm bg-accent-soft px-0.5 text-fg">
            {p.text}
          </mark>
        ) : (
          <span key={i}>{p.text}</span>
        ),
      )}
    </>
  );
}

export function SearchResults({ listId, hits, active, pending, error, onHover }: Props) {
  return (
    <div className="absolute right-0 left-0 z-40 mt-1 max-h-[70vh] overflow-auto rounded-lg border border-line bg-surface shadow-lg sm:left-auto sm:w-[28rem]">
      <ul id={listId} role="listbox" aria-label="Search results" data-testid="search-results">
        {hits.map((hit, i) => (
          <li key={hit.url} id={`${listId}-${i}`} role="option" aria-selected={i === active} onMouseEnter={() => onHover(i)}>
            <a href={hit.url} className={`block px-3 py-2 no-underline ${i === active ? 'bg-sunken' : 'hover:bg-sunken'}`} tabIndex={-1}>
              <span className="block font-semibold">
                <Marked parts={hit.titleParts} />
              </span>
              <span className="block text-xs text-muted">
                {hit.venue.name} · {hit.section.title}
              </span>
              {hit.snippetParts.length > 0 && (
                <span className="mt-0.5 line-clamp-2 block text-sm">
                  <Marked parts={hit.snippetParts} />
                </span>
              )}
            </a>
          </li>
        ))}
      </ul>
      <p className="px-3 py-2 text-sm text-muted" aria-live="polite">
        {error ? error : pending && hits.length === 0 ? 'Searching…' : hits.length === 0 ? 'No page matches these words.' : `${hits.length} page${hits.length === 1 ? '' : 's'}`}
      </p>
    </div>
  );
}
