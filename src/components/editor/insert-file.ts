import type { Editor } from '@tiptap/react';
import type { FileView } from '~/lib/schemas/file';

/**
 * Puts a stored file into the page at the cursor: a photo as an image block (its display size,
 * described by its caption), a PDF as a link named after the file. `atEnd` is for an editor the
 * person never clicked into, whose cursor would otherwise sit before the first line.
 */
export function insertFile(editor: Editor, file: FileView, atEnd = false): boolean {
  const chain = editor.chain().focus(atEnd ? 'end' : undefined);
  if (file.kind === 'image' && file.displayUrl) {
    const image = {
      type: 'image',
      // The caption shows under the photo on the read page; the description is what a screen reader says.
      attrs: { src: file.displayUrl, alt: file.caption || file.originalName, title: file.caption || null, ...displaySize(file) },
    };
    // A photo dropped into a table cell would stretch its column across the page: it goes after the table.
    const afterTable = tableEnd(editor);
    if (afterTable !== null) return chain.insertContentAt(afterTable, image).scrollIntoView().run();
    return chain.insertContent(image).scrollIntoView().run();
  }
  // Links are inclusive while autolink is on; the plain space after it keeps further typing out of it.
  return chain
    .insertContent([
      { type: 'text', text: file.originalName || 'file', marks: [{ type: 'link', attrs: { href: file.url } }] },
      { type: 'text', text: ' ' },
    ])
    .scrollIntoView()
    .run();
}

/** The display rendition's size: the original scaled to at most 1600 px on its long edge. */
function displaySize(file: FileView): { width?: number; height?: number } {
  if (!file.width || !file.height) return {};
  const scale = Math.min(1, 1600 / Math.max(file.width, file.height));
  return { width: Math.max(1, Math.round(file.width * scale)), height: Math.max(1, Math.round(file.height * scale)) };
}

/** The position just after the outermost table holding the cursor, or null outside tables. */
function tableEnd(editor: Editor): number | null {
  const { $from } = editor.state.selection;
  for (let depth = 1; depth <= $from.depth; depth++) {
    if ($from.node(depth).type.name === 'table') return $from.after(depth);
  }
  return null;
}
