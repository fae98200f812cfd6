import type { Editor } from '@tiptap/react';
import { useCallback, useEffect, useRef, useState } from 'react';
import { writeDraft } from './draft-store';

interface Fields {
  base: number;
  title: string;
  section: string;
  summary: string;
}

/**
 * Keeps a copy of the person's text in localStorage shortly after each change and when the tab
 * is hidden or closed. Nothing is written until they have actually changed something.
 */
export function useDraftAutosave(editor: Editor | null, venue: string, pageKey: string, fields: Fields) {
  const dirty = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const latest = useRef(fields);
  latest.current = fields;
  const [storageFailed, setStorageFailed] = useState(false);

  const flush = useCallback(() => {
    clearTimeout(timer.current);
    if (!editor || !dirty.current) return;
    const ok = writeDraft(venue, pageKey, { ...latest.current, doc: editor.getJSON(), savedAt: Date.now() });
    setStorageFailed(!ok);
  }, [editor, venue, pageKey]);

  const touch = useCallback(() => {
    dirty.current = true;
    clearTimeout(timer.current);
    timer.current = setTimeout(flush, 400);
  }, [flush]);

  useEffect(() => {
    if (!editor) return;
    const onUpdate = ({ transaction }: { transaction: { docChanged: boolean } }) => transaction.docChanged && touch();
    editor.on('update', onUpdate);
    const onHide = () => document.visibilityState === 'hidden' && flush();
    document.addEventListener('visibilitychange', onHide);
    window.addEventListener('pagehide', flush);
    return () => {
      editor.off('update', onUpdate);
      document.removeEventListener('visibilitychange', onHide);
      window.removeEventListener('pagehide', flush);
      clearTimeout(timer.current);
    };
  }, [editor, touch, flush]);

  /** After a successful save: stop writing, so the cleared drafts stay cleared. */
  const settle = useCallback(() => {
    dirty.current = false;
    clearTimeout(timer.current);
  }, []);

  return { touch, flush, settle, storageFailed };
}
