/**
 * The uploader's file name is display text only: it is shown on the files screen and offered as
 * the download name, and it never becomes part of a path on disk (stored names are hashes).
 * Cleaning still matters, because the name is shown to other people and sent back in headers.
 */

export const MAX_DISPLAY_NAME_CHARS = 120;
const FALLBACK_NAME = 'upload';

/**
 * C0/C1 controls and DEL, plus the invisible format characters that reorder or hide text
 * (bidi overrides and isolates, zero-width marks, BOM), which can make "gpj.exe" read as "exe.jpg".
 */
const UNSAFE_CHARS = /[\u0000-\u001f\u007f-\u009f\u200b-\u200f\u202a-\u202e\u2060-\u2069\ufeff]/g;

/** Normalised (NFC), no control characters, only the last path segment, at most 120 characters. */
export function cleanDisplayName(raw: unknown): string {
  if (typeof raw !== 'string') return FALLBACK_NAME;
  let name = raw.normalize('NFC').replace(UNSAFE_CHARS, '');
  // Old browsers send a full client path ("C:\\Users\\…\\rack.jpg"); keep the part a person named.
  const segments = name.split(/[/\\]+/);
  name = segments[segments.length - 1] ?? '';
  name = name.replace(/\s+/g, ' ').trim();
  // Names made only of dots ("..", ".") mean nothing as text and look like path steps.
  if (/^\.*$/.test(name)) return FALLBACK_NAME;
  return truncateKeepingExtension(name, MAX_DISPLAY_NAME_CHARS);
}

/** Cuts by code points (never halving a surrogate pair) and keeps a short extension visible. */
function truncateKeepingExtension(name: string, max: number): string {
  const chars = Array.from(name);
  if (chars.length <= max) return name;
  const dot = name.lastIndexOf('.');
  const ext = dot > 0 ? Array.from(name.slice(dot)) : [];
  if (ext.length > 0 && ext.length <= 10) {
    const stem = Array.from(name.slice(0, dot)).slice(0, max - ext.length);
    return (stem.join('').trimEnd() + ext.join('')).normalize('NFC');
  }
  return chars.slice(0, max).join('').trimEnd();
}

/**
 * The name with its extension swapped (or added), for renditions stored in another format
 * (HEIC → JPEG, a display size in WebP). Only 1–5 letters or digits after the last dot count
 * as an extension, so "plot v1.2 final" keeps its words.
 */
export function withExtension(name: string, ext: string): string {
  const match = /^(.+)\.([A-Za-z0-9]{1,5})$/.exec(name);
  const stem = match ? match[1] : name;
  return ext ? `${stem}.${ext}` : stem;
}
