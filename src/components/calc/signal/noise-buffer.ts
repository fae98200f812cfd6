/**
 * Noise for the test-signal player, computed once into a looping buffer.
 *
 * Pink noise: Paul Kellet's "refined" filter (music-dsp mailing list, 1999; collected by R. Whittle,
 * "DSP generation of pink (1/f) noise", firstpr.com.au/dsp/pink-noise): six first-order sections
 * plus a direct term, within about ±0.05 dB of −3 dB/octave above 9.2 Hz at 44.1 kHz.
 */
export type NoiseColour = 'white' | 'pink';

/** Fills `out` with pink noise from uniform white noise. */
export function kelletPink(out: Float32Array, random: () => number = Math.random): void {
  let b0 = 0, b1 = 0, b2 = 0, b3 = 0, b4 = 0, b5 = 0, b6 = 0;
  // One second of warm-up so the slowest section (pole 0.99886) has settled before the loop starts.
  const warmUp = 48_000;
  for (let i = -warmUp; i < out.length; i++) {
    const white = random() * 2 - 1;
    b0 = 0.99886 * b0 + white * 0.0555179;
    b1 = 0.99332 * b1 + white * 0.0750759;
    b2 = 0.969 * b2 + white * 0.153852;
    b3 = 0.8665 * b3 + white * 0.3104856;
    b4 = 0.55 * b4 + white * 0.5329522;
    b5 = -0.7616 * b5 - white * 0.016898;
    const pink = b0 + b1 + b2 + b3 + b4 + b5 + b6 + white * 0.5362;
    b6 = white * 0.115926;
    if (i >= 0) out[i] = pink;
  }
}

/**
 * Scales a buffer so its RMS equals that of a full-scale sine (1/√2), i.e. 0 dBFS in the AES17
 * sense; the player's gain then sets the level in dBFS for noise and sine alike.
 */
export function normaliseToFullScaleSine(samples: Float32Array): void {
  let sum = 0;
  for (const v of samples) sum += v * v;
  const rms = Math.sqrt(sum / samples.length);
  if (rms === 0) return;
  const scale = Math.SQRT1_2 / rms;
  for (let i = 0; i < samples.length; i++) samples[i] *= scale;
}

export function noiseSamples(colour: NoiseColour, length: number): Float32Array<ArrayBuffer> {
  const samples = new Float32Array(length);
  if (colour === 'pink') kelletPink(samples);
  else for (let i = 0; i < length; i++) samples[i] = Math.random() * 2 - 1;
  normaliseToFullScaleSine(samples);
  return samples;
}
