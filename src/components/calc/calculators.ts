/** The calculator screens, in the order the index shows them; the offline list is built from it too. */
export interface CalculatorEntry {
  path: string;
  title: string;
  summary: string;
  guide: string;
}

export const CALCULATORS: readonly CalculatorEntry[] = [
  { path: '/calc/bandwidth', title: 'Band and Q', summary: 'Q ↔ octaves, band edges and centre, fractional-octave band table, note names.', guide: 'bandwidth' },
  { path: '/calc/spl', title: 'Sound level', summary: 'Add sources, level over distance, background noise, A/C/Z weighting, daily exposure.', guide: 'sound-level' },
  { path: '/calc/delay', title: 'Delay and alignment', summary: 'Distance ↔ ms ↔ samples with temperature and humidity, fill alignment, sub and top at the crossover.', guide: 'delay' },
  { path: '/calc/levels', title: 'Levels and loads', summary: 'dBu, dBV, dBFS, volts and watts; speaker load per amp channel; maximum SPL at a distance.', guide: 'levels-and-loads' },
  { path: '/calc/waves', title: 'Wavelength and air', summary: 'Wavelength, comb-filter nulls, air absorption over a throw, end-fire and gradient sub arrays.', guide: 'wavelength-and-air' },
  { path: '/calc/dose', title: 'Show dose', summary: 'Noise dose and TWA (OSHA, NIOSH), EU LEX,8h against 80/85/87, and Leq from readings.', guide: 'show-dose' },
  { path: '/calc/response', title: 'Filter response', summary: 'Plot a chain of EQ and crossover filters: magnitude and phase.', guide: 'filter-response' },
  { path: '/calc/signal', title: 'Test signal', summary: 'Pink noise, white noise or a sine from this device, starting quiet.', guide: 'test-signal' },
];

/** Static files an offline visit needs besides the pages and their /_astro assets. */
export const OFFLINE_STATIC = ['/manifest.webmanifest', '/favicon.svg', '/icons/icon.svg', '/icons/icon-192.png', '/icons/icon-512.png'] as const;
