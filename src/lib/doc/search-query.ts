/**
 * Turns what a person typed into an FTS5 query that can only ever mean "these words".
 * Every term becomes a quoted string (inner quotes doubled), so operators (AND, OR, NOT, NEAR),
 * column filters, `*`, `-`, `^` and stray quotes are searched as text. The last term matches as
 * a prefix, for results while typing. Terms with no letter or digit are dropped because the
 * tokenizer would drop them too. Control characters count as spaces.
 */
export const SEARCH_MAX_TERMS = 12;

export function toFtsQuery(input: string): string | null {
  // Control characters (NUL above all) end an FTS5 string early; they are never search text.
  const terms = input
    .replace(/\p{Cc}/gu, ' ')
    .split(/\s+/u)
    .filter((t) => /[\p{L}\p{N}]/u.test(t))
    .slice(0, SEARCH_MAX_TERMS);
  if (terms.length === 0) return null;
  return terms.map((t, i) => `"${t.replace(/"/g, '""')}"${i === terms.length - 1 ? '*' : ''}`).join(' ');
}
