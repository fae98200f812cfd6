import { createContext, useContext } from 'react';

/** Which venue (and page) the editor is writing in, for node views that talk to the venue's files. */
export interface BlockVenue {
  venueSlug: string;
  pageSlug?: string;
  mayUpload: boolean;
}

// Node views render through portals inside EditorContent, so a provider around it reaches them.
export const BlockVenueContext = createContext<BlockVenue | null>(null);

export function useBlockVenue(): BlockVenue | null {
  return useContext(BlockVenueContext);
}
