/**
 * Turns what a person typed into an FTS5 query that can only ever mean "these words".
 * Every term becomes a quoted string (inner quotes doubled), so operators (AND, OR, NOT, NEAR),
 * column filters, `*`, `-`, `^` and stray quotes are searched as text. The last term matches as
 * a prefix, for results while typing, when its last word has SEARCH_MIN_CHARS letters or digits or more: a
 * one- or two-letter prefix matches most of a venue's words and costs a scan of the whole index
 * for nothing a person could use. Terms with no letter or digit are dropped because the
 * tokenizer would drop them too. Control characters count as spaces.
 */
export const SEARCH_MAX_TERMS = 12;
/** Below this many characters the box waits, and a last term is matched as a whole word only. */
export const SEARCH_MIN_CHARS = 3;

export function toFtsQuery(input: string): string | null {
  // Control characters (NUL above all) end an FTS5 string early; they are never search text.
  const terms = input
    .replace(/\p{Cc}/gu, ' ')
    .split(/\s+/u)
    .filter((t) => /[\p{L}\p{N}]/u.test(t))
    .slice(0, SEARCH_MAX_TERMS);
  if (terms.length === 0) return null;
  const last = terms.length - 1;
  return terms.map((t, i) => `"${t.replace(/"/g, '""')}"${i === last && lastTokenChars(t) >= SEARCH_MIN_CHARS ? '*' : ''}`).join(' ');
}

/** Length of the term's last token (FTS5 applies `*` to the last token of a quoted phrase). */
function lastTokenChars(term: string): number {
  const tokens = term.split(/[^\p{L}\p{N}]+/u).filter(Boolean);
  return tokens.length ? [...tokens[tokens.length - 1]].length : 0;
}
