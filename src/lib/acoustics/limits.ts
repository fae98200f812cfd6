/**
 * The ranges the acoustics functions accept, shared with the routes and the UI so that a
 * form, a zod schema and the math refuse exactly the same inputs.
 *
 * Each range is inclusive unless its comment says otherwise. They are chosen for live sound
 * (air at a gig, audio-band filters, a working console), not for physics at large; where a
 * bound is a physical fact (absolute zero, Nyquist) the function checks that fact itself.
 */
export const LIMITS = {
  /** Air a PA works in. The ideal-gas speed formula holds far beyond this; the bound keeps typos (−300 °C, 2000 °C) out. */
  temperatureCelsius: { min: -60, max: 60 },
  /** Any frequency without a sample rate (notes, weightings, bands). Filters must also stay below sampleRateHz / 2. */
  frequencyHz: { min: 1, max: 100_000 },
  /** 8 kHz telephony up to 384 kHz DXD. */
  sampleRateHz: { min: 8_000, max: 384_000 },
  /** Sound levels in dB (SPL, or any dB quantity being summed). */
  levelDb: { min: -50, max: 200 },
  /** A-weighted levels for the exposure estimates; below 70 dBA neither OSHA nor NIOSH sets a daily limit, above 140 dB any exposure risks immediate harm. */
  exposureLevelDba: { min: 70, max: 140 },
  /** Peaking and shelving gain. */
  gainDb: { min: -40, max: 40 },
  /** Filter Q (cookbook definition). */
  q: { min: 0.1, max: 100 },
  /** Cookbook shelf slope S; 1 is the steepest that stays monotonic, so nothing above it is accepted. */
  shelfSlope: { min: 0.1, max: 1 },
  /** Distances between a loudspeaker and a listener. */
  distanceMeters: { min: 0, max: 2_000 },
  /** Delay times. 10 s covers 2 km at the speed of sound with room to spare. */
  delayMs: { min: 0, max: 10_000 },
  /** Extra delay added on top of time alignment so the main wins localisation (precedence effect). */
  precedenceOffsetMs: { min: 0, max: 50 },
  /** A phase difference at one frequency. */
  phaseDeg: { min: -360, max: 360 },
  /** Concert pitch: baroque 415 Hz to a bright orchestra at 446 Hz, with margin. */
  a4Hz: { min: 400, max: 480 },
  /** Relative humidity of air. */
  relativeHumidityPercent: { min: 0, max: 100 },
  /** A measured phase difference, which may be unwrapped over several cycles. */
  measuredPhaseDeg: { min: -36_000, max: 36_000 },
  /** Latency of a fill's path (wireless link, extra processor) beyond the main's, ms. */
  latencyMs: { min: 0, max: 1_000 },
  /** One loudspeaker's nominal impedance, Ω. */
  loadOhms: { min: 0.5, max: 1_000 },
  /** Most boxes on one amplifier channel or in one array calculation. */
  maxBoxes: 64,
  /** Amplifier power per box, W. */
  powerWatts: { min: 0.001, max: 100_000 },
  /** Loudspeaker sensitivity, dB SPL at 1 m. */
  sensitivityDb: { min: 50, max: 130 },
  /** Signal levels for dBu / dBV / dBFS conversions, dB. */
  signalDb: { min: -200, max: 100 },
  /** Volts for the signal-level conversion. */
  volts: { min: 1e-9, max: 10_000 },
  /** Power for the signal-level conversion, W. */
  watts: { min: 1e-12, max: 100_000 },
  /** A console's full scale, dBu (0 dBFS = this many dBu). */
  fullScaleDbu: { min: -20, max: 40 },
  /** Hours in one exposure segment (a day at most). */
  segmentHours: { min: 0, max: 24 },
  /** Most segments in one dose. */
  maxSegments: 48,
  /** Most readings in one Leq. */
  maxReadings: 2_000,
  /** Most nulls or peaks one comb answer lists. */
  maxCombFrequencies: 500,
  /** Most levels one sum accepts. */
  maxLevels: 64,
  /** Most filters one cascade accepts. */
  maxFilters: 32,
  /** Most frequencies one response accepts. */
  maxResponsePoints: 4096,
  /** Fractional-octave bandwidth designators b (1/b octave) offered. */
  bandFractions: [1, 3, 6, 12, 24],
  /** Crossover slopes offered per family, in dB/octave. */
  crossoverSlopesDbPerOctave: {
    butterworth: [6, 12, 18, 24, 36, 48],
    'linkwitz-riley': [12, 24, 36, 48],
  },
} as const;

export interface NumericRange {
  readonly min: number;
  readonly max: number;
}
