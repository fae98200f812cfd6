import { diffLines, diffWords } from 'diff';

export interface DiffPart {
  kind: 'same' | 'added' | 'removed';
  text: string;
}

/**
 * A word-level diff of two revisions' plain text, as parts for the history view to render as
 * text (never as HTML). Very different long texts fall back to a line diff rather than stall.
 */
export function wordDiff(before: string, after: string, timeoutMs = 1500): DiffPart[] {
  const changes = diffWords(before, after, { timeout: timeoutMs }) ?? diffLines(before, after);
  return changes
    .filter((c) => c.value.length > 0)
    .map((c) => ({ kind: c.added ? 'added' : c.removed ? 'removed' : 'same', text: c.value }));
}

/** How many words came and went, for a one-line summary above the diff. */
export function diffStats(parts: DiffPart[]): { added: number; removed: number } {
  const words = (t: string) => t.split(/\s+/).filter(Boolean).length;
  return parts.reduce(
    (acc, p) => (p.kind === 'added' ? { ...acc, added: acc.added + words(p.text) } : p.kind === 'removed' ? { ...acc, removed: acc.removed + words(p.text) } : acc),
    { added: 0, removed: 0 },
  );
}

export type FoldedPart = DiffPart | { kind: 'fold'; lines: number };

/**
 * Hides long unchanged stretches, keeping `context` lines next to each change, so a one-word
 * edit in a long patch list is easy to find. The texts of the kept parts still join up to the
 * lines around each fold; a diff with no change at all is returned whole.
 */
export function foldUnchanged(parts: DiffPart[], context = 2): FoldedPart[] {
  if (!parts.some((p) => p.kind !== 'same')) return parts;
  const out: FoldedPart[] = [];
  parts.forEach((part, i) => {
    if (part.kind !== 'same') {
      out.push(part);
      return;
    }
    const lines = part.text.split('\n');
    // A same-part's first line continues the line of the change before it; its last line leads into the next change.
    const headCount = i > 0 ? context + 1 : 0;
    const tailCount = i < parts.length - 1 ? context + 1 : 0;
    if (lines.length <= headCount + tailCount + 1) {
      out.push(part);
      return;
    }
    if (headCount) out.push({ kind: 'same', text: lines.slice(0, headCount).join('\n') });
    out.push({ kind: 'fold', lines: lines.length - headCount - tailCount });
    if (tailCount) out.push({ kind: 'same', text: lines.slice(lines.length - tailCount).join('\n') });
  });
  return out;
}
