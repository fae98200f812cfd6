/**
 * Haverkin Hall (venue 1): control and FOH, stage I/O and patch, monitors.
 */
import { b, code, doc, h, i, note, ol, p, table, ul } from './doc-builder';
import type { SeedPage } from './types';

const fohPosition = doc(
  h(2, 'Position'),
  ul(
    'Centre line of the floor, front edge of the riser 12.5 m from the stage lip. The balcony overhang starts 1.5 m behind the riser, so FOH hears the room, not the soffit.',
    'Riser 3.6 m wide × 2.4 m deep × 0.4 m high, with rail and a lockable cable hatch. Lighting control shares the riser on the stage right side.',
    'Space for a guest console up to 2.0 m wide beside the house console. Anything wider: the house console comes off the riser (allow 20 minutes).',
    'Cable route to the stage left wing: floor duct, 40 m. Two fibre pairs and one 24/8 copper multicore already run in it.',
  ),
  h(2, 'House console'),
  ul(
    'Quillon Q-Desk 96: 96 inputs at 96 kHz, 32 mix buses, 12 matrices, two 8-way local I/O cards at FOH.',
    'Owns the preamp gain on the house stage boxes; the monitor console works on digital trim.',
    ['House show file: ', code('HAVERKIN-BASE'), '. It holds the house input list, a sane gain structure and nothing else. Save your own file under your act\'s name.'],
  ),
  h(2, 'FOH patch panel'),
  table(
    ['Connector', 'Signal', 'Goes to'],
    ['Network 1 / 2', 'Audio network primary / secondary (AES67)', 'FOH switch, fibre to stage left'],
    ['AES3 in 1', 'Main L/R', 'Processor inputs 5–6 (fallback)'],
    ['XLR 1–4 in', 'Analogue L, R, Sub, Fills', 'FOH local I/O, then the network'],
    ['XLR 5–6 out', 'Copies of talkback and show relay', 'For a guest recorder or a local cue speaker'],
    ['Optical MADI in/out', '64 channels each way at 48 kHz, 32 at 96 kHz', 'House MADI converter, onto the network'],
  ),
  h(2, 'Guest consoles'),
  ol(
    'Network console: plug into the FOH switch (ports 1–4 on both networks). Static addresses only; see the Audio network page.',
    'Anything else: send L/R as AES3, or use MADI through the house converter, or analogue as the last resort.',
    'Send the system Main L/R, Sub (only if you run aux-fed subs) and Fills. We default subs and fills to the L+R sum.',
  ),
  h(2, 'Power, comms, other'),
  ul(
    'FOH sub-distro: 32 A single-phase from the audio supply (L1, same phase as stage sockets), 6 × 16 A. A 1.5 kVA UPS carries the house console and the FOH switch.',
    'Talkback: 4-channel wired party-line. Belt packs at FOH, monitor world, stage manager desk and follow spots.',
    'Recording: multitrack over the network to your own machine is fine; tell the house engineer so the streams are planned.',
    'Noise meter display on the riser; see Noise limit and curfew.',
  ),
);

const audioNetwork = doc(
  h(2, 'Layout'),
  p(
    'Two physically separate networks carry AES67 audio at 96 kHz / 24-bit: ',
    b('primary (blue cable)'),
    ' and ',
    b('secondary (red cable)'),
    '. A third network (grey cable) carries amp control and monitoring only. No internet and no DHCP on any of them.',
  ),
  table(
    ['Switch', 'Location', 'Links'],
    ['SW-FOH', 'FOH riser, under the console desk', 'Fibre pair to SW-SL (one per network)'],
    ['SW-SL', 'Amp rack A, stage left', 'Stage boxes, monitor console, processor, rack M, copper to SW-SR'],
    ['SW-SR', 'Amp rack B, stage right', 'Rack B amps'],
    ['SW-BAL', 'Control room behind the balcony', 'Rack C; copper from SW-SL via the riser duct'],
  ),
  h(2, 'Clock'),
  ul(
    'PTP: the Trellin SP-816 processor is grandmaster (priority 1 = 100). Every other device is set higher.',
    'Guest devices: set priority 1 to 200 or above. If your console becomes grandmaster, every amp in the building re-locks and the PA drops out for a second.',
    'Stream packet time 1 ms, receiver latency 2 ms.',
  ),
  h(2, 'Addresses'),
  table(
    ['Device', 'Primary', 'Secondary'],
    ['Processor SP-816', '10.20.1.10', '10.20.2.10'],
    ['Stage box SB1 (48/16)', '10.20.1.21', '10.20.2.21'],
    ['Stage box SB2 (16/8)', '10.20.1.22', '10.20.2.22'],
    ['FOH console Q-Desk 96', '10.20.1.31', '10.20.2.31'],
    ['Monitor console Q-Desk 48', '10.20.1.32', '10.20.2.32'],
    ['MADI converter', '10.20.1.40', '10.20.2.40'],
    ['Guest devices', '10.20.1.200–220', '10.20.2.200–220'],
  ),
  p('Amp control network: 10.20.3.0/24, amps at .101 upwards in rack order (A1 = .101). Subnet mask 255.255.255.0 on all three.'),
  h(2, 'Bringing your own stage racks'),
  ul(
    'AES67 from your racks can join the house network after a check at line check; allow 30 minutes.',
    'Or use the 48-way analogue split in the stage left wing: one direct output (house stage boxes) and two transformer-isolated outputs.',
  ),
);

const noiseAndCurfew = doc(
  h(2, 'Limits'),
  table(
    ['Measure', 'Limit', 'Where'],
    ['LAeq, 15 min', '100 dBA', 'FOH riser, house meter'],
    ['LCeq, 15 min', '115 dBC', 'FOH riser, house meter'],
    ['Support acts', '96 dBA LAeq, 15 min', 'House policy, not licence'],
  ),
  ul(
    'The meter mic is on a short pole at the front of the FOH riser, 1.5 m above the floor. Values show on the FOH screen and in the production office and are logged every second.',
    'At 98 dBA on the rolling 15-minute value the house engineer will tell you. Above 100 dBA the licence is at risk, and the duty manager can ask for the level to come down.',
    'The house PA has no level limiter for this. Staying under the number is the mix engineer\'s job.',
  ),
  h(2, 'Curfew'),
  ul(
    [b('23:00'), ' music off, every night, no encores past it.'],
    '23:30 audience out of the building.',
    '01:00 load-out finished. The rear lane is residential: no shouting, no reversing alarms, tail lifts as quietly as you can.',
  ),
  note(
    'Levels near the limit for a whole show can damage hearing. Free earplugs are at both bars and in the crew room. Crew working at the barrier or near the subs wear hearing protection during the show.',
  ),
);

const inputList = doc(
  p(
    'This is the house default list: it is what the base show file and the stage box tails are labelled for. Send your own list in advance and we will patch to it; if it matches this one, line check is quicker.',
  ),
  table(
    ['Ch', 'Source', 'Mic / DI', 'Stand', 'Notes'],
    ['1', 'Kick in', 'Fennick KD-3', 'None (on pillow)', ''],
    ['2', 'Kick out', 'Velloran LD-9', 'Short boom', 'Phantom'],
    ['3', 'Snare top', 'Orbel OD-7', 'Short boom', ''],
    ['4', 'Snare bottom', 'Orbel OD-7', 'Short boom', 'Polarity inverted at console'],
    ['5', 'Hi-hat', 'Orbel OC-4', 'Short boom', 'Phantom'],
    ['6', 'Rack tom', 'Orbel TC-2', 'Clip', ''],
    ['7', 'Floor tom 1', 'Orbel TC-2', 'Clip', ''],
    ['8', 'Floor tom 2', 'Orbel TC-2', 'Clip', ''],
    ['9', 'Ride', 'Orbel OC-4', 'Short boom', 'Phantom'],
    ['10', 'Overhead L', 'Orbel OC-4', 'Tall boom', 'Phantom'],
    ['11', 'Overhead R', 'Orbel OC-4', 'Tall boom', 'Phantom'],
    ['12', 'Bass DI', 'Sallow DP-1 (passive)', '', 'Pre-amp DI out if the amp has one'],
    ['13', 'Bass mic', 'Fennick KD-3', 'Short boom', ''],
    ['14', 'Guitar 1', 'Velloran R-2 (ribbon)', 'Short boom', 'No phantom on this channel'],
    ['15', 'Guitar 1 alt', 'Orbel OD-7', 'Short boom', ''],
    ['16', 'Guitar 2', 'Orbel OD-7', 'Short boom', ''],
    ['17', 'Acoustic guitar', 'Sallow DA-2 (active)', '', 'Phantom'],
    ['18', 'Keys L', 'Sallow DA-2S (stereo)', '', 'Phantom'],
    ['19', 'Keys R', 'Sallow DA-2S (stereo)', '', ''],
    ['20', 'Synth L', 'Sallow DA-2S (stereo)', '', 'Phantom'],
    ['21', 'Synth R', 'Sallow DA-2S (stereo)', '', ''],
    ['22', 'Playback L', 'Sallow DA-2S (stereo)', '', 'From the band\'s interface'],
    ['23', 'Playback R', 'Sallow DA-2S (stereo)', '', ''],
    ['24', 'Click', 'Sallow DA-2 (active)', '', 'IEM only, never in the PA'],
    ['25', 'Spare', '', '', ''],
    ['26', 'Vocal SR', 'Orbel OD-9S', 'Tall boom', ''],
    ['27', 'Lead vocal', 'Orbel OD-9S', 'Round base, straight', 'Spare mic on the riser'],
    ['28', 'Vocal SL', 'Orbel OD-9S', 'Tall boom', ''],
    ['29', 'Drum vocal', 'Orbel OD-9S', 'Tall boom', ''],
    ['30', 'Spare vocal', 'Orbel OD-9S', 'Tall boom', 'Side of stage'],
    ['31', 'MC / host', 'Pellan HW-2 radio handheld', '', 'Receiver in the RF rack, stage left'],
    ['32', 'FOH talkback', 'Orbel OD-7 with switch', '', 'FOH local input; to monitors only'],
  ),
);

const stageBoxPatch = doc(
  h(2, 'Stage boxes'),
  ul(
    'SB1: Quillon SB-48 (48 in, 16 out) in the stage left wing. Six labelled tails (sub-snakes) fan out from it.',
    'SB2: Quillon SB-16 (16 in, 8 out) beside SB1, for extra inputs and IEM and show relay outputs.',
    'Both on the audio network, primary and secondary. Gain is owned by FOH.',
  ),
  h(2, 'Inputs'),
  table(
    ['Ports', 'Tail', 'Usual position', 'House channels'],
    ['SB1 1–12', 'A (12-way)', 'Drum riser, stage left corner', 'Ch 1–11, 29'],
    ['SB1 13–24', 'B (12-way)', 'Stage right, by the bass amp', 'Ch 12, 13, 18–21, 26; 5 spare'],
    ['SB1 25–32', 'C (8-way)', 'Downstage centre', 'Ch 27, 30; 6 spare'],
    ['SB1 33–44', 'D (12-way)', 'Stage left, by the guitar amps', 'Ch 14–17, 22–24, 28; 4 spare'],
    ['SB1 45–48', 'RF rack', 'Stage left wing', 'Ch 31; 3 spare'],
    ['SB2 1–16', 'E (16-way)', 'Loose in the wing', 'Guest channels 33–48'],
  ),
  h(2, 'Outputs'),
  table(
    ['Ports', 'Feeds', 'Notes'],
    ['SB1 1–8', 'Wedges 1–8 (rack M)', 'Monitor mixes 1–7'],
    ['SB1 9–10', 'Sidefill L / R (rack M)', 'Monitor mixes 9–10'],
    ['SB1 11', 'Drum fill (rack M)', 'Monitor mix 8'],
    ['SB1 12', 'Spare', ''],
    ['SB1 13–16', 'IEM transmitters 1–2 (L/R)', 'Monitor mixes 11–14'],
    ['SB2 1–4', 'IEM transmitters 3–4 (L/R)', 'Monitor mixes 15–18'],
    ['SB2 5', 'Stage talkback speaker', 'FOH talkback bus'],
    ['SB2 6', 'Show relay to dressing rooms and foyer', 'FOH matrix 12'],
    ['SB2 7–8', 'Spare', ''],
  ),
  note('Phantom power is switched at the console channel. Check with the house engineer before plugging in ribbon mics or anything with an unbalanced output.'),
);

const micStock = doc(
  p('House stock, checked every Monday. Bring anything specialist yourself.'),
  table(
    ['Item', 'Type', 'Qty', 'Notes'],
    ['Orbel OD-7', 'Dynamic, cardioid', '12', 'Snare, guitars, general'],
    ['Orbel OD-9S', 'Dynamic, supercardioid (vocal)', '8', 'Two kept as spares at monitor world'],
    ['Orbel OC-4', 'Small-diaphragm condenser', '6', 'Overheads, hi-hat, ride'],
    ['Orbel TC-2', 'Clip-on dynamic (tom)', '4', ''],
    ['Fennick KD-3', 'Dynamic (kick, bass cab)', '3', ''],
    ['Velloran LD-9', 'Large-diaphragm condenser', '2', ''],
    ['Velloran R-2', 'Ribbon', '2', 'No phantom'],
    ['Pellan HW-2', 'Radio handheld', '2', 'Rechargeable; charger in the RF rack'],
    ['Sallow DA-2', 'Active DI, mono', '6', ''],
    ['Sallow DA-2S', 'Active DI, stereo', '4', ''],
    ['Sallow DP-1', 'Passive DI', '4', ''],
  ),
  h(2, 'Stands and cable'),
  ul(
    'Tall booms: 14. Short booms: 12. Round base straight: 4.',
    'XLR: 60 × 5 m, 30 × 10 m, 10 × 20 m. Mains leads (16 A and domestic type): 30, all tested.',
    'Sub-snakes: the six tails listed on the Stage box patch page, plus two 12-way loose.',
  ),
);

const monitors = doc(
  h(2, 'Monitor world'),
  ul(
    'Stage left wing, 2.5 m × 3 m, sight-line to the whole stage. Moves are possible but it is tight.',
    'Console: Quillon Q-Desk 48 (48 inputs from the network, 24 mixes). Guest monitor consoles join the network at SW-SL or take the analogue split.',
    'Amp rack M is next to it: Halvard HX4-10 × 4.',
  ),
  h(2, 'Loudspeakers'),
  ul(
    '8 × Corvane MW15 wedges (15 in + 3 in coaxial, 8 Ω), one amp channel each (M1, M2).',
    'Sidefills: per side, 2 × Kestrel K12 on one Kestrel KS218, ground-stacked in the wings (M3).',
    'Drum fill: one MW15 on one Kestrel KS118 (M4 ch1–2).',
    'IEM: 4 × Pellan IR-4 stereo transmitters, 8 belt packs, combined to one helical antenna in the wing. House frequency plan: ask for it.',
  ),
  h(2, 'House mixes'),
  table(
    ['Mix', 'Output', 'Position', 'Notes'],
    ['1', 'Wedge 1', 'Downstage left (vocal SL)', ''],
    ['2', 'Wedges 2 + 3', 'Downstage centre (lead vocal)', 'Two outputs, same mix'],
    ['3', 'Wedge 4', 'Downstage right (vocal SR)', ''],
    ['4', 'Wedge 5', 'Guitar, stage left', ''],
    ['5', 'Wedge 6', 'Bass, stage right', ''],
    ['6', 'Wedge 7', 'Keys, stage right upstage', ''],
    ['7', 'Wedge 8', 'Spare or guest', ''],
    ['8', 'Drum fill', 'Drum riser, left of the kit', 'Top and sub from one mix'],
    ['9–10', 'Sidefill L / R', 'Wings', ''],
    ['11–12', 'IEM 1 (stereo)', 'Lead vocal', ''],
    ['13–14', 'IEM 2 (stereo)', 'Drums', 'Click lives here by default'],
    ['15–16', 'IEM 3 (stereo)', 'Keys', ''],
    ['17–18', 'IEM 4 (stereo)', 'Spare', ''],
  ),
  h(2, 'Radio'),
  ul(
    'Send your radio mic and IEM frequencies at least 7 days before the show. We coordinate them with the house plan.',
    'Local licensing rules decide which frequencies you may use; bring your licence paperwork if your kit needs one.',
  ),
  p(i('Since the subs went cardioid the stage is much quieter below 100 Hz; start with less drum-fill sub than you think.')),
  note('IEM levels: start the packs at minimum and bring them up on the performer\'s cue. A feedback squeal or a dropped click at full level in ears can injure.'),
);

export const haverkinStagePages: SeedPage[] = [
  {
    section: 'control',
    slug: 'foh-position',
    title: 'FOH position and console',
    inAdvance: true,
    revisions: [{ doc: fohPosition, summary: 'FOH position, console and patch', author: 'engineer', daysAgo: 400 }],
  },
  {
    section: 'control',
    slug: 'audio-network',
    title: 'Audio network',
    inAdvance: true,
    revisions: [{ doc: audioNetwork, summary: 'Network layout, clock and addresses', author: 'engineer', daysAgo: 380 }],
  },
  {
    section: 'control',
    slug: 'noise-and-curfew',
    title: 'Noise limit and curfew',
    inAdvance: true,
    revisions: [{ doc: noiseAndCurfew, summary: 'Licence limits and curfew', author: 'manager', daysAgo: 410 }],
  },
  {
    section: 'stage',
    slug: 'house-input-list',
    title: 'House input list',
    inAdvance: true,
    revisions: [{ doc: inputList, summary: 'House default input list', author: 'engineer', daysAgo: 395 }],
  },
  {
    section: 'stage',
    slug: 'stage-box-patch',
    title: 'Stage box patch',
    inAdvance: true,
    revisions: [{ doc: stageBoxPatch, summary: 'Stage box tails and outputs', author: 'engineer', daysAgo: 395 }],
  },
  {
    section: 'stage',
    slug: 'mic-and-di-stock',
    title: 'Microphone and DI stock',
    inAdvance: true,
    revisions: [{ doc: micStock, summary: 'House mic, DI, stand and cable stock', author: 'engineer', daysAgo: 60 }],
  },
  {
    section: 'monitors',
    slug: 'monitor-system',
    title: 'Monitor system and mixes',
    inAdvance: true,
    revisions: [{ doc: monitors, summary: 'Monitor world, wedges, IEM and house mixes', author: 'engineer', daysAgo: 140 }],
  },
];
