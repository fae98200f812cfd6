/**
 * `Accept-Encoding` with brotli taken out ("gzip, deflate, br;q=1" → "gzip, deflate"), so the
 * per-request compression picks gzip. Matching is on the coding's name only, case-insensitively;
 * quality values of the others are kept as sent.
 */
export function acceptedWithoutBrotli(header) {
  return header
    .split(',')
    .filter((part) => part.split(';')[0].trim().toLowerCase() !== 'br')
    .map((part) => part.trim())
    .filter(Boolean)
    .join(', ');
}
