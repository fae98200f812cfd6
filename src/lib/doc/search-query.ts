import { queryTerms } from '~/lib/search/normalise-terms';

/**
 * Turns what a person typed into an FTS5 query that can only ever mean "these words".
 * Terms are read by queryTerms (hyphens, number-unit spacing, case and unit spellings folded) and
 * each becomes a quoted string, so operators (AND, OR, NOT, NEAR), column filters, `*`, `-`, `^`
 * and stray quotes are searched as text. The last term matches as
 * a prefix, for results while typing, when its last word has SEARCH_MIN_CHARS letters or digits or more: a
 * one- or two-letter prefix matches most of a venue's words and costs a scan of the whole index
 * for nothing a person could use. Terms with no letter or digit are dropped because the
 * tokenizer would drop them too. Control characters count as spaces.
 */
export const SEARCH_MAX_TERMS = 12;
/** Below this many characters the box waits, and a last term is matched as a whole word only. */
export const SEARCH_MIN_CHARS = 3;

export interface SearchQuery {
  /** The FTS5 MATCH string. */
  match: string;
  /** The terms looked for, in the index's spelling, for marking hits in the original text. */
  terms: string[];
  prefixLast: boolean;
}

export function toSearchQuery(input: string): SearchQuery | null {
  // Terms come out of the same reading of the trade's spellings the index was built with, as
  // letters, digits and at most a decimal point: nothing of them is FTS5 syntax.
  const terms = queryTerms(input).slice(0, SEARCH_MAX_TERMS);
  if (terms.length === 0) return null;
  const prefixLast = lastTokenChars(terms[terms.length - 1]) >= SEARCH_MIN_CHARS;
  const last = terms.length - 1;
  const match = terms.map((t, i) => `"${t.replace(/"/g, '""')}"${i === last && prefixLast ? '*' : ''}`).join(' ');
  return { match, terms, prefixLast };
}

export function toFtsQuery(input: string): string | null {
  return toSearchQuery(input)?.match ?? null;
}

/** Length of the term's last token (FTS5 applies `*` to the last token of a quoted phrase). */
function lastTokenChars(term: string): number {
  const tokens = term.split(/[^\p{L}\p{N}]+/u).filter(Boolean);
  return tokens.length ? [...tokens[tokens.length - 1]].length : 0;
}
