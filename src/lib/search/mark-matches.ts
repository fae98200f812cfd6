import { MATCH_CLOSE, MATCH_OPEN } from '~/lib/doc/marked-snippet';
import { groupTerms, termGroups, wordTerms, type TermGroup, type Word } from './normalise-terms';

export interface MatchQuery {
  terms: string[];
  /** The last term also matches as the start of a term (results while typing). */
  prefixLast: boolean;
}

interface Span {
  start: number;
  end: number;
}

interface Matcher {
  /** The term is one the query looks for. */
  term: (t: string) => boolean;
  /** The word, read on its own, answers to one of the query's terms. */
  word: (w: Word) => boolean;
}

function matcher(q: MatchQuery): Matcher {
  const whole = new Set(q.terms);
  const prefix = q.prefixLast ? q.terms.at(-1) : undefined;
  const term = (t: string) => whole.has(t) || (prefix !== undefined && t.startsWith(prefix));
  // A page repeats its words, and a word's terms depend only on how it reads (term and plain
  // token): each spelling is worked out once per query, not once per occurrence.
  const seen = new Map<string, boolean>();
  const word = (w: Word) => {
    const key = `${w.term}\u0000${w.plain}`;
    let hit = seen.get(key);
    if (hit === undefined) seen.set(key, (hit = wordTerms(w).some(term)));
    return hit;
  };
  return { term, word };
}

/** The parts of a group a query hits: the whole group when a joined spelling matches, else its words. */
function hitsIn(text: string, g: TermGroup, hit: Matcher): Span[] {
  const words = g.words.filter(hit.word);
  if (words.length) return words.map((w) => ({ start: w.start, end: w.end }));
  // A group of one word answers to exactly that word's terms, just asked.
  if (g.words.length === 1 || !groupTerms(g).some(hit.term)) return [];
  // The shortest run of words that holds the hit: "98 dB(A)" searched as "dba" marks "dB(A)".
  for (let len = 2; len < g.words.length; len++) {
    for (let i = 0; i + len <= g.words.length; i++) {
      const start = g.words[i].start;
      const last = g.words[i + len - 1].end;
      const end = text[last] === ')' ? last + 1 : last;
      const [run] = termGroups(text.slice(start, end));
      if (run && run.words.length === len && groupTerms(run).some(hit.term)) return [{ start, end }];
    }
  }
  return [{ start: g.start, end: g.end }];
}

/** Control characters are the match markers: one in the text must never open a mark. Same length, same offsets. */
function withoutControls(text: string): string {
  return text.replace(/\p{Cc}/gu, ' ');
}

function marked(text: string, spans: Span[], from: number, to: number): string {
  let out = '';
  let at = from;
  for (const s of spans) {
    if (s.end <= from || s.start >= to) continue;
    out += text.slice(at, s.start) + MATCH_OPEN + text.slice(s.start, s.end) + MATCH_CLOSE;
    at = s.end;
  }
  return (out + text.slice(at, to)).replace(/\s+/gu, ' ');
}

/** The whole text with every hit wrapped in the match markers (for titles). */
export function markAll(raw: string, q: MatchQuery): string {
  const text = withoutControls(raw);
  const hit = matcher(q);
  const spans = termGroups(text).flatMap((g) => hitsIn(text, g, hit));
  return marked(text, spans, 0, text.length);
}

/**
 * The snippet of `text`, or undefined when `head` is set and the answer could depend on text past
 * the end: no hit yet, or the window reaching into the last groups (the last word may belong to a
 * group that continues after the cut, "63 | A").
 */
function snippetIn(text: string, q: MatchQuery, words: number, head: boolean): string | undefined {
  const hit = matcher(q);
  const groups = termGroups(text);
  if (groups.length === 0) return head ? undefined : '';
  let first = -1;
  for (let i = 0; i < groups.length && first < 0; i++) if (hitsIn(text, groups[i], hit).length) first = i;
  const lead = Math.floor(words / 3);
  const startGroup = first < 0 ? 0 : Math.max(0, Math.min(first - lead, groups.length - words));
  const endGroup = Math.min(groups.length, startGroup + words) - 1;
  if (head && (first < 0 || endGroup >= groups.length - HEAD_MARGIN)) return undefined;
  // Only the window's groups are marked: a long page's other hits are never looked at.
  const spans = groups.slice(startGroup, endGroup + 1).flatMap((g) => hitsIn(text, g, hit));
  const from = startGroup === 0 ? 0 : groups[startGroup].start;
  const to = endGroup === groups.length - 1 ? text.length : groups[endGroup].end;
  const body = marked(text, spans, from, to).trim();
  return `${from > 0 ? '…' : ''}${body}${to < text.length ? '…' : ''}`;
}

/** How much of a long text is read first: most first hits are near the top. */
const HEAD_CHARS = 1500;
/** Groups at the end of the head that may read differently in the whole text. */
const HEAD_MARGIN = 3;

/**
 * A window of about `words` words around the first hit, hits marked, "…" where text was cut;
 * the opening words when nothing in the text is hit (the title matched).
 *
 * Reading every word of a long page to find its first hit cost most of a search's time on the
 * event loop (21 results × 8,000 characters); the head of the text is read first and the whole
 * only when the head cannot decide, with the same answer either way (tested against the whole).
 */
export function markedSnippet(raw: string, q: MatchQuery, words = 14): string {
  const text = withoutControls(raw);
  if (text.length > 2 * HEAD_CHARS) {
    const cut = text.slice(0, HEAD_CHARS).search(/\s\S*$/u);
    if (cut > 0) {
      const fromHead = snippetIn(text.slice(0, cut), q, words, true);
      if (fromHead !== undefined) return fromHead;
    }
  }
  return snippetIn(text, q, words, false)!;
}

/** The same snippet, always read from the whole text: the reference markedSnippet is tested against. */
export function markedSnippetOfWhole(raw: string, q: MatchQuery, words = 14): string {
  return snippetIn(withoutControls(raw), q, words, false)!;
}
