import { escapeHtml } from './escape-html';

/**
 * FTS5's snippet() and highlight() are asked to wrap matches in two control characters that can
 * never be in stored text (searchableText strips them). Here those markers become either parts
 * for a React list or escaped HTML with <mark>, so page text can never become markup.
 */
export const MATCH_OPEN = '\u0002';
export const MATCH_CLOSE = '\u0003';

export interface SnippetPart {
  text: string;
  match: boolean;
}

export function snippetParts(marked: string): SnippetPart[] {
  const parts: SnippetPart[] = [];
  let match = false;
  let text = '';
  const flush = () => {
    if (text) parts.push({ text, match });
    text = '';
  };
  for (const ch of marked) {
    if (ch === MATCH_OPEN || ch === MATCH_CLOSE) {
      flush();
      match = ch === MATCH_OPEN;
    } else {
      text += ch;
    }
  }
  flush();
  return parts;
}

export function snippetHtml(marked: string): string {
  return snippetParts(marked)
    .map((p) => (p.match ? `<mark>${escapeHtml(p.text)}</mark>` : escapeHtml(p.text)))
    .join('');
}
