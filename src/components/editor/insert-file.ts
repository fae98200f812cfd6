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
    return chain.setImage({ src: file.displayUrl, alt: file.caption || file.originalName }).scrollIntoView().run();
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
