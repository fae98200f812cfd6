/**
 * Length limits of the text fields, shared by the zod schemas (which refuse more) and the
 * islands (whose inputs stop at the same length). Kept apart from the schemas so an island does
 * not ship a validation library just to read a number.
 */

export const PAGE_TITLE_MAX = 140;
/** A revision's one-line summary. */
export const SUMMARY_MAX = 200;
export const SEARCH_MAX_LENGTH = 200;
export const SECTION_TITLE_MAX = 60;
export const SLUG_MAX = 60;
export const VENUE_NAME_MIN = 2;
export const VENUE_NAME_MAX = 120;
export const TOWN_MAX = 120;
