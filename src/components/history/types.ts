import type { PmNode } from '~/lib/doc/types';

export interface RevisionSummary {
  number: number;
  summary: string;
  author: { id: string | null; name: string };
  createdAt: string;
  restoredFrom: number | null;
}

export interface RevisionFull extends RevisionSummary {
  plainText: string;
  doc: PmNode;
}

export interface HistoryAnswer {
  page: { slug: string; title: string; currentRevision: number };
  revisions: RevisionSummary[];
  /** Where the next, older page of the history starts; null when revision 1 is listed. */
  nextBefore: number | null;
}
