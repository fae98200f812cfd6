/** A processor block's change in words: "Band 3: 250 → 315 Hz, −3.0 → −4.5 dB, Q 1.4 → 2.0"; "Sub delay 4.1 → 5.3 ms". */
import { BAND_TYPE_LABELS, blockTraces, type TraceCompare, type TraceRef, CROSSOVER_BLOCK, DELAY_BLOCK, EQ_BLOCK, hasGain, isShelf, type CrossoverBlockAttrs, type DelayBlockAttrs, type EqBand, type EqBlockAttrs, type XoverEdge } from './block-data';
import { bandSummary, familyLabel, fixed, num, rateLabel } from './block-format';
import { delayResult } from './block-curves';

const arrow = (a: string, b: string) => `${a} → ${b}`;

function bandChange(i: number, a: EqBand, b: EqBand): string | null {
  const parts: string[] = [];
  if (a.type !== b.type) parts.push(arrow(BAND_TYPE_LABELS[a.type], BAND_TYPE_LABELS[b.type]));
  if (a.freq !== b.freq) parts.push(`${arrow(num(a.freq, 1), num(b.freq, 1))} Hz`);
  if ((hasGain(a.type) || hasGain(b.type)) && a.gain !== b.gain) parts.push(`${arrow(fixed(a.gain), fixed(b.gain))} dB`);
  if (a.q !== b.q) parts.push(`${isShelf(b.type) ? 'S' : 'Q'} ${arrow(fixed(a.q), fixed(b.q))}`);
  if (a.on !== b.on) parts.push(b.on ? 'switched on' : 'switched off');
  return parts.length ? `Band ${i + 1}: ${parts.join(', ')}` : null;
}

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

function common<T extends { label: string; note: string; sampleRate: number }>(a: T, b: T, out: string[]) {
  if (a.label !== b.label) out.push(`Description: "${a.label}" → "${b.label}"`);
  if (a.sampleRate !== b.sampleRate) out.push(`Sample rate ${arrow(rateLabel(a.sampleRate), rateLabel(b.sampleRate))}`);
  if (a.note !== b.note) out.push(b.note ? (a.note ? 'Note changed' : 'Note added') : 'Note removed');
}

const traceName = (t: TraceRef) => (t.label ? `"${t.label}"` : 'an unlabelled trace');

/** Traces attached or detached (by label), their notes changed, and the compared pair. */
function traceChanges(a: { traces?: TraceRef[]; compare?: TraceCompare | null }, b: { traces?: TraceRef[]; compare?: TraceCompare | null }, out: string[]) {
  const before = blockTraces(a);
  const after = blockTraces(b);
  for (const t of after) if (!before.some((x) => x.fileId === t.fileId)) out.push(`Trace ${traceName(t)} attached`);
  for (const t of before) if (!after.some((x) => x.fileId === t.fileId)) out.push(`Trace ${traceName(t)} removed`);
  for (const t of after) {
    const x = before.find((y) => y.fileId === t.fileId);
    if (!x) continue;
    if (x.label !== t.label) out.push(`Trace renamed ${traceName(x)} → ${traceName(t)}`);
    else if (!same(x, t)) out.push(`Trace ${traceName(t)} changed`);
  }
  const name = (c: TraceCompare | null | undefined, list: TraceRef[]) => {
    if (!c) return 'none';
    const n = (id: string) => {
      const t = list.find((x) => x.fileId === id);
      return t ? traceName(t) : 'a removed trace';
    };
    return `${n(c.after)} − ${n(c.before)}`;
  };
  if (!same(a.compare ?? null, b.compare ?? null)) out.push(`Comparison ${arrow(name(a.compare, before), name(b.compare, after))}`);
}

function eqChanges(a: EqBlockAttrs, b: EqBlockAttrs): string[] {
  const out: string[] = [];
  common(a, b, out);
  const n = Math.max(a.bands.length, b.bands.length);
  for (let i = 0; i < n; i++) {
    const x = a.bands[i];
    const y = b.bands[i];
    if (x && y) {
      const c = bandChange(i, x, y);
      if (c) out.push(c);
    } else if (y) out.push(`Band ${i + 1} added: ${bandSummary(y)}`);
    else if (x) out.push(`Band ${i + 1} removed: ${bandSummary(x)}`);
  }
  if (a.outputGain !== b.outputGain) out.push(`Output gain ${arrow(fixed(a.outputGain), fixed(b.outputGain))} dB`);
  if (a.polarity !== b.polarity) out.push(`Polarity ${arrow(a.polarity, b.polarity)}`);
  traceChanges(a, b, out);
  return out;
}

const edgeText = (e: XoverEdge | null) => (e ? familyLabel(e) : 'none');

function crossoverChanges(a: CrossoverBlockAttrs, b: CrossoverBlockAttrs): string[] {
  const out: string[] = [];
  common(a, b, out);
  const n = Math.max(a.ways.length, b.ways.length);
  for (let i = 0; i < n; i++) {
    const x = a.ways[i];
    const y = b.ways[i];
    const name = (y ?? x)!.name || `Way ${i + 1}`;
    if (!x) {
      out.push(`${name} way added`);
      continue;
    }
    if (!y) {
      out.push(`${name} way removed`);
      continue;
    }
    if (x.name !== y.name) out.push(`Way ${i + 1} renamed "${x.name}" → "${y.name}"`);
    if (!same(x.highPass, y.highPass)) out.push(`${name} high-pass ${arrow(edgeText(x.highPass), edgeText(y.highPass))}`);
    if (!same(x.lowPass, y.lowPass)) out.push(`${name} low-pass ${arrow(edgeText(x.lowPass), edgeText(y.lowPass))}`);
    if (x.gain !== y.gain) out.push(`${name} gain ${arrow(fixed(x.gain), fixed(y.gain))} dB`);
    if (x.polarity !== y.polarity) out.push(`${name} polarity ${arrow(x.polarity, y.polarity)}`);
    if (x.delayMs !== y.delayMs) out.push(`${name} delay ${arrow(fixed(x.delayMs), fixed(y.delayMs))} ms`);
  }
  traceChanges(a, b, out);
  return out;
}

function delayChanges(a: DelayBlockAttrs, b: DelayBlockAttrs): string[] {
  const out: string[] = [];
  common(a, b, out);
  if (a.temperature !== b.temperature || a.tempUnit !== b.tempUnit) out.push(`Temperature ${arrow(`${num(a.temperature, 1)} °${a.tempUnit}`, `${num(b.temperature, 1)} °${b.tempUnit}`)}`);
  const n = Math.max(a.rows.length, b.rows.length);
  for (let i = 0; i < n; i++) {
    const x = a.rows[i];
    const y = b.rows[i];
    const name = (y ?? x)!.name || `Output ${i + 1}`;
    if (!x || !y) {
      out.push(`${name} ${x ? 'removed' : 'added'}`);
      continue;
    }
    const parts: string[] = [];
    if (x.name !== y.name) parts.push(`renamed from "${x.name}"`);
    if (x.mode !== y.mode) parts.push(`${arrow(x.mode, y.mode)}`);
    if (x.distance !== y.distance || x.unit !== y.unit) parts.push(`distance ${arrow(`${num(x.distance)} ${x.unit}`, `${num(y.distance)} ${y.unit}`)}`);
    if (x.timeMs !== y.timeMs) parts.push(`time ${arrow(fixed(x.timeMs, 2), fixed(y.timeMs, 2))} ms`);
    if (x.latencyMs !== y.latencyMs) parts.push(`latency ${arrow(fixed(x.latencyMs, 2), fixed(y.latencyMs, 2))} ms`);
    if (x.offsetMs !== y.offsetMs) parts.push(`offset ${arrow(fixed(x.offsetMs, 2), fixed(y.offsetMs, 2))} ms`);
    const setA = safeSet(x, a);
    const setB = safeSet(y, b);
    if (setA !== setB) parts.push(`delay ${arrow(setA, setB)} ms`);
    if (parts.length) out.push(`${name}: ${parts.join(', ')}`);
  }
  return out;
}

function safeSet(row: DelayBlockAttrs['rows'][number], block: DelayBlockAttrs): string {
  try {
    return fixed(delayResult(row, block).setMs, 2);
  } catch {
    return '?';
  }
}

/** The changes between two blocks of the same type, in words; empty when they are equal. */
export function blockChanges(type: string, before: Record<string, unknown>, after: Record<string, unknown>): string[] {
  try {
    if (type === EQ_BLOCK) return eqChanges(before as unknown as EqBlockAttrs, after as unknown as EqBlockAttrs);
    if (type === CROSSOVER_BLOCK) return crossoverChanges(before as unknown as CrossoverBlockAttrs, after as unknown as CrossoverBlockAttrs);
    if (type === DELAY_BLOCK) return delayChanges(before as unknown as DelayBlockAttrs, after as unknown as DelayBlockAttrs);
  } catch {
    // Malformed stored attributes: fall through to the plain statement below.
  }
  return same(before, after) ? [] : ['Settings changed'];
}
