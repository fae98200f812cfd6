/**
 * Tiny helpers that build Tiptap/ProseMirror JSON for the demo pages
 * (StarterKit + table + link schema). Only used by the seed data.
 */

export type PmNode = {
  type: string;
  attrs?: Record<string, unknown>;
  content?: PmNode[];
  text?: string;
  marks?: { type: string; attrs?: Record<string, unknown> }[];
};

/** Inline content: plain text, or a text node made by b(), i(), link() or code(). */
export type Inline = string | PmNode;

/** A list item: one inline piece, or several forming one paragraph. */
export type ListItem = Inline | Inline[];

export type HeadingLevel = 1 | 2 | 3 | 4;

function textNode(text: string, marks?: PmNode['marks']): PmNode {
  return marks && marks.length > 0 ? { type: 'text', text, marks } : { type: 'text', text };
}

function toInlineNodes(parts: Inline[]): PmNode[] {
  const nodes: PmNode[] = [];
  for (const part of parts) {
    const node = typeof part === 'string' ? textNode(part) : part;
    // ProseMirror forbids empty text nodes.
    if (node.type === 'text' && !node.text) continue;
    nodes.push(node);
  }
  return nodes;
}

/** The whole document. */
export function doc(...blocks: PmNode[]): PmNode {
  return { type: 'doc', content: blocks };
}

export function h(level: HeadingLevel, text: string): PmNode {
  const content = toInlineNodes([text]);
  return content.length > 0
    ? { type: 'heading', attrs: { level }, content }
    : { type: 'heading', attrs: { level } };
}

/** A paragraph; with no text it has no `content` at all. */
export function p(...inline: Inline[]): PmNode {
  const content = toInlineNodes(inline);
  return content.length > 0 ? { type: 'paragraph', content } : { type: 'paragraph' };
}

export function b(text: string): PmNode {
  return textNode(text, [{ type: 'bold' }]);
}

export function i(text: string): PmNode {
  return textNode(text, [{ type: 'italic' }]);
}

export function link(text: string, href: string): PmNode {
  return textNode(text, [{ type: 'link', attrs: { href } }]);
}

export function code(text: string): PmNode {
  return textNode(text, [{ type: 'code' }]);
}

function listItem(item: ListItem): PmNode {
  const parts = Array.isArray(item) ? item : [item];
  return { type: 'listItem', content: [p(...parts)] };
}

export function ul(...items: ListItem[]): PmNode {
  return { type: 'bulletList', content: items.map(listItem) };
}

export function ol(...items: ListItem[]): PmNode {
  return { type: 'orderedList', content: items.map(listItem) };
}

/** A table with one header row; every row should have as many cells as the header. */
export function table(headerRow: string[], ...rows: string[][]): PmNode {
  const row = (cells: string[], cellType: 'tableHeader' | 'tableCell'): PmNode => ({
    type: 'tableRow',
    content: cells.map((cell) => ({ type: cellType, content: [p(cell)] })),
  });
  return { type: 'table', content: [row(headerRow, 'tableHeader'), ...rows.map((r) => row(r, 'tableCell'))] };
}

/** A safety note: a paragraph starting with a bold "Caution:". */
export function note(text: string): PmNode {
  return p(b('Caution:'), ' ', text);
}

export function hr(): PmNode {
  return { type: 'horizontalRule' };
}
