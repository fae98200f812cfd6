import type { PmNode } from './doc-builder';

export type { PmNode };

export interface SeedSection {
  slug: string;
  title: string;
}

export interface SeedRevision {
  doc: PmNode;
  summary: string;
  author: 'manager' | 'engineer' | 'admin';
  daysAgo: number;
}

export interface SeedPage {
  /** A section slug of the same venue. */
  section: string;
  slug: string;
  title: string;
  inAdvance: boolean;
  /** Oldest first; the last one is the current revision. */
  revisions: SeedRevision[];
}

export interface SeedVenue {
  slug: string;
  name: string;
  town: string;
  sections: SeedSection[];
  pages: SeedPage[];
}
