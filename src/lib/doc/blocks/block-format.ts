/** How block values read in tables, diffs and search text: the trade's units, a real minus sign. */
import { BAND_TYPE_LABELS, hasGain, isShelf, type EqBand, type XoverEdge } from './block-data';

/** A number with at most `digits` decimals, trailing zeros dropped, and "−" for negatives. */
export function num(value: number, digits = 2): string {
  if (!Number.isFinite(value)) return '—';
  const text = String(Number(value.toFixed(digits)));
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}

/** Fixed decimals, for values compared side by side (−3.0 → −4.5 dB). */
export function fixed(value: number, digits = 1): string {
  if (!Number.isFinite(value)) return '—';
  const text = value.toFixed(digits);
  return text.startsWith('-') && Number(text) !== 0 ? `−${text.slice(1)}` : text.replace(/^-/, '');
}

export function signedDb(value: number, digits = 1): string {
  return `${value > 0 ? '+' : ''}${fixed(value, digits)} dB`;
}

export function hz(value: number): string {
  return value >= 1000 ? `${num(value / 1000, 3)} kHz` : `${num(value, 1)} Hz`;
}

export function rateLabel(sampleRate: number): string {
  return `${num(sampleRate / 1000, 1)} kHz`;
}

export function familyLabel(edge: XoverEdge): string {
  const fam = edge.family === 'linkwitz-riley' ? 'LR' : 'BW';
  return `${fam}${edge.slope} at ${hz(edge.freq)}`;
}

export function bandSummary(band: EqBand): string {
  const parts = [BAND_TYPE_LABELS[band.type], hz(band.freq)];
  if (hasGain(band.type)) parts.push(signedDb(band.gain));
  parts.push(isShelf(band.type) ? `S ${num(band.q)}` : `Q ${num(band.q)}`);
  if (!band.on) parts.push('(off)');
  return parts.join(' ');
}
