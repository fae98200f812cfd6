import { EditorContent, useEditor } from '@tiptap/react';
import { useEffect, useMemo, useState } from 'react';
import { docPlainText, renderDocHtml } from '~/lib/doc/render-html';
import type { PmNode } from '~/lib/doc/types';
import { BlockVenueContext } from './blocks/block-venue';
import { editorExtensions } from './blocks/editor-extensions';
import { ConflictPanel } from './ConflictPanel';
import { copyRich } from './copy-text';
import { DraftNotice } from './DraftNotice';
import { clearDrafts, NEW_PAGE_KEY, readDrafts, type Draft } from './draft-store';
import { EditorToolbar } from './EditorToolbar';
import { createPage, savePage, type CurrentRevision } from '~/components/api/pages';
import { PageFields } from './PageFields';
import { SaveBar } from './SaveBar';
import { useDraftAutosave } from './use-draft-autosave';
import { useKeyboardInset } from './keyboard-inset';

export interface PageEditorProps {
  venue: { slug: string; name: string };
  sections: { slug: string; title: string }[];
  /** Absent when creating a page. */
  page?: { slug: string; title: string; section: string };
  /** The revision the editor opens on (absent when creating). */
  current?: CurrentRevision;
  /** Whether this person may upload photos (the page decides with `can()`); picking stored ones is always offered. */
  mayUpload?: boolean;
}

const EMPTY_DOC: PmNode = { type: 'doc', content: [{ type: 'paragraph' }] };
type Status = { kind: 'idle' } | { kind: 'saving' } | { kind: 'error'; message: string; field?: string };

/** The page editor island: title and section, the text with its toolbar, drafts, save and conflicts. */
export default function PageEditor({ venue, sections, page, current, mayUpload = false }: PageEditorProps) {
  const pageKey = page?.slug ?? NEW_PAGE_KEY;
  const [base, setBase] = useState(current?.number ?? 0);
  const [title, setTitle] = useState(page?.title ?? '');
  const [section, setSection] = useState(page?.section ?? sections[0]?.slug ?? '');
  const [summary, setSummary] = useState('');
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const [conflict, setConflict] = useState<{ theirs: CurrentRevision; fromDraft: boolean } | null>(null);
  const [offer, setOffer] = useState<Draft | null>(null);
  const [setAside, setSetAside] = useState<PmNode | null>(null);
  const [copied, setCopied] = useState(false);

  const editor = useEditor({
    extensions: editorExtensions,
    content: current?.doc ?? EMPTY_DOC,
    immediatelyRender: false,
    editorProps: {
      attributes: {
        class: 'prose-book tl-editor min-h-[45vh] rounded-b-lg border border-line bg-surface p-3 sm:p-4',
        'aria-label': 'Page text',
        'aria-multiline': 'true',
        role: 'textbox',
        'data-testid': 'editor',
      },
      // The cursor is scrolled into view clear of the sticky toolbar above and the save bar below.
      scrollMargin: { top: 72, bottom: 96, left: 8, right: 8 },
      scrollThreshold: { top: 72, bottom: 96, left: 8, right: 8 },
    },
  });
  useKeyboardInset();
  const blockVenue = useMemo(() => ({ venueSlug: venue.slug, pageSlug: page?.slug, mayUpload }), [venue.slug, page?.slug, mayUpload]);
  const drafts = useDraftAutosave(editor, venue.slug, pageKey, { base, title, section, summary });

  // Once the editor exists: offer any unsaved text this device kept from an earlier visit.
  useEffect(() => {
    if (!editor) return;
    const [newest] = readDrafts(venue.slug, pageKey);
    if (!newest) return;
    const same = JSON.stringify(newest.doc) === JSON.stringify(editor.getJSON()) && newest.title === title;
    if (same) clearDrafts(venue.slug, pageKey);
    else setOffer(newest);
    // Runs once per editor instance; the initial title is what the draft is compared with.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [editor]);

  if (!editor) return <p className="text-muted">Loading the editor…</p>;
  const ed = editor;

  function restoreDraft(draft: Draft) {
    ed.commands.setContent(draft.doc);
    setTitle(draft.title || title);
    setSection(draft.section || section);
    setSummary(draft.summary);
    if (current && draft.base < base) {
      // The text stays based on its own revision until the person chooses how to go on.
      setBase(draft.base);
      setConflict({ theirs: current, fromDraft: true });
    }
    setOffer(null);
    drafts.touch();
  }

  async function save(onBase = base) {
    setStatus({ kind: 'saving' });
    drafts.flush();
    const doc = ed.getJSON() as PmNode;
    const result = page
      ? await savePage(venue.slug, page.slug, {
          doc,
          baseRevision: onBase,
          summary,
          ...(title !== page.title ? { title } : {}),
          ...(section !== page.section ? { section } : {}),
        })
      : await createPage(venue.slug, { doc, title, section, summary });
    if (result.kind === 'ok') {
      drafts.settle();
      clearDrafts(venue.slug, pageKey);
      window.location.assign(result.url);
      return;
    }
    if (result.kind === 'conflict') {
      // `base` stays where the text started, so a draft written now is still recognised as stale.
      setConflict({ theirs: result.current, fromDraft: false });
      setStatus({ kind: 'idle' });
      return;
    }
    setStatus({ kind: 'error', message: result.message, field: result.field });
  }

  function takeTheirs() {
    if (!conflict) return;
    setSetAside(ed.getJSON() as PmNode);
    ed.commands.setContent(conflict.theirs.doc);
    setBase(conflict.theirs.number);
    setConflict(null);
  }

  async function copy(doc: PmNode) {
    setCopied(await copyRich(renderDocHtml(doc), docPlainText(doc)));
    setTimeout(() => setCopied(false), 2500);
  }

  return (
    <div className="space-y-4" data-testid="page-editor" data-base={base}>
      {offer && (
        <DraftNotice
          draft={offer}
          base={base}
          onRestore={() => restoreDraft(offer)}
          onDiscard={() => {
            clearDrafts(venue.slug, pageKey);
            setOffer(null);
          }}
        />
      )}
      {setAside && (
        <div className="rounded-lg border border-line bg-sunken p-3 text-sm" data-testid="set-aside">
          <p>Your own version is set aside until you leave this page.</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <button type="button" className="min-h-11 rounded-md border border-line bg-surface px-3" onClick={() => copy(setAside)}>
              {copied ? 'Copied ✓' : 'Copy my version'}
            </button>
            <button type="button" className="min-h-11 rounded-md border border-line bg-surface px-3" onClick={() => { ed.commands.setContent(setAside); setSetAside(null); drafts.touch(); }}>
              Put my version back
            </button>
            <button type="button" className="min-h-11 rounded-md px-3 hover:bg-surface" onClick={() => setSetAside(null)}>
              Dismiss
            </button>
          </div>
        </div>
      )}
      <PageFields
        isNew={!page}
        title={title}
        section={section}
        sections={sections}
        error={status.kind === 'error' ? status : undefined}
        onTitle={(t) => { setTitle(t); drafts.touch(); }}
        onSection={(s) => { setSection(s); drafts.touch(); }}
        venueSlug={venue.slug}
      />
      <div className={conflict ? 'grid gap-4 lg:grid-cols-2' : ''}>
        {conflict && (
          <ConflictPanel
            theirs={conflict.theirs}
            fromDraft={conflict.fromDraft}
            busy={status.kind === 'saving'}
            copied={copied}
            onKeepMine={() => save(conflict.theirs.number)}
            onTakeTheirs={takeTheirs}
            onCopyMine={() => copy(ed.getJSON() as PmNode)}
          />
        )}
        <div>
          {conflict && <h3 className="mb-1 text-sm font-semibold uppercase tracking-wide text-muted">Your text (you can still edit it)</h3>}
          <EditorToolbar editor={ed} photo={{ venueSlug: venue.slug, pageSlug: page?.slug, mayUpload }} />
          <BlockVenueContext.Provider value={blockVenue}>
            <EditorContent editor={ed} />
          </BlockVenueContext.Provider>
        </div>
      </div>
      <SaveBar
        summary={summary}
        onSummary={(v) => { setSummary(v); drafts.touch(); }}
        onSave={() => save()}
        saving={status.kind === 'saving'}
        blocked={conflict !== null}
        error={status.kind === 'error' && status.field !== 'title' ? status.message : undefined}
        storageFailed={drafts.storageFailed}
        cancelHref={page ? `/venues/${venue.slug}/${page.slug}` : `/venues/${venue.slug}`}
        isNew={!page}
      />
    </div>
  );
}
