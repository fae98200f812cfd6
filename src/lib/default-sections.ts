/** The sections a new venue starts with, in reading order; each venue can change them. */
export const DEFAULT_SECTIONS: readonly { slug: string; title: string }[] = [
  { slug: 'pa-system', title: 'PA system' },
  { slug: 'control', title: 'Control and FOH' },
  { slug: 'stage', title: 'Stage I/O and patch' },
  { slug: 'monitors', title: 'Monitors' },
  { slug: 'power', title: 'Power' },
  { slug: 'rigging', title: 'Rigging' },
  { slug: 'logistics', title: 'Logistics and access' },
  { slug: 'contacts', title: 'Contacts' },
];
