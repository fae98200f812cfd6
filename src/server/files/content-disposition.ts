/**
 * A Content-Disposition value per RFC 6266: a plain-ASCII `filename` for old clients and the
 * exact name as `filename*=UTF-8''…` (RFC 8187 percent-encoding) for everyone else.
 */
export function contentDisposition(type: 'inline' | 'attachment', name: string): string {
  const fallback = asciiFallback(name);
  const encoded = encodeRfc8187(name);
  return `${type}; filename="${fallback}"; filename*=UTF-8''${encoded}`;
}

/** Printable ASCII only, with the quoted-string specials and path separators replaced. */
function asciiFallback(name: string): string {
  const ascii = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^\x20-\x7e]/g, '_')
    .replace(/["\\/%;]/g, '_')
    .trim();
  return ascii.replace(/^[_.\s]*$/, 'download') || 'download';
}

/** attr-char is ALPHA / DIGIT / "!#$&+-.^_`|~"; everything else is percent-encoded UTF-8. */
function encodeRfc8187(name: string): string {
  return encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}
