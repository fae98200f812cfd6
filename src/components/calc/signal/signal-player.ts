import { noiseSamples, type NoiseColour } from './noise-buffer';

export type SignalKind = NoiseColour | 'sine';

/** Quietest and loudest settings offered, dBFS (AES17: relative to a full-scale sine). */
export const LEVEL_MIN_DBFS = -60;
export const LEVEL_MAX_DBFS = -12;
/** Where every session starts, whatever a link says: a PA can be loud behind this device. */
export const START_LEVEL_DBFS = -30;

/** Gain changes glide over this time constant, so no step ever clicks. */
const GLIDE_SECONDS = 0.03;
/** Long enough that the loop point of the noise is not heard as a pattern. */
const NOISE_SECONDS = 6;

const gainOf = (dbfs: number) => 10 ** (Math.min(LEVEL_MAX_DBFS, Math.max(LEVEL_MIN_DBFS, dbfs)) / 20);

/** Web Audio graph: one source (looping noise buffer or oscillator) → gain → speakers. */
export class SignalPlayer {
  private context: AudioContext | null = null;
  private gain: GainNode | null = null;
  private source: AudioScheduledSourceNode | null = null;
  private buffers = new Map<NoiseColour, AudioBuffer>();

  get playing(): boolean {
    return this.source !== null;
  }

  /** Must be called from a tap: browsers only let a page make sound after a gesture. */
  async start(kind: SignalKind, frequencyHz: number, dbfs: number): Promise<void> {
    this.stop();
    const context = (this.context ??= new AudioContext());
    if (context.state === 'suspended') await context.resume();
    const gain = context.createGain();
    gain.gain.value = 0;
    gain.gain.setTargetAtTime(gainOf(dbfs), context.currentTime, GLIDE_SECONDS);
    gain.connect(context.destination);
    const source = kind === 'sine' ? this.oscillator(context, frequencyHz) : this.noise(context, kind);
    source.connect(gain);
    source.start();
    this.gain = gain;
    this.source = source;
  }

  setLevel(dbfs: number): void {
    if (this.gain && this.context) this.gain.gain.setTargetAtTime(gainOf(dbfs), this.context.currentTime, GLIDE_SECONDS);
  }

  setFrequency(frequencyHz: number): void {
    if (this.source instanceof OscillatorNode && this.context) this.source.frequency.setTargetAtTime(frequencyHz, this.context.currentTime, GLIDE_SECONDS);
  }

  stop(): void {
    this.source?.stop();
    this.source?.disconnect();
    this.gain?.disconnect();
    this.source = null;
    this.gain = null;
  }

  async close(): Promise<void> {
    this.stop();
    await this.context?.close();
    this.context = null;
  }

  private oscillator(context: AudioContext, frequencyHz: number): OscillatorNode {
    const osc = context.createOscillator();
    osc.type = 'sine';
    osc.frequency.value = frequencyHz;
    return osc;
  }

  private noise(context: AudioContext, colour: NoiseColour): AudioBufferSourceNode {
    let buffer = this.buffers.get(colour);
    if (!buffer || buffer.sampleRate !== context.sampleRate) {
      buffer = context.createBuffer(1, Math.round(context.sampleRate * NOISE_SECONDS), context.sampleRate);
      buffer.copyToChannel(noiseSamples(colour, buffer.length), 0);
      this.buffers.set(colour, buffer);
    }
    const node = context.createBufferSource();
    node.buffer = buffer;
    node.loop = true;
    return node;
  }
}
