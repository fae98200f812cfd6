/**
 * Venue 1: The Haverkin Hall, a ~900-capacity music hall (floor plus balcony). The demo's main venue.
 */
import { haverkinHousePages } from './haverkin-hall-house';
import { haverkinPaPages } from './haverkin-hall-pa';
import { haverkinStagePages } from './haverkin-hall-stage';
import { standardSections } from './sections';
import type { SeedVenue } from './types';

export const haverkinHall: SeedVenue = {
  slug: 'haverkin-hall',
  name: 'The Haverkin Hall',
  town: 'Saltmarrow',
  sections: standardSections,
  pages: [...haverkinPaPages, ...haverkinStagePages, ...haverkinHousePages],
};
