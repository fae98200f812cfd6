/**
 * All that runs on every signed-in page for search: the suggestions module is fetched the first
 * time a search field gets focus, so a page that is only read never downloads it.
 */
export function watchSearchFields(root: ParentNode = document): void {
  for (const input of root.querySelectorAll<HTMLInputElement>('input[data-suggest-from]')) {
    const attach = () => void import('./search-suggest').then((m) => m.attachSuggestions(input));
    if (document.activeElement === input) attach();
    else input.addEventListener('focus', attach, { once: true });
  }
}
