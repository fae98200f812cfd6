import { useEditorState, type Editor } from '@tiptap/react';
import { useEffect, useRef, useState } from 'react';
import { LinkForm } from './LinkForm';
import { PhotoDialog, type PhotoTarget } from './PhotoDialog';
import { ToolButton } from './ToolButton';
import { CROSSOVER_BLOCK, DELAY_BLOCK, EQ_BLOCK, newCrossoverBlock, newDelayBlock, newEqBlock } from '~/lib/doc/blocks/block-data';

type Block = 'p' | '1' | '2' | '3' | '4';

/** The editing controls above the page text; table controls appear while the cursor is in a table. */
export function EditorToolbar({ editor, photo }: { editor: Editor; photo: PhotoTarget }) {
  const [linkOpen, setLinkOpen] = useState(false);
  const [photoOpen, setPhotoOpen] = useState(false);
  // ProseMirror keeps the cursor after the text loses focus; before the first click it sits at the top.
  const everFocused = useRef(false);
  useEffect(() => {
    const onFocus = () => void (everFocused.current = true);
    editor.on('focus', onFocus);
    return () => void editor.off('focus', onFocus);
  }, [editor]);
  const s = useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      block: ([1, 2, 3, 4].find((level) => e.isActive('heading', { level }))?.toString() ?? 'p') as Block,
      bold: e.isActive('bold'),
      italic: e.isActive('italic'),
      bullet: e.isActive('bulletList'),
      ordered: e.isActive('orderedList'),
      tasks: e.isActive('taskList'),
      link: e.isActive('link'),
      inTable: e.isActive('table'),
      canUndo: e.can().undo(),
      canRedo: e.can().redo(),
    }),
  });
  const row = useRef<HTMLDivElement>(null);
  // Entering a table brings its tools (now first) back into view on a phone's scrolling row.
  useEffect(() => {
    if (s.inTable && row.current) row.current.scrollLeft = 0;
  }, [s.inTable]);
  const run = () => editor.chain().focus();
  const setBlock = (value: Block) => (value === 'p' ? run().setParagraph().run() : run().setHeading({ level: Number(value) as 1 | 2 | 3 | 4 }).run());
  const divider = <span aria-hidden="true" className="mx-1 h-6 w-px bg-line" />;

  // In a table its tools come first, so on a phone they are in view without scrolling the row.
  const tableTools = (
    <>
      <ToolButton label="Add a row below" onClick={() => run().addRowAfter().run()} testId="table-add-row">
        + Row
      </ToolButton>
      <ToolButton label="Add a column to the right" onClick={() => run().addColumnAfter().run()} testId="table-add-column">
        + Column
      </ToolButton>
      <ToolButton label="Remove this row" onClick={() => run().deleteRow().run()}>
        − Row
      </ToolButton>
      <ToolButton label="Remove this column" onClick={() => run().deleteColumn().run()}>
        − Column
      </ToolButton>
      <ToolButton label="Remove the whole table" onClick={() => run().deleteTable().run()} testId="table-delete">
        ✕ Table
      </ToolButton>
      {divider}
    </>
  );
  const tableInsert = (
    <ToolButton label="Insert a table" onClick={() => run().insertTable({ rows: 3, cols: 3, withHeaderRow: true }).run()} testId="table-insert">
      ▦ Table
    </ToolButton>
  );

  return (
    // On a phone the header wraps to two rows, so the toolbar sticks to the very top above it, in one scrolling row.
    <div className="sticky top-0 z-40 rounded-t-lg border border-b-0 border-line bg-surface sm:top-14 sm:z-20" data-testid="editor-toolbar">
      <div ref={row} role="toolbar" aria-label="Text formatting" className="flex items-center gap-1 overflow-x-auto p-1 sm:flex-wrap [&>*]:shrink-0">
        {s.inTable && tableTools}
        <label className="sr-only" htmlFor="tl-block-style">
          Text style
        </label>
        <select
          id="tl-block-style"
          value={s.block}
          onChange={(e) => setBlock(e.target.value as Block)}
          className="min-h-11 rounded-md border border-line bg-surface px-2 text-sm"
          data-testid="block-style"
        >
          <option value="p">Paragraph</option>
          <option value="1">Heading 1</option>
          <option value="2">Heading 2</option>
          <option value="3">Heading 3</option>
          <option value="4">Heading 4</option>
        </select>
        {divider}
        <ToolButton label="Bold" active={s.bold} onClick={() => run().toggleBold().run()}>
          <b>B</b>
        </ToolButton>
        <ToolButton label="Italic" active={s.italic} onClick={() => run().toggleItalic().run()}>
          <i>I</i>
        </ToolButton>
        <ToolButton label="Link" active={s.link || linkOpen} onClick={() => setLinkOpen((o) => !o)} testId="tool-link">
          Link
        </ToolButton>
        <ToolButton label="Photo" onClick={() => setPhotoOpen(true)} testId="tool-photo">
          ▣ Photo
        </ToolButton>
        {divider}
        <ToolButton label="Bulleted list" active={s.bullet} onClick={() => run().toggleBulletList().run()}>
          • List
        </ToolButton>
        <ToolButton label="Numbered list" active={s.ordered} onClick={() => run().toggleOrderedList().run()}>
          <svg width="16" height="14" viewBox="0 0 16 14" aria-hidden="true" className="mr-1">
            <path d="M6 2h10M6 7h10M6 12h10" stroke="currentColor" strokeWidth="1.6" />
            <path d="M1.5 1 2.5 0.5v3.5M1 12.5h2.5L1 10.2a1 1 0 1 1 2.2-.7" stroke="currentColor" strokeWidth="1" fill="none" />
          </svg>
          Numbered
        </ToolButton>
        <ToolButton label="Checklist" active={s.tasks} onClick={() => run().toggleTaskList().run()}>
          <span aria-hidden="true">☐</span>&nbsp;Checklist
        </ToolButton>
        {divider}
        {!s.inTable && tableInsert}
        {divider}
        <ToolButton label="Insert an EQ block" onClick={() => run().insertContent({ type: EQ_BLOCK, attrs: newEqBlock() }).run()} testId="insert-eq">
          EQ
        </ToolButton>
        <ToolButton label="Insert a crossover block" onClick={() => run().insertContent({ type: CROSSOVER_BLOCK, attrs: newCrossoverBlock() }).run()} testId="insert-crossover">
          Crossover
        </ToolButton>
        <ToolButton label="Insert a delay block" onClick={() => run().insertContent({ type: DELAY_BLOCK, attrs: newDelayBlock() }).run()} testId="insert-delay">
          Delay
        </ToolButton>
        {divider}
        <ToolButton label="Undo" disabled={!s.canUndo} onClick={() => run().undo().run()}>
          ↶ Undo
        </ToolButton>
        <ToolButton label="Redo" disabled={!s.canRedo} onClick={() => run().redo().run()}>
          ↷ Redo
        </ToolButton>
      </div>
      {linkOpen && <LinkForm editor={editor} onClose={() => setLinkOpen(false)} />}
      {photoOpen && <PhotoDialog editor={editor} {...photo} atEnd={!everFocused.current} onClose={() => setPhotoOpen(false)} />}
    </div>
  );
}
