/**
 * Haverkin Hall (venue 1): the PA system section. Pages with history are built by
 * functions taking the rig state, so each revision differs only where the rig changed.
 *
 * Rig timeline (days ago): 420 commissioned, broadside subs, preset HOUSE 2.0;
 * 150 subs re-arranged to cardioid stacks, HOUSE 3.0; 90 balcony delays re-hung 1 m lower,
 * HOUSE 3.1; 30–21 amp B2 channel 3 fault, B2 swapped for the spare.
 */
import { b, code, doc, h, hr, i, note, ol, p, table, ul } from './doc-builder';
import { dateDaysAgo } from './sections';
import { delaysBlock, mainsEqBlock, subEqBlock, subMainCrossoverBlock } from './haverkin-hall-blocks';
import type { PmNode, SeedPage } from './types';

type Subs = 'broadside' | 'cardioid';

interface RigState {
  subs: Subs;
  delaysRehung: boolean;
}

const INITIAL: RigState = { subs: 'broadside', delaysRehung: false };
const CARDIOID: RigState = { subs: 'cardioid', delaysRehung: false };
const CURRENT: RigState = { subs: 'cardioid', delaysRehung: true };

/** Balcony delay numbers before and after the re-hang (path from the array's upper boxes). */
function balconyDelay(rehung: boolean) {
  return rehung
    ? { height: '2.4 m', path: '17.2 m', geometric: '50.1 ms', set: '52.0 ms' }
    : { height: '3.4 m', path: '16.9 m', geometric: '49.3 ms', set: '51.3 ms' };
}

function subsOverview(subs: Subs): PmNode[] {
  if (subs === 'broadside') {
    return [
      p(
        '12 × Corvane Kestrel KS218 (2 × 18 in, 8 Ω) in one straight line on the floor in front of the stage lip, all facing the audience, driven in six pairs (S1 stage left outer to S6 stage right outer).',
      ),
      ul(
        'Electronic arc: outer pairs 7.4 ms, middle pairs 8.2 ms, centre pair 9.0 ms (includes sub-to-main alignment).',
        'Known issues: strong power alley down the centre aisle and a lot of low end on stage; monitor engineers regularly ask for less.',
      ),
    ];
  }
  return [
    p(
      '12 × Corvane Kestrel KS218 (2 × 18 in, 8 Ω) as four cardioid stacks of three on the floor in front of the stage lip, centred 2.6 m and 6.4 m either side of the centre line.',
    ),
    ul(
      'In each stack the top and bottom boxes face the audience; the middle box faces the stage.',
      'Rear-facing box: polarity inverted, 2.9 ms later than the front pair, −1 dB. Set by measurement; do not change.',
      'Measured at the drum riser: 14–18 dB less low end between 40 and 100 Hz than the old broadside line.',
      'No arc delay between stacks. Do not stand drinks or cases on the stacks; the rear box needs clear air behind it.',
    ),
  ];
}

function paOverview(state: RigState): PmNode {
  const bd = balconyDelay(state.delaysRehung);
  return doc(
    h(2, 'Summary'),
    p(
      'Left/right flown line arrays, ground subs, front fills, under-balcony fills and balcony delays. All loudspeakers from Corvane Acoustics, all amplifiers Halvard HX4-10, one Trellin SP-816 system processor at 96 kHz. The house system is tuned for the room and is ',
      b('not'),
      ' re-tuned per show; the house engineer will walk you through it at line check.',
    ),
    table(
      ['Zone', 'Boxes', 'Where', 'Amp feed'],
      ['Main L / R', '10 × Kestrel K12 per side', 'Flown either side of the proscenium, 7.5 m off centre', 'Racks A (L) and B (R)'],
      ['Subs', '12 × Kestrel KS218', state.subs === 'cardioid' ? 'Four cardioid stacks of three, floor, in front of stage' : 'Broadside line of 12, floor, in front of stage', 'Racks A and B'],
      ['Front fills', '6 × Wren W5', 'On the stage lip, about 1.8 m apart', 'Racks A and B'],
      ['Under-balcony', '4 × Wren W5', 'Balcony soffit, 14 m from the stage lip', 'Rack C'],
      ['Balcony delays', '4 × Wren W8', `Lighting bar over balcony row 3, ${bd.height} above the balcony floor`, 'Rack C'],
    ),
    h(2, 'Main arrays'),
    ul(
      'Kestrel K12: 2 × 12 in LF, 3 in HF compression driver on a wave-guide, 16 Ω passive, 48 kg each. Driven in pairs (8 Ω per amp channel).',
      'Trim: top of the flying frame 9.0 m above the dance floor; bottom of box 10 about 4.9 m. Frame site angle −1.5°.',
      'Inter-box splay, top to bottom: 0°, 1°, 1°, 2°, 3°, 4°, 5°, 7°, 9° (32° total).',
      'Boxes 1–3 cover the upper balcony, 4–6 the balcony front and rear floor, 7–10 the middle and front of the floor.',
      'Array zone shading is in the amp DSP: +2 dB shelf above 8 kHz on boxes 1–4, −1.5 dB on boxes 9–10.',
    ),
    h(2, 'Subs'),
    ...subsOverview(state.subs),
    h(2, 'Fills and delays'),
    p(
      'Six front fills cover the first four metres of the floor. Under-balcony fills and balcony delays are time-aligned to the main arrays. Distances, times and aiming are on the ',
      i('Fills and delays'),
      ' page.',
    ),
    h(2, 'Coverage checks'),
    ul(
      'Floor: within ±3 dB from row 2 to the back wall, 1–8 kHz.',
      'Balcony: within ±3 dB with the delays on; about 6 dB down above 4 kHz in the last two rows with them muted.',
      'Bar under the balcony (stage right): the under-balcony fill on that side covers it; if the bar staff complain, tell the house engineer rather than muting it.',
    ),
    note('Do not move, re-angle or re-trim the house arrays. Array changes are a rigging job and need the house rigger on site.'),
  );
}

function fillsAndDelays(rehung: boolean): PmNode {
  const bd = balconyDelay(rehung);
  return doc(
    h(2, 'Front fills'),
    p('6 × Wren W5 (5 in coaxial, 16 Ω) on low wedge brackets on the stage lip, numbered 1 (stage left) to 6 (stage right).'),
    table(
      ['Pair', 'Boxes', 'Processor output', 'Delay', 'Aim'],
      ['FF-A', '1 + 2', '7 (outer)', '9.5 ms', 'Straight out, 10° down'],
      ['FF-B', '3 + 4', '8 (centre)', '13.5 ms', 'Toed in 5°, 10° down'],
      ['FF-C', '5 + 6', '7 (outer)', '9.5 ms', 'Straight out, 10° down'],
    ),
    p('Fills are aligned to the main arrays along a line 4 m from the stage lip. They carry a mono sum of L/R; vocals only is possible on request (console matrix).'),
    h(2, 'Under-balcony fills'),
    ul(
      '4 × Wren W5 fixed to the balcony soffit, 14 m from the stage lip, aimed at the last 8 m of the floor.',
      'Measured path from the main array: 15.3 m → 44.6 ms at 343 m/s. Set to 46.0 ms so the main array arrives first.',
      'High-pass 100 Hz LR24, about 6 dB below the mains at the back wall. You should only notice them when they are muted.',
    ),
    h(2, 'Balcony delays'),
    ul(
      `4 × Wren W8 (8 in coaxial, 16 Ω) on drop brackets from the lighting bar over balcony row 3, ${bd.height} above the balcony floor, aimed at rows 4–7.`,
      `Measured path from the main array's upper boxes: ${bd.path} → ${bd.geometric}. Set to ${bd.set} (about 2 ms of precedence).`,
      'High-pass 100 Hz LR24, shelf −2 dB above 10 kHz.',
    ),
    ...(rehung
      ? [
          p(
            b('Re-hung 1 m lower'),
            ' on longer drop brackets. At the old height the delays fired over the heads of rows 5–7 and bounced off the ceiling; they now sit just above the sight-line from row 7 to the stage. Delay times re-measured after the change.',
          ),
        ]
      : []),
    h(2, 'Checking alignment'),
    ol(
      'Measurement mic at the listening position (4 m line for fills, balcony row 5 for delays).',
      'Mute everything but the main array on that side and capture the impulse response.',
      'Add the fill or delay, check its arrival is 1–3 ms after the main array.',
      'Listen with speech as well as the analyser.',
    ),
    note('Balcony delays are hung over seated audience. Only the house rigger touches the drop brackets or safety wires.'),
  );
}

function systemProcessing(state: RigState): PmNode {
  const bd = balconyDelay(state.delaysRehung);
  const preset = state.delaysRehung ? 'HOUSE 3.1' : state.subs === 'cardioid' ? 'HOUSE 3.0' : 'HOUSE 2.0';
  const subRows =
    state.subs === 'cardioid'
      ? [
          ['3', 'Sub front SL (A2 ch3, A3 ch1)', '7.6 ms', 'Normal', 'Front-facing pairs'],
          ['4', 'Sub rear SL (A2 ch4, A3 ch3)', '10.5 ms', 'Inverted', 'Rear boxes, −1 dB'],
          ['5', 'Sub front SR (B2 ch3, B3 ch1)', '7.6 ms', 'Normal', 'Front-facing pairs'],
          ['6', 'Sub rear SR (B2 ch4, B3 ch3)', '10.5 ms', 'Inverted', 'Rear boxes, −1 dB'],
        ]
      : [
          ['3', 'Subs S1 + S6 (outer)', '7.4 ms', 'Normal', 'Arc'],
          ['4', 'Subs S2 + S5', '8.2 ms', 'Normal', 'Arc'],
          ['5', 'Subs S3 + S4 (centre)', '9.0 ms', 'Normal', 'Arc'],
          ['6', 'Spare', '', '', ''],
        ];
  const tune = { cardioid: state.subs === 'cardioid', delaysRehung: state.delaysRehung };
  return doc(
    h(2, 'Processor'),
    ul(
      'Trellin SP-816 (8 in, 16 out) in amp rack A. Sample rate 96 kHz, latency 1.1 ms input to output.',
      ['Current preset: ', code(preset), '. Presets are locked; the house engineer has the password.'],
      'Output limiters are set from the maker\'s data sheets for each box. Never raise them.',
    ),
    h(2, 'Inputs'),
    table(
      ['Input', 'Source', 'Notes'],
      ['1–2', 'Main L/R, AES67 from FOH', 'Primary'],
      ['3', 'Sub, AES67 from FOH', 'Only used for aux-fed subs; default is L+R sum'],
      ['4', 'Fills, AES67 from FOH', 'Only for a separate fill mix; default is L+R sum'],
      ['5–6', 'Main L/R, AES3 from the FOH patch', 'Automatic fallback if the network stream drops'],
      ['7–8', 'Main L/R, analogue from the FOH patch', 'Last resort, manual switch'],
    ),
    h(2, 'Outputs'),
    table(
      ['Out', 'Feeds', 'Delay', 'Polarity', 'Notes'],
      ['1', 'Main L (rack A)', '0 ms', 'Normal', 'Time reference'],
      ['2', 'Main R (rack B)', '0 ms', 'Normal', 'Time reference'],
      ...subRows,
      ['7', 'Front fills FF-A, FF-C', '9.5 ms', 'Normal', 'HP 120 Hz'],
      ['8', 'Front fills FF-B', '13.5 ms', 'Normal', 'HP 120 Hz'],
      ['9–10', 'Under-balcony L/R (rack C)', '46.0 ms', 'Normal', 'HP 100 Hz'],
      ['11–12', 'Balcony delays L/R (rack C)', bd.set, 'Normal', 'HP 100 Hz'],
    ),
    h(2, 'Crossover and EQ'),
    subMainCrossoverBlock(tune),
    h(3, 'Mains'),
    mainsEqBlock(tune),
    h(3, 'Subs'),
    subEqBlock(tune),
    p(state.subs === 'cardioid' ? 'Sub level +1.5 dB against HOUSE 2.0: the rear boxes take some forward output away.' : 'Sub-to-main alignment done at FOH, phase matched at 90 Hz.'),
    h(3, 'Fills and delays'),
    delaysBlock(tune),
    h(3, 'Target'),
    p('About 8 dB rise from 1 kHz down to 60 Hz, flat to 6 kHz, gently down to −4 dB at 16 kHz, measured at FOH and balcony row 5 and averaged over eight positions.'),
    ...(state.subs === 'cardioid'
      ? [
          h(2, 'Retune notes (HOUSE 3.0)'),
          ul(
            'Sub-to-main delay re-measured at FOH: 7.6 ms (geometric 7.9 ms; final value by phase match at 90 Hz).',
            'Rear-box delay and level set with the mic 1 m behind the stacks, on the stage lip.',
            'The low-mid cut on the mains was mostly undone: with less low end on stage, the room is cleaner at FOH.',
          ),
        ]
      : []),
    ...(state.delaysRehung
      ? [h(2, 'HOUSE 3.1'), p(`Balcony delays moved from 51.3 ms to ${bd.set} after the re-hang. Nothing else changed.`)]
      : []),
    hr(),
    p(i('Visiting system techs: you get a read-only view of the processor on the FOH laptop. Ask for changes; do not load your own presets.')),
  );
}

type AmpRow = [string, string, string, string, string];

function ampRacks(subs: Subs, b2Swapped: boolean): PmNode {
  const mainRows = (side: 'L' | 'R', rack: 'A' | 'B'): AmpRow[] => [
    [`${rack}1`, '1', `Main ${side} boxes 1–2`, '8 Ω', 'Zone EQ: +2 dB shelf above 8 kHz'],
    [`${rack}1`, '2', `Main ${side} boxes 3–4`, '8 Ω', 'Zone EQ: +2 dB shelf above 8 kHz'],
    [`${rack}1`, '3', `Main ${side} boxes 5–6`, '8 Ω', ''],
    [`${rack}1`, '4', `Main ${side} boxes 7–8`, '8 Ω', ''],
    [`${rack}2`, '1', `Main ${side} boxes 9–10`, '8 Ω', 'Zone level −1.5 dB'],
  ];
  const rackA: AmpRow[] =
    subs === 'cardioid'
      ? [
          ['A2', '2', 'Front fill FF-A (1 + 2)', '8 Ω', ''],
          ['A2', '3', 'Sub SL inner, front pair', '4 Ω', ''],
          ['A2', '4', 'Sub SL inner, rear box', '8 Ω', ''],
          ['A3', '1', 'Sub SL outer, front pair', '4 Ω', ''],
          ['A3', '2', 'Front fill FF-B (3 + 4)', '8 Ω', ''],
          ['A3', '3', 'Sub SL outer, rear box', '8 Ω', ''],
          ['A3', '4', 'Spare', '', ''],
        ]
      : [
          ['A2', '2', 'Front fill FF-A (1 + 2)', '8 Ω', ''],
          ['A2', '3', 'Subs S1', '4 Ω', ''],
          ['A2', '4', 'Subs S2', '4 Ω', ''],
          ['A3', '1', 'Subs S3', '4 Ω', ''],
          ['A3', '2', 'Front fill FF-B (3 + 4)', '8 Ω', ''],
          ['A3', '3', 'Spare', '', ''],
          ['A3', '4', 'Spare', '', ''],
        ];
  const rackB: AmpRow[] =
    subs === 'cardioid'
      ? [
          ['B2', '2', 'Front fill FF-C (5 + 6)', '8 Ω', ''],
          ['B2', '3', 'Sub SR inner, front pair', '4 Ω', b2Swapped ? 'Amp replaced after a fault on this channel; see the log' : ''],
          ['B2', '4', 'Sub SR inner, rear box', '8 Ω', ''],
          ['B3', '1', 'Sub SR outer, front pair', '4 Ω', ''],
          ['B3', '2', 'Spare', '', ''],
          ['B3', '3', 'Sub SR outer, rear box', '8 Ω', ''],
          ['B3', '4', 'Spare', '', ''],
        ]
      : [
          ['B2', '2', 'Front fill FF-C (5 + 6)', '8 Ω', ''],
          ['B2', '3', 'Subs S6', '4 Ω', ''],
          ['B2', '4', 'Subs S5', '4 Ω', ''],
          ['B3', '1', 'Subs S4', '4 Ω', ''],
          ['B3', '2', 'Spare', '', ''],
          ['B3', '3', 'Spare', '', ''],
          ['B3', '4', 'Spare', '', ''],
        ];
  return doc(
    h(2, 'Overview'),
    p(
      'All system amps are Halvard HX4-10 (4 × 2500 W into 4 Ω, on-board DSP). Each takes its feed as an AES67 stream from the processor, with an AES3 backup per rack. Amp monitoring runs on the separate amp control network (laptop in rack A drawer).',
    ),
    table(
      ['Rack', 'Location', 'Amps', 'Power'],
      ['A', 'Stage left wing, floor level', 'A1–A3 + processor', '32 A single-phase, audio L2'],
      ['B', 'Stage right wing, floor level', b2Swapped ? 'B1–B3 (B2 is the former spare)' : 'B1–B3 + B4 spare (powered off)', '32 A single-phase, audio L3'],
      ['C', 'Control room behind the balcony', 'C1', '16 A, audio L2'],
      ['M', 'Stage left wing, next to monitor world', 'M1–M4 (see Monitors)', '32 A single-phase, audio L3'],
    ),
    h(2, 'Rack A (stage left)'),
    table(['Amp', 'Ch', 'Feeds', 'Load', 'Notes'], ...mainRows('L', 'A'), ...rackA),
    h(2, 'Rack B (stage right)'),
    table(['Amp', 'Ch', 'Feeds', 'Load', 'Notes'], ...mainRows('R', 'B'), ...rackB),
    h(2, 'Rack C (balcony)'),
    table(
      ['Amp', 'Ch', 'Feeds', 'Load', 'Notes'],
      ['C1', '1', 'Under-balcony L (2 × W5)', '8 Ω', ''],
      ['C1', '2', 'Under-balcony R (2 × W5)', '8 Ω', ''],
      ['C1', '3', 'Balcony delays L (2 × W8)', '8 Ω', ''],
      ['C1', '4', 'Balcony delays R (2 × W8)', '8 Ω', ''],
    ),
    ...(b2Swapped
      ? [
          h(2, 'Spare amp'),
          p(
            'There is no spare in rack B at the moment. The old B2 went away for repair after its channel 3 fault (see the maintenance log); it comes back as the new spare. Until then, move a faulty channel\'s load to a spare channel (A3 ch4, B3 ch2 or ch4) and copy the DSP preset for that box.',
          ),
        ]
      : [
          h(2, 'Spare amp'),
          p('B4 is a spare HX4-10 with the house presets loaded, powered off. To use it: power up, swap the speaker cable on the rack panel, recall the preset for that channel.'),
        ]),
    h(2, 'Routine'),
    ul(
      'Racks powered up in the order processor → A → B → C → M, and down in reverse.',
      'Check the amp monitoring screen for protect or temperature warnings after line check.',
      'Rack fans: filters cleaned monthly, logged in the maintenance log.',
    ),
    note('Speaker outputs carry high voltage at show level. Power the amp down before you touch a speaker connector.'),
  );
}

interface LogEntry {
  daysAgo: number;
  text: string;
}

const LOG: LogEntry[] = [
  { daysAgo: 420, text: 'System commissioned. Preset HOUSE 2.0 (broadside subs). Measurements archived on the tech office share.' },
  { daysAgo: 300, text: 'Main L box 7 HF diaphragm replaced (audible distortion at show level). One spare diaphragm left; reordered.' },
  { daysAgo: 240, text: 'Annual inspection of arrays, frames, shackles and hoists by the rigging contractor: passed. Certificate in the rigging file.' },
  { daysAgo: 180, text: 'Three visiting monitor engineers in a month asked for less sub on stage. Power alley at FOH confirmed by measurement. Cardioid stacks planned.' },
  { daysAgo: 150, text: 'Subs re-arranged to four cardioid stacks of three. Amp patch changed. Retuned, preset HOUSE 3.0.' },
  { daysAgo: 120, text: 'Balcony rows 5–7 say the delays sound "in the ceiling". Measured a strong ceiling reflection about 6 ms after the direct sound.' },
  { daysAgo: 90, text: 'Balcony delays re-hung 1 m lower on longer drop brackets. Times re-measured, preset HOUSE 3.1.' },
  { daysAgo: 60, text: 'Primary fibre between FOH and rack A: cleaned both ends after packet errors. Zero errors since.' },
  { daysAgo: 30, text: 'Amp B2 channel 3 (sub SR inner, front pair) went into protect twice during a show. Load moved to B3 ch2 for the rest of the run.' },
  { daysAgo: 21, text: 'B2 replaced with the spare (B4). Faulty unit sent for repair. Original patch restored, presets checked.' },
  { daysAgo: 7, text: 'Portable appliance tests on all stage cables and DIs: 2 mains leads failed and were destroyed.' },
];

function maintenanceLog(asOfDaysAgo: number): PmNode {
  const entries = LOG.filter((e) => e.daysAgo >= asOfDaysAgo).reverse();
  return doc(
    p('House team only. Newest first. One line per job; put the detail in the ticket.'),
    table(['Date', 'Entry'], ...entries.map((e) => [dateDaysAgo(e.daysAgo), e.text])),
    h(2, 'Open items'),
    ul(
      ...(asOfDaysAgo <= 21 ? ['Repaired HX4-10 due back from service: becomes the rack B spare.'] : []),
      'Order a second spare K12 HF diaphragm.',
      'Quote for a second SP-816 as a hot spare.',
    ),
  );
}

export const haverkinPaPages: SeedPage[] = [
  {
    section: 'pa-system',
    slug: 'pa-overview',
    title: 'PA overview',
    inAdvance: true,
    revisions: [
      { doc: paOverview(INITIAL), summary: 'First version of the PA overview', author: 'engineer', daysAgo: 420 },
      { doc: paOverview(CARDIOID), summary: 'Subs moved from a broadside line to four cardioid stacks', author: 'engineer', daysAgo: 150 },
      { doc: paOverview(CURRENT), summary: 'Balcony delay height updated after re-hang', author: 'engineer', daysAgo: 90 },
    ],
  },
  {
    section: 'pa-system',
    slug: 'fills-and-delays',
    title: 'Fills and delays',
    inAdvance: true,
    revisions: [
      { doc: fillsAndDelays(false), summary: 'Fill and delay distances and times', author: 'engineer', daysAgo: 420 },
      { doc: fillsAndDelays(true), summary: 'Re-hung balcony delays 1 m lower; times re-measured', author: 'engineer', daysAgo: 90 },
    ],
  },
  {
    section: 'pa-system',
    slug: 'system-processing',
    title: 'System processing and tuning',
    inAdvance: true,
    revisions: [
      { doc: systemProcessing(INITIAL), summary: 'Processor settings for preset HOUSE 2.0', author: 'engineer', daysAgo: 420 },
      { doc: systemProcessing(CARDIOID), summary: 'Retuned after sub re-arrangement to cardioid (HOUSE 3.0)', author: 'engineer', daysAgo: 150 },
      { doc: systemProcessing(CURRENT), summary: 'Balcony delay times after re-hang (HOUSE 3.1)', author: 'engineer', daysAgo: 90 },
    ],
  },
  {
    section: 'pa-system',
    slug: 'amp-racks',
    title: 'Amp rack detail',
    inAdvance: false,
    revisions: [
      { doc: ampRacks('broadside', false), summary: 'Amp rack patch as commissioned', author: 'engineer', daysAgo: 420 },
      { doc: ampRacks('cardioid', false), summary: 'Sub amp patch for the cardioid stacks', author: 'engineer', daysAgo: 150 },
      { doc: ampRacks('cardioid', true), summary: 'Swapped amp rack B unit B2 after channel 3 fault', author: 'manager', daysAgo: 21 },
    ],
  },
  {
    section: 'pa-system',
    slug: 'house-maintenance-log',
    title: 'House maintenance log',
    inAdvance: false,
    revisions: [
      { doc: maintenanceLog(150), summary: 'Log started; cardioid sub work', author: 'engineer', daysAgo: 150 },
      { doc: maintenanceLog(21), summary: 'Delay re-hang, fibre clean, amp B2 fault and swap', author: 'engineer', daysAgo: 21 },
      { doc: maintenanceLog(7), summary: 'Cable tests', author: 'engineer', daysAgo: 7 },
    ],
  },
];
