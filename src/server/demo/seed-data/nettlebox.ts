/**
 * Venue 2: The Nettlebox, a ~250-capacity club in a former rope store.
 * Two pages have history: front fills were added 60 days ago.
 */
import { b, code, doc, h, i, link, note, ol, p, table, ul } from './doc-builder';
import { standardSections } from './sections';
import type { PmNode, SeedPage, SeedVenue } from './types';

function paOverview(frontFills: boolean): PmNode {
  return doc(
    h(2, 'Room'),
    p(
      'One room, 17 m long × 10 m wide, ceiling 4.2 m. Stage at the narrow end, 6 m wide × 4 m deep × 0.6 m high. Bar along the right-hand wall. Capacity 250 standing.',
    ),
    h(2, 'System'),
    table(
      ['Zone', 'Boxes', 'Where'],
      ['Tops', '2 × Corvane Linnet L12 per side', 'Flown from the stage-front beam, bottom box at 2.6 m'],
      ['Subs', '4 × Corvane TS18', 'Under the stage lip, a pair either side of the stage steps'],
      ...(frontFills ? [['Front fills', '2 × Corvane Wren W5', 'Stage lip, 1.5 m either side of centre']] : []),
    ),
    ul(
      'Linnet L12: 12 in + 1.4 in HF on a 90° × 50° rotatable horn, 8 Ω. Upper box aimed at the back wall (−5°), lower box rotated and tilted −25° for the front half of the room.',
      'TS18: 1 × 18 in, 8 Ω. Both pairs face forward; no cardioid arrangement (there is no room behind them).',
      'Crossover 100 Hz LR24. Subs 1.0 ms later than the tops, set by phase match at FOH.',
      ...(frontFills
        ? ['Front fills carry a mono sum, delayed 4.8 ms to sit behind the tops 2 m from the stage. They cover the first three metres, which the flown tops miss.']
        : []),
    ),
    h(2, 'What to expect'),
    ul(
      'Plenty of level for the room; the limit is the neighbours, not the PA (see Noise limit and curfew).',
      'Low ceiling: the room gets loud in the low mids quickly. Less is more below 300 Hz.',
      'The stage is hollow. The house EQ takes some 120 Hz out; the rest is up to your mix.',
    ),
  );
}

function ampsAndProcessing(frontFills: boolean): PmNode {
  return doc(
    h(2, 'Processor'),
    ul(
      'Trellin SP-48 (4 in, 8 out) at 96 kHz, in the rack under the stage right steps.',
      ['Preset ', code(frontFills ? 'NB-HOUSE 2' : 'NB-HOUSE 1'), ', locked.'],
      'Inputs: L/R as AES67 on the audio network, AES3 fallback from FOH, analogue last resort.',
    ),
    table(
      ['Out', 'Feeds', 'Delay', 'EQ / notes'],
      ['1', 'Top L upper', '0 ms', 'HP 100 Hz LR24'],
      ['2', 'Top L lower', '0 ms', 'HP 100 Hz LR24, −2 dB'],
      ['3', 'Top R upper', '0 ms', 'HP 100 Hz LR24'],
      ['4', 'Top R lower', '0 ms', 'HP 100 Hz LR24, −2 dB'],
      ['5', 'Subs L pair', '1.0 ms', 'LP 100 Hz LR24, HP 30 Hz'],
      ['6', 'Subs R pair', '1.0 ms', 'LP 100 Hz LR24, HP 30 Hz'],
      ['7', frontFills ? 'Front fills (mono)' : 'Spare', frontFills ? '4.8 ms' : '', frontFills ? 'HP 120 Hz' : ''],
      ['8', 'Spare', '', ''],
    ),
    p('Tops EQ: −3 dB at 120 Hz Q 2 (hollow stage), −2 dB at 3.15 kHz Q 3.'),
    h(2, 'Amplifiers'),
    table(
      ['Amp', 'Ch', 'Feeds', 'Load'],
      ['1', '1–2', 'Top L upper, lower', '8 Ω'],
      ['1', '3–4', 'Top R upper, lower', '8 Ω'],
      ['2', '1', 'Subs L pair', '4 Ω'],
      ['2', '2', 'Subs R pair', '4 Ω'],
      ['2', '3–4', frontFills ? 'Front fills L, R' : 'Spare', frontFills ? '16 Ω' : ''],
      ['3', '1–4', 'Wedges 1–4', '8 Ω'],
      ['4', '1–2', 'Wedges 5–6', '8 Ω'],
      ['4', '3', 'Drum fill', '8 Ω'],
      ['4', '4', 'Spare', ''],
    ),
    p('All four amps are Halvard HX4-6 (4 × 1500 W into 4 Ω) in one rack under the stage right steps. The rack fans pull air from under the stage: keep the grille clear.'),
  );
}

const fohAndNoise = doc(
  h(2, 'FOH'),
  ul(
    'At the back of the room beside the bar, 11 m from the stage lip, on a 0.3 m platform 2.4 m wide. A guest console up to 1.2 m wide fits beside the house one.',
    'House console: Quillon Q-Desk 32 (32 inputs at 96 kHz, 16 mixes). Monitors are mixed from FOH unless you bring an engineer and a console.',
    ['Base show file: ', code('NETTLEBOX-BASE'), '.'],
    'One network cable (AES67, primary only) runs to the stage box, with a spare cable in the duct.',
    'Guest consoles: AES67 if compatible, otherwise L/R/Sub as AES3 or analogue at the FOH panel. No MADI.',
    'Power at FOH: 16 A from the audio distro, phase L1.',
  ),
  h(2, 'Noise limit'),
  table(
    ['Measure', 'Limit', 'Where'],
    ['LAeq, 15 min', '98 dBA', 'FOH, house meter'],
    ['LCeq, 15 min', '110 dBC', 'FOH, house meter'],
  ),
  ul(
    'There are flats above the bar. Low end travels through the building, hence the tight dBC limit.',
    'The yard doors stay shut from soundcheck to the end of the show.',
  ),
  h(2, 'Curfew'),
  ul(
    [b('23:00'), ' Sunday to Thursday, ', b('23:30'), ' Friday and Saturday: music off.'],
    'Load-out as quietly as you can: the alley is under bedroom windows.',
  ),
  note('The room is small and hard. Long shows near the limit can still damage hearing. Earplugs are free at the bar; house staff wear them during shows.'),
);

const inputAndPatch = doc(
  p('House default list for a five-piece. Stage box: Quillon SB-32 (32 in, 16 out) at stage right, on the floor behind the bass amp.'),
  h(2, 'Inputs'),
  table(
    ['Ch', 'Source', 'Mic / DI', 'Stand', 'Notes'],
    ['1', 'Kick', 'Fennick KD-3', 'Short boom', ''],
    ['2', 'Snare', 'Orbel OD-7', 'Short boom', ''],
    ['3', 'Hi-hat', 'Orbel OC-4', 'Short boom', 'Phantom'],
    ['4', 'Rack tom', 'Orbel TC-2', 'Clip', ''],
    ['5', 'Floor tom', 'Orbel TC-2', 'Clip', ''],
    ['6', 'Overhead L', 'Orbel OC-4', 'Tall boom', 'Phantom'],
    ['7', 'Overhead R', 'Orbel OC-4', 'Tall boom', 'Phantom'],
    ['8', 'Bass DI', 'Sallow DA-2 (active)', '', 'Phantom'],
    ['9', 'Guitar 1', 'Orbel OD-7', 'Short boom', ''],
    ['10', 'Guitar 2', 'Orbel OD-7', 'Short boom', ''],
    ['11', 'Keys L', 'Sallow DA-2S (stereo)', '', 'Phantom'],
    ['12', 'Keys R', 'Sallow DA-2S (stereo)', '', ''],
    ['13', 'Acoustic / spare DI', 'Sallow DA-2 (active)', '', 'Phantom'],
    ['14', 'Playback L', 'Sallow DA-2S (stereo)', '', ''],
    ['15', 'Playback R', 'Sallow DA-2S (stereo)', '', ''],
    ['16', 'Vocal SR', 'Orbel OD-9S', 'Tall boom', ''],
    ['17', 'Lead vocal', 'Orbel OD-9S', 'Tall boom', ''],
    ['18', 'Vocal SL', 'Orbel OD-9S', 'Tall boom', ''],
    ['19', 'Drum vocal', 'Orbel OD-9S', 'Tall boom', ''],
    ['20', 'Spare vocal', 'Orbel OD-9S', 'Tall boom', ''],
    ['21–24', 'Spare', '', '', ''],
  ),
  h(2, 'Stage box patch'),
  table(
    ['Ports', 'Usual position', 'Carries'],
    ['In 1–8', '8-way tail, drum riser', 'Ch 1–7, 19'],
    ['In 9–16', '8-way tail, stage left', 'Ch 9, 10, 13, 18; 4 spare'],
    ['In 17–24', 'Box face, stage right', 'Ch 8, 11, 12, 14–17, 20'],
    ['In 25–32', 'Box face', 'Spare'],
    ['Out 1–6', 'Amps 3 and 4', 'Wedges 1–6 (aux 1–6)'],
    ['Out 7', 'Amp 4 ch3', 'Drum fill (aux 7)'],
    ['Out 8–9', 'IEM transmitter', 'Aux 8–9 (stereo)'],
    ['Out 10', 'Stage talkback speaker', 'FOH talkback'],
    ['Out 11–16', 'Spare', ''],
  ),
  p(i('The console channel patch follows the house list. Tell us your list in advance and we will pre-patch before you arrive.')),
);

const monitors = doc(
  ul(
    '6 × Corvane MW12 wedges (12 in coaxial, 8 Ω), one amp channel each.',
    'Drum fill: one Corvane MW15 (no sub; the room provides plenty).',
    'One Pellan IR-4 stereo IEM transmitter with two belt packs. Bring your own IEMs beyond that.',
    'Mixes come from FOH auxes 1–9. A guest monitor console can sit on the stage left wing platform (1.5 m × 1.5 m).',
  ),
  table(
    ['Mix', 'Output', 'Position', 'Notes'],
    ['1', 'Wedge 1', 'Downstage left', ''],
    ['2', 'Wedge 2', 'Downstage centre', 'Lead vocal'],
    ['3', 'Wedge 3', 'Downstage right', ''],
    ['4', 'Wedge 4', 'Stage left, guitar', ''],
    ['5', 'Wedge 5', 'Stage right, bass', ''],
    ['6', 'Wedge 6', 'Upstage right, keys', ''],
    ['7', 'Drum fill', 'Drum riser', ''],
    ['8–9', 'IEM (stereo)', 'Any', 'One performer'],
  ),
  p('With the ceiling this low, wedges feed back earlier than you expect. Ring them out with the band\'s vocal mics, not the house spares.'),
);

const power = doc(
  ul(
    'Audio: a 32 A three-phase supply, 230/400 V 50 Hz, from its own way in the board in the back corridor. Not shared with lighting or the bar.',
    'Audio distro: stage right wall, lockable. Amp rack on L2 and L3, stage sockets and FOH on L1.',
    'Lighting: separate 63 A three-phase supply with its own board. Haze machine and dimmers are on it, never on audio.',
  ),
  table(
    ['Way', 'Phase', 'Rating', 'Feeds'],
    ['1', 'L1', '16 A', 'Stage sockets (6 outlets, grey, labelled AUDIO)'],
    ['2', 'L1', '16 A', 'FOH'],
    ['3', 'L2', '16 A', 'Amps 1 and 2 (PA)'],
    ['4', 'L3', '16 A', 'Amps 3 and 4 (monitors), processor'],
  ),
  p('No touring power outlet. Touring audio runs from the house distro, or from a temporary supply installed by an electrician.'),
  note(
    'Only a qualified electrician connects or alters distribution or temporary supplies. Local electrical codes decide what is allowed. Ask the venue manager to book the contract electrician.',
  ),
);

const rigging = doc(
  p(
    'One steel beam across the stage front, 3.8 m above the floor, and a short lighting truss over the stage. The building\'s structural survey (reference ',
    b('NB-S-02'),
    ') governs all loads.',
  ),
  table(
    ['Point', 'Location', 'WLL per point', 'Current use'],
    ['F1', 'Stage-front beam, stage left end', '250 kg', 'PA left (about 70 kg)'],
    ['F2, F3', 'Stage-front beam, centre', '250 kg', 'Free'],
    ['F4', 'Stage-front beam, stage right end', '250 kg', 'PA right (about 70 kg)'],
    ['T1, T2', 'Lighting truss pickups', '200 kg', 'House lighting truss (about 140 kg total)'],
  ),
  ul(
    'Combined limit on the beam: 600 kg.',
    'No chain hoists in house. The tops go up on a wind-up stand and are pinned to the yokes by two people.',
    'No rigging from the ceiling, pipes or the bar canopy.',
  ),
  note(
    'These figures are for planning only. A competent rigger decides how anything is hung, and the structural survey governs. Tell the venue manager about any touring rigging before the day.',
  ),
);

const loadIn = doc(
  h(2, 'Access'),
  ul(
    'Address: The Nettlebox, 3 Cooper\'s Wynd, Tansy Ferry.',
    [b('Load-in door: '), 'side alley off Cooper\'s Wynd. Door 1.2 m wide × 2.1 m high, then ', b('three steps down'), ' into the room. No ramp and no lift: bring a hand truck and plan for cases up to 1.1 m wide.'],
    'Stage is 0.6 m high; stage-front steps at stage right.',
  ),
  h(2, 'Parking'),
  ul(
    'Loading on Cooper\'s Wynd: 20 minutes, hazards on, someone with the vehicle.',
    'Then the public car park on Mill Quay, 150 m. Vans over 2.1 m high do not fit under its barrier; use the street bays on Mill Quay after 18:00.',
  ),
  h(2, 'Times'),
  table(
    ['Time', 'What'],
    ['16:00', 'Load-in (the room is a café until 15:30)'],
    ['17:00', 'Soundcheck'],
    ['19:30', 'Doors'],
    ['23:00 / 23:30', 'Curfew (Sunday–Thursday / Friday–Saturday)'],
    ['00:30', 'Out'],
  ),
  h(2, 'Crew'),
  ul(
    'One green room behind the stage with a shower. Towels on request.',
    [b('Wi-Fi: '), '"Nettle-Crew", password on the green room door.'],
    'Food: buy-out by default; a hot meal can be arranged with 7 days\' notice.',
  ),
);

const houseChecklist = doc(
  p('For the house tech. Takes about 10 minutes.'),
  h(2, 'Opening'),
  ol(
    'Audio distro on; check all four ways are live.',
    'Processor and stage box, then the console. Wait for the network lock light on the stage box.',
    'Amps 1–4 last, one at a time.',
    'Pink noise at low level through each box in turn; listen for rattles in the stage.',
  ),
  h(2, 'Closing'),
  ol('Amps off first, then the console, stage box, processor.', 'Mics back in the case, counted. Radio pack batteries on charge.', 'Yard doors locked, meter log exported to the office folder.'),
  p('Faults to the venue manager by e-mail: ', link('venue@nettlebox.test', 'mailto:venue@nettlebox.test'), '.'),
);

const contacts = doc(
  table(
    ['Role', 'Name', 'Phone', 'E-mail'],
    ['Venue manager', 'Joss Emberly', '+00 0180 555 0201', 'venue@nettlebox.test'],
    ['House technician', 'Rue Haddow', '+00 0180 555 0202', 'tech@nettlebox.test'],
    ['Bookings', 'Femi Catterall', '+00 0180 555 0203', 'bookings@nettlebox.test'],
    ['Contract electrician', 'Aled Penhallow', '+00 0180 555 0204', 'electrics@nettlebox.test'],
  ),
  p('Advance to the house technician at least 7 days ahead: input list, stage plot, anything unusual (haze, radio, rigging).'),
);

const pages: SeedPage[] = [
  {
    section: 'pa-system',
    slug: 'pa-overview',
    title: 'PA overview',
    inAdvance: true,
    revisions: [
      { doc: paOverview(false), summary: 'First version of the PA overview', author: 'admin', daysAgo: 300 },
      { doc: paOverview(true), summary: 'Added two front fills on the stage lip', author: 'admin', daysAgo: 60 },
    ],
  },
  {
    section: 'pa-system',
    slug: 'amps-and-processing',
    title: 'Amps and processing',
    inAdvance: false,
    revisions: [
      { doc: ampsAndProcessing(false), summary: 'Processor outputs and amp patch', author: 'admin', daysAgo: 300 },
      { doc: ampsAndProcessing(true), summary: 'Front fills on processor output 7 and amp 2 ch3–4', author: 'admin', daysAgo: 60 },
    ],
  },
  { section: 'control', slug: 'foh-and-noise', title: 'FOH, noise limit and curfew', inAdvance: true, revisions: [{ doc: fohAndNoise, summary: 'FOH, limits and curfew', author: 'admin', daysAgo: 290 }] },
  { section: 'stage', slug: 'input-list-and-patch', title: 'Input list and stage box patch', inAdvance: true, revisions: [{ doc: inputAndPatch, summary: 'House input list and patch', author: 'admin', daysAgo: 280 }] },
  { section: 'monitors', slug: 'monitors', title: 'Monitors', inAdvance: true, revisions: [{ doc: monitors, summary: 'Wedges, IEM and mixes', author: 'admin', daysAgo: 280 }] },
  { section: 'power', slug: 'power', title: 'Power', inAdvance: true, revisions: [{ doc: power, summary: 'Audio supply and distro', author: 'admin', daysAgo: 295 }] },
  { section: 'rigging', slug: 'rigging', title: 'Rigging', inAdvance: true, revisions: [{ doc: rigging, summary: 'Beam and truss points', author: 'admin', daysAgo: 295 }] },
  { section: 'logistics', slug: 'load-in-and-access', title: 'Load-in and access', inAdvance: true, revisions: [{ doc: loadIn, summary: 'Door, steps, parking and times', author: 'admin', daysAgo: 270 }] },
  { section: 'logistics', slug: 'house-checklist', title: 'Opening and closing checklist', inAdvance: false, revisions: [{ doc: houseChecklist, summary: 'House tech checklist', author: 'admin', daysAgo: 250 }] },
  { section: 'contacts', slug: 'contacts', title: 'Contacts', inAdvance: true, revisions: [{ doc: contacts, summary: 'Venue contacts', author: 'admin', daysAgo: 120 }] },
];

export const nettlebox: SeedVenue = {
  slug: 'the-nettlebox',
  name: 'The Nettlebox',
  town: 'Tansy Ferry',
  sections: standardSections,
  pages,
};
