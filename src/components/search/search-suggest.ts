import { SEARCH_MIN_CHARS } from '~/lib/doc/search-query';

/**
 * Suggestions under a search field: after SEARCH_MIN_CHARS characters and a pause, the best few
 * pages as a listbox the arrow keys move through. Enter opens the chosen page, or — with none
 * chosen — submits the form to the results page. Page text is set with textContent only.
 */
interface Part {
  text: string;
  match: boolean;
}
interface Hit {
  url: string;
  venue: { name: string };
  section: { title: string };
  titleParts: Part[];
  snippetParts: Part[];
}

const SUGGESTIONS = 8;
const PAUSE_MS = 200;

function marked(parts: Part[]): DocumentFragment {
  const out = document.createDocumentFragment();
  for (const p of parts) {
    const el = document.createElement(p.match ? 'mark' : 'span');
    if (p.match) el.className = 'rounded-sm bg-accent-soft px-0.5 text-fg';
    el.textContent = p.text;
    out.append(el);
  }
  return out;
}

function option(hit: Hit, id: string): HTMLLIElement {
  const li = document.createElement('li');
  li.id = id;
  li.setAttribute('role', 'option');
  li.setAttribute('aria-selected', 'false');
  li.className = 'block cursor-pointer px-3 py-2 hover:bg-sunken';
  const title = document.createElement('span');
  title.className = 'block font-semibold';
  title.append(marked(hit.titleParts));
  const where = document.createElement('span');
  where.className = 'block text-xs text-muted';
  where.textContent = `${hit.venue.name} · ${hit.section.title}`;
  li.append(title, where);
  if (hit.snippetParts.length > 0) {
    const snippet = document.createElement('span');
    snippet.className = 'mt-0.5 line-clamp-2 block text-sm';
    snippet.append(marked(hit.snippetParts));
    li.append(snippet);
  }
  return li;
}

export function attachSuggestions(input: HTMLInputElement): void {
  if (input.dataset.suggest === 'on') return;
  input.dataset.suggest = 'on';
  const endpoint = input.dataset.suggestFrom ?? '/api/search';
  const listId = input.getAttribute('aria-controls') ?? `${input.id}-suggestions`;
  const panel = document.createElement('div');
  panel.hidden = true;
  panel.className = 'absolute right-0 left-0 z-40 mt-1 max-h-[70vh] overflow-auto rounded-lg border border-line bg-surface shadow-lg sm:left-auto sm:w-[28rem]';
  const list = document.createElement('ul');
  list.id = listId;
  list.setAttribute('role', 'listbox');
  list.setAttribute('aria-label', 'Suggested pages');
  list.dataset.testid = 'search-results';
  const status = document.createElement('p');
  status.className = 'px-3 py-2 text-sm text-muted';
  status.setAttribute('aria-live', 'polite');
  panel.append(list, status);
  (input.form ?? input).after(panel);

  let hits: Hit[] = [];
  let active = -1;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let inFlight: AbortController | undefined;

  const show = (open: boolean) => {
    panel.hidden = !open;
    input.setAttribute('aria-expanded', String(open));
  };
  const select = (index: number) => {
    active = index;
    list.querySelectorAll('[role="option"]').forEach((el, i) => {
      el.setAttribute('aria-selected', String(i === active));
      el.classList.toggle('bg-sunken', i === active);
    });
    if (active >= 0) input.setAttribute('aria-activedescendant', `${listId}-${active}`);
    else input.removeAttribute('aria-activedescendant');
  };
  const render = (message: string) => {
    list.replaceChildren(
      ...hits.map((hit, i) => {
        const li = option(hit, `${listId}-${i}`);
        // Keep focus in the field, so the click is the only thing that happens.
        li.addEventListener('pointerdown', (e) => e.preventDefault());
        li.addEventListener('click', () => window.location.assign(hit.url));
        li.addEventListener('mouseenter', () => select(i));
        return li;
      }),
    );
    status.textContent = message;
    select(-1);
  };

  async function lookUp(q: string) {
    inFlight?.abort();
    inFlight = new AbortController();
    try {
      const res = await fetch(`${endpoint}?q=${encodeURIComponent(q)}&limit=${SUGGESTIONS}`, { headers: { accept: 'application/json' }, signal: inFlight.signal });
      const body = (await res.json().catch(() => ({}))) as { hits?: Hit[]; error?: string };
      if (input.value.trim() !== q) return;
      hits = res.ok ? (body.hits ?? []) : [];
      render(!res.ok ? (body.error ?? 'Search is not available right now.') : hits.length === 0 ? 'No page matches these words.' : 'Enter shows every match.');
    } catch (err) {
      if ((err as Error).name !== 'AbortError') {
        hits = [];
        render('Search is not available right now.');
      }
    }
  }

  input.addEventListener('input', () => {
    clearTimeout(timer);
    const q = input.value.trim();
    if (q.length < SEARCH_MIN_CHARS) {
      inFlight?.abort();
      hits = [];
      render(q ? `Type ${SEARCH_MIN_CHARS} letters or more.` : '');
      show(q.length > 0);
      return;
    }
    show(true);
    if (hits.length === 0) status.textContent = 'Searching…';
    timer = setTimeout(() => void lookUp(q), PAUSE_MS);
  });
  input.addEventListener('keydown', (e) => {
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      show(input.value.trim().length > 0);
      if (hits.length === 0) return;
      // -1 is the field itself; the arrows cycle field → first … last → field.
      select(e.key === 'ArrowDown' ? (active + 1 >= hits.length ? -1 : active + 1) : active - 1 < -1 ? hits.length - 1 : active - 1);
    } else if (e.key === 'Enter' && active >= 0 && hits[active]) {
      e.preventDefault();
      window.location.assign(hits[active].url);
    } else if (e.key === 'Escape') {
      show(false);
      select(-1);
    }
  });
  input.addEventListener('blur', () => show(false));
  input.addEventListener('focus', () => show(status.textContent !== '' || hits.length > 0));
}
