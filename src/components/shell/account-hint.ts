/**
 * Calculator pages are kept for offline use as rendered for nobody (a page with a person's name
 * never enters the cache), so offline their header would offer "Sign in" to someone who is
 * signed in. Each signed-in page leaves the name in this browser; a page that shows the sign-in
 * link while offline shows that name instead, and an online page without a session forgets it.
 */
const KEY = 'throwline-account';

export function applyAccountHint(doc: Document, storage: Storage, online: boolean): void {
  const name = doc.querySelector<HTMLElement>('[data-account-name]')?.dataset.accountName;
  if (name) {
    storage.setItem(KEY, name);
    return;
  }
  const link = doc.querySelector<HTMLElement>('[data-signin-link]');
  if (!link) return;
  if (online) {
    storage.removeItem(KEY);
    return;
  }
  const kept = storage.getItem(KEY);
  if (!kept) return;
  const note = doc.createElement('span');
  note.className = 'inline-flex min-h-11 items-center rounded-md px-3 text-sm text-muted';
  note.setAttribute('data-testid', 'offline-account');
  note.textContent = `Offline · ${kept}`;
  link.replaceWith(note);
}

try {
  applyAccountHint(document, localStorage, navigator.onLine);
} catch {
  // Storage refused: the header keeps its sign-in link, which is still true enough.
}
