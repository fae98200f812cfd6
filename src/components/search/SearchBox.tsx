import { useEffect, useId, useRef, useState, type KeyboardEvent } from 'react';
import useSWR from 'swr';
import { fetcher, type ApiError } from '~/components/api/client';
import { searchKey, type SearchAnswer } from '~/components/api/search';
import { SEARCH_MAX_LENGTH } from '~/lib/text-limits';
import { SearchResults } from './SearchResults';
import { useDebounced } from './use-debounced';

/**
 * The header's search: results as you type (debounced, fetched with SWR), a listbox the arrow
 * keys move through, Enter opens, Escape closes. On a phone it opens as a full-width bar.
 */
export default function SearchBox() {
  const id = useId();
  const [query, setQuery] = useState('');
  const [open, setOpen] = useState(false);
  const [expanded, setExpanded] = useState(false);
  const [active, setActive] = useState(-1);
  const wrapper = useRef<HTMLDivElement>(null);
  const input = useRef<HTMLInputElement>(null);
  const settled = useDebounced(query.trim(), 200);
  const { data, error, isLoading } = useSWR<SearchAnswer, ApiError>(searchKey(settled), fetcher, { keepPreviousData: true });
  const hits = settled ? (data?.hits ?? []) : [];

  useEffect(() => setActive(-1), [settled]);
  useEffect(() => {
    const close = (e: PointerEvent) => {
      if (!wrapper.current?.contains(e.target as Node)) {
        setOpen(false);
        setExpanded(false);
      }
    };
    document.addEventListener('pointerdown', close);
    return () => document.removeEventListener('pointerdown', close);
  }, []);

  function onKeyDown(e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      setOpen(true);
      if (hits.length === 0) return;
      // -1 is the input itself; the arrows cycle input → first … last → input.
      setActive((i) => (e.key === 'ArrowDown' ? (i + 1 >= hits.length ? -1 : i + 1) : i - 1 < -1 ? hits.length - 1 : i - 1));
    } else if (e.key === 'Enter') {
      const hit = hits[active >= 0 ? active : 0];
      if (hit) {
        e.preventDefault();
        window.location.assign(hit.url);
      }
    } else if (e.key === 'Escape') {
      setOpen(false);
      setExpanded(false);
      setActive(-1);
    }
  }

  const showList = open && query.trim().length > 0;
  const listId = `${id}-results`;
  return (
    <div ref={wrapper} className="relative" data-testid="search">
      <button
        type="button"
        className="flex min-h-11 min-w-11 items-center justify-center rounded-md hover:bg-sunken sm:hidden"
        aria-label="Search pages"
        aria-expanded={expanded}
        onClick={() => {
          setExpanded((x) => !x);
          setTimeout(() => input.current?.focus(), 0);
        }}
      >
        <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true" fill="none" stroke="currentColor" strokeWidth="2">
          <circle cx="8.5" cy="8.5" r="5.5" />
          <path d="M13 13l4.5 4.5" strokeLinecap="round" />
        </svg>
      </button>
      <div
        className={`${expanded ? 'fixed inset-x-0 top-14 z-40 block border-b border-line bg-surface p-2 shadow-lg' : 'hidden'} sm:static sm:block sm:border-0 sm:p-0 sm:shadow-none`}
      >
        <label htmlFor={`${id}-input`} className="sr-only">
          Search pages
        </label>
        <input
          ref={input}
          id={`${id}-input`}
          type="search"
          role="combobox"
          autoComplete="off"
          spellCheck={false}
          aria-expanded={showList}
          aria-controls={listId}
          aria-autocomplete="list"
          aria-activedescendant={active >= 0 ? `${listId}-${active}` : undefined}
          placeholder="Search pages"
          value={query}
          maxLength={SEARCH_MAX_LENGTH}
          onChange={(e) => {
            setQuery(e.target.value);
            setOpen(true);
          }}
          onFocus={() => setOpen(true)}
          onKeyDown={onKeyDown}
          className="min-h-11 w-full rounded-md border border-line bg-bg px-3 text-base sm:w-56 sm:text-sm lg:w-72"
          data-testid="search-input"
        />
        {showList && (
          <SearchResults
            listId={listId}
            hits={hits}
            active={active}
            pending={isLoading || settled !== query.trim()}
            error={error?.error}
            onHover={setActive}
          />
        )}
      </div>
    </div>
  );
}
