/**
 * Haverkin Hall (venue 1): power, rigging, logistics and contacts.
 */
import { b, doc, h, i, link, note, ol, p, table, ul } from './doc-builder';
import type { PmNode, SeedPage } from './types';

const power = doc(
  h(2, 'Audio supply'),
  ul(
    'Dedicated 63 A three-phase supply (400 V between phases, 230 V to neutral, 50 Hz) on its own sub-main from the main switchboard. Not shared with lighting, catering or building services.',
    'Audio distro A: lockable cabinet in the stage left wing, behind amp rack A. The key is with the house engineer and the duty electrician.',
    'Typical show draw with the house rig: 18–26 A per phase. The outgoing ways add up to more than 63 A; that is normal diversity, not spare capacity.',
  ),
  h(2, 'Distro A outgoing ways'),
  table(
    ['Way', 'Phase', 'Rating', 'Feeds'],
    ['1', 'L1', '32 A single-phase', 'FOH sub-distro (floor duct)'],
    ['2', 'L1', '16 A', 'Stage sockets, stage left (4 outlets)'],
    ['3', 'L1', '16 A', 'Stage sockets, stage right (4 outlets)'],
    ['4', 'L1', '16 A', 'Monitor world, stage boxes, RF rack'],
    ['5', 'L2', '32 A single-phase', 'Amp rack A and processor'],
    ['6', 'L2', '16 A', 'Amp rack C (balcony control room)'],
    ['7', 'L3', '32 A single-phase', 'Amp rack B'],
    ['8', 'L3', '32 A single-phase', 'Amp rack M'],
    ['9', 'L1–L3', '32 A three-phase', 'Touring audio outlet (house racks A, B and M off when used)'],
  ),
  h(2, 'Backline and FOH'),
  ul(
    'Everything you plug in on stage and at FOH is on L1, so backline, consoles and stage boxes share one phase and one earth.',
    'Stage sockets for audio are labelled AUDIO and are grey. Sockets labelled GENERAL are on the building supply: kettles and phone chargers only.',
    'Supply is 230 V. For 110–120 V backline the house has two 3 kVA step-down transformers; ask in advance.',
    'Never lift a mains earth to cure hum. Use the ground-lift on a DI or find the loop; the house engineer will help.',
  ),
  h(2, 'Lighting power'),
  p('Lighting has its own 125 A three-phase supply in the stage right wing, from a different board. Do not take audio power from lighting distribution or the other way round.'),
  note(
    'Only a qualified electrician connects, disconnects or alters distribution, including touring distros on way 9. Local electrical codes and the venue\'s installation certificate decide what is allowed; this page is a summary, not a design. The duty electrician is on the Contacts page.',
  ),
);

function rigging(bracketsReplaced: boolean): PmNode {
  return doc(
    p(
      'The roof over the stage and hall is steel trusses with fixed rigging points. The structural engineer\'s load schedule, document ',
      b('HH-STR-07'),
      ', governs everything on this page; if they disagree, the document wins.',
    ),
    h(2, 'Points'),
    table(
      ['Point', 'Location', 'WLL per point', 'Current use', 'Notes'],
      ['P1, P2', 'Proscenium beam, stage left', '1000 kg', 'Main L array', 'Front / rear pickup'],
      ['P3, P4', 'Proscenium beam, stage right', '1000 kg', 'Main R array', 'Front / rear pickup'],
      ['M1–M4', 'Mid-stage truss, 4 m upstage', '750 kg', 'Free for touring', 'Beam clamps only, no wrapping'],
      ['U1–U6', 'Upstage truss line', '500 kg', 'House lighting trusses', 'Two free at the ends'],
      ['D1–D4', 'Lighting bar over balcony row 3', '50 kg', 'Balcony delays', bracketsReplaced ? 'Drop brackets 1.4 m long' : 'Drop brackets 0.4 m long'],
      ['B1–B4', 'Balcony soffit fixings', '25 kg', 'Under-balcony fills', 'Fixed, not for other use'],
    ),
    p(b('Combined limit over the stage: 6000 kg'), ' for all points together, house lighting and PA included. House load today is about 2400 kg.'),
    h(2, 'House arrays'),
    ul(
      'Each side: 10 × K12 (480 kg), flying frame (38 kg) and two 1 t hoists (32 kg each): about 582 kg.',
      'At −1.5° site angle the maker\'s prediction gives roughly 250 kg front and 330 kg rear.',
      'Hoists: 4 × Hadderley BH-1000 1 t chain hoists, to a standard that allows lifting over people; 4-way controller in the stage left wing.',
    ),
    ...(bracketsReplaced
      ? [
          p(
            'Balcony delay brackets were replaced with 1.4 m drops to lower the delays by 1 m. Each bracket has its own safety wire to the bar. Inspected and signed off at the time; certificate in the rigging file.',
          ),
        ]
      : []),
    h(2, 'Rules'),
    ul(
      'Send a rigging plot with weights per point at least 14 days before the show.',
      'No rigging from the balcony front, the handrails or the house lighting bars.',
      'Ground support on the dance floor needs a floor-load check (floor rated 5 kN/m²).',
      'Annual inspection of all points, hoists and house rigging hardware; pre-use checks every show day.',
    ),
    note(
      'The figures here are a summary for planning. Only a competent rigger decides how a load is hung, and the venue\'s structural documents govern. The house rigger must see and approve every touring point before anything leaves the floor.',
    ),
  );
}

const loadIn = doc(
  h(2, 'Address and approach'),
  ul(
    'Venue: The Haverkin Hall, 14 Pellory Street, Saltmarrow.',
    [b('Vehicles: '), 'rear dock on Ropewalk Lane, off the north end of Pellory Street. Do not use the front; it is a pedestrian zone after 10:00.'],
    'Ropewalk Lane is one-way and narrow: trucks reverse in from the Tanner\'s Row end with a banksman.',
  ),
  h(2, 'Dock and doors'),
  ul(
    'One truck up to 12 m trailer on the dock, dock height 1.1 m, with a leveller.',
    'Dock door 2.6 m wide × 3.1 m high. Corridor to stage right: 18 m, level, 2.4 m wide, no steps. The stage is at dock level.',
    'Stage to floor (for FOH cases): ramp at house right, 1:12, 1.2 m wide; or the stage-front steps.',
    'Goods lift from dock level to the dressing rooms (first floor) and the balcony: car 1.4 × 2.2 m, door 1.1 m wide, 1000 kg.',
    'Balcony control room (rack C) is up six steps from the balcony; no lift access.',
  ),
  h(2, 'Parking'),
  ul(
    'Second truck and tour buses: Pellory Street bus bay with a permit from the venue. Book 7 days ahead; shore power is not available.',
    'Cars: public car park on Tanner\'s Row, 300 m. Four validated passes per show at the stage door.',
  ),
  h(2, 'Typical day'),
  table(
    ['Time', 'What'],
    ['10:00', 'House crew in, rig checks'],
    ['12:00', 'Load-in'],
    ['15:00', 'Line check'],
    ['16:00', 'Headline soundcheck'],
    ['17:30', 'Support soundcheck'],
    ['19:00', 'Doors'],
    ['23:00', 'Curfew, music off'],
    ['01:00', 'Load-out finished'],
  ),
  p(i('Earlier access is possible on request, with a charge for house crew before 10:00.')),
);

const crewFacilities = doc(
  h(2, 'Rooms'),
  ul(
    'Three dressing rooms on the first floor (lift from the dock), each with a shower and a lockable door.',
    'Production office next to dressing room 1: two desks, printer, a 16 A socket strip.',
    'Crew room off the stage right corridor, with lockers and a washing machine and dryer.',
  ),
  h(2, 'Wi-Fi'),
  ul(
    [b('Crew network: '), '"HH-Crew". The password is on the production office door and changes monthly.'],
    'About 200 Mbit/s down, 50 up, shared. Audience Wi-Fi is separate and slow on show nights.',
    'None of the audio networks have internet. Do not bridge them to the crew network.',
  ),
  h(2, 'Hospitality'),
  ul(
    'Catering room seats 20. Hot meal at 18:00 by default; agree the rider with the production manager a week ahead.',
    'Water refill points in every dressing room and the crew room. No glass on stage or in the wings.',
    'Towels: 12 per show as standard.',
  ),
  h(2, 'Safety'),
  ul(
    'First aid kit and defibrillator at the stage door. Trained first aiders are on the duty rota.',
    'Smoking only in the yard behind the dock, gate closed.',
    'Fire assembly point: the far end of Tanner\'s Row car park.',
  ),
  p('Dietary needs, late arrivals and local tips (food, pharmacy, late shop): ', link('production@haverkinhall.test', 'mailto:production@haverkinhall.test'), '.'),
);

const contacts = doc(
  p('Office hours 10:00–18:00, Monday to Friday. On show days the duty manager is reachable until the building is locked.'),
  table(
    ['Role', 'Name', 'Phone', 'E-mail'],
    ['General manager', 'Ottilie Fennimore', '+00 0170 555 0101', 'ottilie@haverkinhall.test'],
    ['Technical manager', 'Ines Calloway', '+00 0170 555 0102', 'ines@haverkinhall.test'],
    ['Head of sound', 'Dario Fensome', '+00 0170 555 0103', 'sound@haverkinhall.test'],
    ['Production and advancing', 'Priya Lendrum', '+00 0170 555 0104', 'production@haverkinhall.test'],
    ['House rigger', 'Wynn Tallis', '+00 0170 555 0105', 'rigging@haverkinhall.test'],
    ['Duty electrician (on call)', 'Grace Quarrie', '+00 0170 555 0106', 'electrics@haverkinhall.test'],
    ['Duty manager (show nights)', 'Rota', '+00 0170 555 0100', 'duty@haverkinhall.test'],
  ),
  h(2, 'Advancing'),
  ol(
    'Send technical rider, input list, stage plot and rigging plot to production at least 14 days ahead.',
    'Radio frequencies 7 days ahead (see Monitors).',
    'Guest list and parking permits by 12:00 the day before.',
  ),
  p('In an emergency call the local emergency number first, then the duty manager.'),
);

export const haverkinHousePages: SeedPage[] = [
  {
    section: 'power',
    slug: 'power-distribution',
    title: 'Power distribution',
    inAdvance: true,
    revisions: [{ doc: power, summary: 'Audio supply, distro ways and rules', author: 'manager', daysAgo: 415 }],
  },
  {
    section: 'rigging',
    slug: 'rigging-points',
    title: 'Rigging points and loads',
    inAdvance: true,
    revisions: [
      { doc: rigging(false), summary: 'Rigging points and working load limits', author: 'manager', daysAgo: 415 },
      { doc: rigging(true), summary: 'Longer drop brackets for the balcony delays', author: 'manager', daysAgo: 90 },
    ],
  },
  {
    section: 'logistics',
    slug: 'load-in-and-access',
    title: 'Load-in and access',
    inAdvance: true,
    revisions: [{ doc: loadIn, summary: 'Dock, doors, parking and a typical day', author: 'manager', daysAgo: 405 }],
  },
  {
    section: 'logistics',
    slug: 'crew-facilities',
    title: 'Crew facilities, Wi-Fi and hospitality',
    inAdvance: true,
    revisions: [{ doc: crewFacilities, summary: 'Rooms, Wi-Fi, catering', author: 'manager', daysAgo: 200 }],
  },
  {
    section: 'contacts',
    slug: 'venue-contacts',
    title: 'Venue contacts',
    inAdvance: true,
    revisions: [{ doc: contacts, summary: 'Who to call', author: 'manager', daysAgo: 45 }],
  },
];
