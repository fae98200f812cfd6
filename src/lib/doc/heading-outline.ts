import { slugify } from '~/lib/slug';
import type { PmNode } from './types';

/** One heading of a page, for the contents list and the jump links. */
export interface OutlineEntry {
  level: number;
  text: string;
  /** The id the read view gives the heading, unique within one rendered page. */
  id: string;
}

function textOf(node: PmNode): string {
  if (node.type === 'text') return node.text ?? '';
  if (node.type === 'hardBreak') return ' ';
  return (node.content ?? []).map(textOf).join('');
}

/**
 * The headings of a document in reading order, each with a stable id: the same text gives the
 * same id on every render, so a jump link (`…/power#h-mains-distribution`) keeps working across
 * revisions as long as the heading keeps its words. Repeats get -2, -3 …; `prefix` keeps ids
 * apart when one HTML page holds several documents (the advance sheet).
 */
export function headingOutline(doc: PmNode, prefix = ''): OutlineEntry[] {
  const out: OutlineEntry[] = [];
  const seen = new Map<string, number>();
  const stack: PmNode[] = [doc];
  while (stack.length) {
    const node = stack.pop()!;
    if (node.type === 'heading') {
      const text = textOf(node).replace(/\s+/g, ' ').trim();
      const base = `${prefix}h-${slugify(text) || 'section'}`;
      const n = (seen.get(base) ?? 0) + 1;
      seen.set(base, n);
      const level = Number(node.attrs?.level);
      out.push({ level: Number.isInteger(level) && level >= 1 && level <= 4 ? level : 2, text, id: n === 1 ? base : `${base}-${n}` });
      continue;
    }
    if (node.content) for (let i = node.content.length - 1; i >= 0; i--) stack.push(node.content[i]);
  }
  return out;
}
