/** Units and air temperature carried from one visit (and one calculator) to the next. */
const KEY = 'throwline-calc-prefs';

export function loadPrefs(): Record<string, string> {
  try {
    const parsed: unknown = JSON.parse(window.localStorage.getItem(KEY) ?? '{}');
    if (!parsed || typeof parsed !== 'object' || Array.isArray(parsed)) return {};
    return Object.fromEntries(Object.entries(parsed).filter(([, v]) => typeof v === 'string' && v.length < 40)) as Record<string, string>;
  } catch {
    return {};
  }
}

export function savePrefs(values: Record<string, string | undefined>): void {
  try {
    const next = { ...loadPrefs() };
    for (const [key, value] of Object.entries(values)) if (value !== undefined) next[key] = value;
    window.localStorage.setItem(KEY, JSON.stringify(next));
  } catch {
    // Private mode or a full disk: the calculator still works, it just forgets.
  }
}
