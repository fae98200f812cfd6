import type { SnippetPart } from './doc/marked-snippet';
import type { PmNode } from './doc/types';
import type { FileView, PageRef } from './schemas/file';

/**
 * The JSON the routes answer with, named once for both sides: the server builds its answers
 * as these types (with `When = Date`, before JSON.stringify turns dates into ISO strings) and
 * the islands read them (with the default `When = string`). A field added on one side is then a
 * type error on the other instead of a silent drift.
 */

/** Every refusal: a sentence a person can act on and, when one field is at fault, its name. */
export interface ApiErrorBody {
  error: string;
  field?: string;
}

export interface Author {
  id: string | null;
  name: string;
}

/** A revision in a history list: no document, so the list stays small. */
export interface RevisionSummary<When = string> {
  number: number;
  summary: string;
  author: Author;
  createdAt: When;
  restoredFrom: number | null;
}

/** One revision with its document and the plain text the diff and the search read. */
export interface RevisionWithDoc<When = string> extends RevisionSummary<When> {
  doc: PmNode;
  plainText: string;
}

export interface PageJson<When = string> {
  id: string;
  slug: string;
  title: string;
  section: { slug: string; title: string };
  currentRevision: number;
  inAdvance: boolean;
  createdAt: When;
  updatedAt: When;
}

/** GET /api/venues/:venue/pages/:page; `revision` is null only for a page without one. */
export interface PageAnswer<When = string> {
  page: PageJson<When>;
  revision: RevisionWithDoc<When> | null;
}

/** POST /api/venues/:venue/pages (201) and PUT /api/venues/:venue/pages/:page (200). */
export interface PageSaved<When = string> {
  page: PageJson<When>;
  revision: RevisionSummary<When> | RevisionWithDoc<When>;
}

/** The 409 of a save or a restore based on a revision that is no longer the current one. */
export interface SaveConflictBody<When = string> extends ApiErrorBody {
  current: RevisionWithDoc<When> | null;
}

/** GET /api/venues/:venue/pages/:page/revisions */
export interface HistoryAnswer<When = string> {
  page: { slug: string; title: string; currentRevision: number };
  revisions: RevisionSummary<When>[];
  /** Where the next, older page of the history starts; null when revision 1 is listed. */
  nextBefore: number | null;
}

/** GET /api/venues/:venue/pages/:page/revisions/:n */
export interface RevisionAnswer<When = string> {
  revision: RevisionWithDoc<When>;
}

/** POST /api/venues/:venue/pages/:page/revisions/:n/restore */
export interface RestoreAnswer<When = string> {
  revision: RevisionSummary<When>;
}

export interface SearchHit<When = string> {
  url: string;
  venue: { slug: string; name: string };
  page: { slug: string; title: string };
  section: { slug: string; title: string };
  updatedAt: When;
  titleParts: SnippetPart[];
  snippet: string;
  snippetParts: SnippetPart[];
}

/** GET /api/search?q= */
export interface SearchAnswer<When = string> {
  q: string;
  hits: SearchHit<When>[];
  /** The query matched more pages than are ranked (src/server/page-search.ts): these are the best of the newest. */
  recentOnly: boolean;
}

export interface SectionRow {
  slug: string;
  title: string;
  position: number;
  pageCount: number;
}

/** GET /api/venues/:venue/sections */
export interface SectionsAnswer {
  sections: SectionRow[];
}

/** GET /api/venues/:venue/files */
export interface FilesAnswer {
  files: FileView[];
}

/** GET / PATCH /api/venues/:venue/files/:id, and an upload's 201. */
export interface FileAnswer {
  file: FileView;
}

/** DELETE /api/venues/:venue/files/:id; its 409 carries `usedBy` too. */
export interface FileDeleted {
  deleted: string;
  usedBy: PageRef[];
}

export interface FileInUseBody extends ApiErrorBody {
  usedBy: PageRef[];
}

export interface VenueJson {
  id: string;
  slug: string;
  name: string;
}

/** POST /api/venues (201) */
export interface VenueCreated {
  venue: VenueJson;
}
