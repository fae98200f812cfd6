import { z } from 'zod';

/**
 * Characters a name someone typed may not carry: control characters (NUL, tabs, line breaks:
 * a name is one line) and the bidirectional controls that reorder what follows them (embeddings,
 * overrides, isolates, marks), which let "gpj.exe" read as "exe.jpg" or reverse a venue's name.
 */
const FORBIDDEN = /[\p{Cc}\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/u;

export function hasForbiddenDisplayChar(text: string): boolean {
  return FORBIDDEN.test(text);
}

/**
 * The one rule for every person-typed name shown to others (titles, section and venue names,
 * towns, captions, summaries): text, trimmed, within its length, with nothing that hides or
 * reorders characters. `what` names the field in the sentences ("the title").
 */
export function displayText(what: string, opts: { min?: number; max: number; minMessage?: string; maxMessage?: string }) {
  let s = z.string({ error: `${capitalise(what)} must be text.` }).trim();
  if (opts.min) s = s.min(opts.min, opts.minMessage ?? `Give ${what}.`);
  return s
    .max(opts.max, opts.maxMessage ?? `Keep ${what} under ${opts.max} characters.`)
    .refine((v) => !hasForbiddenDisplayChar(v), `${capitalise(what)} contains an invisible control or text-direction character; type it again without it.`);
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
