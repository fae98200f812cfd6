import type { PmNode } from '~/lib/doc/types';

/**
 * Unsaved text kept in this browser's localStorage while someone types, one entry per venue,
 * page and base revision, so a reload, a crash or a refused save never loses a word. Entries are
 * removed only after the server has accepted a save of the page.
 */
export interface Draft {
  base: number;
  doc: PmNode;
  title: string;
  section: string;
  summary: string;
  savedAt: number;
}

const PREFIX = 'throwline.draft:';
/** Stands in for the slug of a page that does not exist yet (a slug never holds "~"). */
export const NEW_PAGE_KEY = '~new';

function pagePrefix(venue: string, page: string): string {
  return `${PREFIX}${venue}/${page}@`;
}

export function writeDraft(venue: string, page: string, draft: Draft): boolean {
  try {
    localStorage.setItem(`${pagePrefix(venue, page)}${draft.base}`, JSON.stringify(draft));
    return true;
  } catch {
    return false; // storage full or blocked; the caller says so on screen
  }
}

/** Every draft of this page, newest first; unreadable entries are skipped, never thrown. */
export function readDrafts(venue: string, page: string): Draft[] {
  const found: Draft[] = [];
  try {
    const prefix = pagePrefix(venue, page);
    for (let i = 0; i < localStorage.length; i++) {
      const key = localStorage.key(i);
      if (!key?.startsWith(prefix)) continue;
      try {
        const draft = JSON.parse(localStorage.getItem(key) ?? '') as Draft;
        if (draft && typeof draft.base === 'number' && draft.doc?.type === 'doc') found.push(draft);
      } catch {
        // a damaged entry is left alone rather than lost
      }
    }
  } catch {
    return [];
  }
  return found.sort((a, b) => b.savedAt - a.savedAt);
}

export function clearDrafts(venue: string, page: string): void {
  try {
    const prefix = pagePrefix(venue, page);
    const keys: string[] = [];
    for (let i = 0; i < localStorage.length; i++) {
      const key = localStorage.key(i);
      if (key?.startsWith(prefix)) keys.push(key);
    }
    for (const key of keys) localStorage.removeItem(key);
  } catch {
    // nothing to do: without storage there were no drafts
  }
}
