import { useCallback, useEffect, useRef, useState } from 'react';
import { loadPrefs, savePrefs } from './calc-prefs';

/** Every input of a calculator, as the text the person typed, keyed like the URL query. */
export type QueryState = Record<string, string>;

/** Longest value read from a link: enough for 32 filters, short enough to never stall a phone. */
const MAX_VALUE_CHARS = 2000;

/** `defaults` overlaid with the query values for the same keys; other keys in the link are ignored. */
export function readQuery(search: string, defaults: QueryState): QueryState {
  const params = new URLSearchParams(search);
  const state = { ...defaults };
  for (const key of Object.keys(defaults)) {
    const value = params.get(key);
    if (value !== null) state[key] = value.slice(0, MAX_VALUE_CHARS);
  }
  return state;
}

/** The query string for a state, keys in the order the calculator declared them. */
export function writeQuery(state: QueryState): string {
  return new URLSearchParams(Object.entries(state)).toString();
}

/**
 * Calculator inputs that live in the URL (history.replaceState, so a result is a link to share)
 * and, for `remembered` keys (temperature, units), in localStorage between visits.
 *
 * The server renders from the query it was sent; on the client the real address wins, because a
 * page served from the offline cache was rendered for whatever link fetched it first. Remembered
 * values fill only the keys the link leaves out, so a shared link always shows what was shared.
 */
export function useQueryState(defaults: QueryState, initialSearch: string, remembered: readonly string[] = []) {
  const [state, setState] = useState<QueryState>(() => readQuery(initialSearch, defaults));
  const ready = useRef(false);
  const defaultsRef = useRef(defaults);

  // Declared first so that on mount it runs before `ready` is set and never saves the server's defaults.
  useEffect(() => {
    if (!ready.current) return;
    const query = writeQuery(state);
    if (window.location.search !== `?${query}`) {
      window.history.replaceState(window.history.state, '', `${window.location.pathname}?${query}${window.location.hash}`);
    }
    if (remembered.length) savePrefs(Object.fromEntries(remembered.map((key) => [key, state[key]])));
  }, [state, remembered]);

  useEffect(() => {
    const params = new URLSearchParams(window.location.search);
    const prefs = loadPrefs();
    const base = { ...defaultsRef.current };
    for (const key of remembered) {
      if (!params.has(key) && typeof prefs[key] === 'string' && key in base) base[key] = prefs[key];
    }
    ready.current = true;
    setState(readQuery(window.location.search, base));
    // Runs once: later changes come from the person, not from the address bar.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const update = useCallback((patch: QueryState) => setState((current) => ({ ...current, ...patch })), []);
  return [state, update] as const;
}
