/**
 * Reads a measured response exported as plain-text columns: frequency (Hz), magnitude (dB),
 * optionally phase (degrees) and coherence (0–1). No vendor's format is assumed: the layout is
 * inferred from the first line that holds numbers, and every later data line must match it.
 *
 * Accepted: separators tab, semicolon, comma or runs of spaces; a decimal point, or a decimal
 * comma when the separator is not a comma; lines starting with `#`, `*` or `;` and any line that
 * does not start like a number (headers, titles) are skipped. A line that starts like a number but
 * does not read as the inferred layout is refused with its line number, so a damaged file is never
 * half-read.
 */
import { formatNumber } from '~/lib/acoustics/guards';

export const TRACE_LIMITS = {
  maxPoints: 100_000,
  /** The audible band with generous margins; analysers export from ~1 Hz to ~48 kHz. */
  frequencyHz: { min: 0.1, max: 200_000 },
  magnitudeDb: { min: -400, max: 400 },
  phaseDeg: { min: -100_000, max: 100_000 },
  /** Longest line worth reading: four numbers with room for padding. */
  maxLineChars: 400,
} as const;

export interface Trace {
  freqHz: number[];
  magnitudeDb: number[];
  phaseDeg?: number[];
  coherence?: number[];
}

/** A refusal that names the line (1-based) where the file stops making sense. */
export class TraceParseError extends Error {
  constructor(
    message: string,
    readonly line?: number,
    /** True when not one line of the file reads as numbers: it is not a trace at all. */
    readonly noData = false,
  ) {
    super(line === undefined ? message : `Line ${line}: ${message}`);
    this.name = 'TraceParseError';
  }
}

type Separator = '\t' | ';' | ',' | ' ';
interface Layout {
  separator: Separator;
  decimalComma: boolean;
  columns: 2 | 3 | 4;
  /** Column index of coherence when a header names it in the third column. */
  coherenceColumn: number | null;
}

const SEPARATOR_NAMES: Record<Separator, string> = { '\t': 'tabs', ';': 'semicolons', ',': 'commas', ' ': 'spaces' };
const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const STARTS_LIKE_NUMBER = /^[+-]?\.?\d/;

function splitFields(line: string, separator: Separator): string[] {
  if (separator === ' ') return line.trim().split(/\s+/);
  return line.split(separator).map((f) => f.trim());
}

function readNumber(field: string, decimalComma: boolean): number | null {
  const text = decimalComma ? field.replace(',', '.') : field;
  if (decimalComma && field.includes('.')) return null;
  return NUMBER.test(text) ? Number(text) : null;
}

/** The first layout, in order of how unambiguous it is, under which `line` reads as 2–4 numbers. */
function inferLayout(line: string, header: string | null): Layout | null {
  const candidates: [Separator, boolean][] = [
    ['\t', false], ['\t', true], [';', false], [';', true], [',', false], [' ', false], [' ', true],
  ];
  for (const [separator, decimalComma] of candidates) {
    if (separator !== ' ' && !line.includes(separator)) continue;
    const fields = splitFields(line, separator);
    if (fields.length < 2 || fields.length > 4) continue;
    if (fields.every((f) => readNumber(f, decimalComma) !== null)) {
      const columns = fields.length as 2 | 3 | 4;
      const coherenceColumn = columns === 3 && header && /coh/i.test(splitFields(header, separator)[2] ?? '') ? 2 : null;
      return { separator, decimalComma, columns, coherenceColumn };
    }
  }
  return null;
}

function describe(layout: Layout): string {
  const decimal = layout.decimalComma ? 'decimal commas' : 'decimal points';
  return `${layout.columns} numbers separated by ${SEPARATOR_NAMES[layout.separator]} with ${decimal}`;
}

function checkRange(value: number, range: { min: number; max: number }, what: string, unit: string, line: number): void {
  if (!(value >= range.min && value <= range.max)) {
    throw new TraceParseError(`the ${what} ${formatNumber(value)}${unit} is outside ${range.min}${unit} to ${range.max}${unit}.`, line);
  }
}

/**
 * Parses the text of a trace file. Throws TraceParseError (message ready for a person) on
 * anything it cannot read exactly; never returns a partial trace.
 */
export function parseTrace(text: string): Trace {
  if (text.includes('\u0000') || text.includes('\uFFFD')) {
    throw new TraceParseError('This file holds binary data, not text. Export the measurement as plain-text columns (frequency, magnitude…).');
  }
  const freqHz: number[] = [];
  const magnitudeDb: number[] = [];
  const phaseDeg: number[] = [];
  const coherence: number[] = [];
  let layout: Layout | null = null;
  let lastHeader: string | null = null;

  // Walk the text by index instead of split('\n'): a 25 MiB file of one line must not be copied
  // into a giant array, and a file of a million lines must stop as soon as the cap is passed.
  let start = 0;
  let lineNo = 0;
  while (start <= text.length) {
    let end = text.indexOf('\n', start);
    if (end === -1) end = text.length;
    lineNo += 1;
    const rawLength = end - start;
    const line = rawLength > TRACE_LIMITS.maxLineChars ? null : text.slice(start, end).replace(/\r$/, '');
    start = end + 1;

    if (line === null) {
      const head = text.slice(end - rawLength, end - rawLength + 40).trimStart();
      // Headers and comments may be long (some tools write a title line); only data is capped.
      if (!STARTS_LIKE_NUMBER.test(head)) continue;
      throw new TraceParseError(`the line is ${rawLength.toLocaleString('en')} characters long; a trace line holds at most four numbers.`, lineNo);
    }
    const trimmed = line.trim();
    if (trimmed === '' || /^[#*;]/.test(trimmed)) continue;
    if (!STARTS_LIKE_NUMBER.test(trimmed)) {
      if (layout === null) lastHeader = trimmed;
      continue;
    }
    if (layout === null) {
      layout = inferLayout(trimmed, lastHeader);
      if (layout === null) {
        throw new TraceParseError(`expected 2 to 4 numbers (frequency in Hz, magnitude in dB, then optionally phase and coherence) separated by tabs, semicolons, commas or spaces; found "${trimmed.slice(0, 60)}".`, lineNo);
      }
    }
    const fields = splitFields(trimmed, layout.separator);
    if (fields.length !== layout.columns) {
      throw new TraceParseError(`found ${fields.length} values where the file's first data line has ${describe(layout)}.`, lineNo);
    }
    const values = fields.map((f) => readNumber(f, layout!.decimalComma));
    const bad = values.findIndex((v) => v === null || !Number.isFinite(v));
    if (bad !== -1) {
      throw new TraceParseError(`"${fields[bad].slice(0, 40)}" is not a number as the file's first data line writes them (${describe(layout)}).`, lineNo);
    }
    const [f, m, third, fourth] = values as number[];
    checkRange(f, TRACE_LIMITS.frequencyHz, 'frequency', ' Hz', lineNo);
    if (freqHz.length > 0 && !(f > freqHz[freqHz.length - 1])) {
      throw new TraceParseError(`the frequency ${formatNumber(f)} Hz does not rise above the line before (${formatNumber(freqHz[freqHz.length - 1])} Hz); frequencies must rise from line to line.`, lineNo);
    }
    checkRange(m, TRACE_LIMITS.magnitudeDb, 'magnitude', ' dB', lineNo);
    if (freqHz.length === TRACE_LIMITS.maxPoints) {
      throw new TraceParseError(`the trace has more than ${TRACE_LIMITS.maxPoints.toLocaleString('en')} points; export it with fewer (1/48-octave resolution is plenty).`, lineNo);
    }
    freqHz.push(f);
    magnitudeDb.push(m);
    if (layout.columns >= 3) {
      if (layout.coherenceColumn === 2) {
        checkRange(third, { min: 0, max: 1 }, 'coherence', '', lineNo);
        coherence.push(third);
      } else {
        checkRange(third, TRACE_LIMITS.phaseDeg, 'phase', '°', lineNo);
        phaseDeg.push(third);
      }
    }
    if (layout.columns === 4) {
      checkRange(fourth, { min: 0, max: 1 }, 'coherence', '', lineNo);
      coherence.push(fourth);
    }
  }
  if (freqHz.length < 2) {
    throw new TraceParseError('The file holds fewer than two lines of numbers; a trace needs at least two points (frequency and magnitude on each line).', undefined, freqHz.length === 0);
  }
  return {
    freqHz,
    magnitudeDb,
    ...(phaseDeg.length ? { phaseDeg } : {}),
    ...(coherence.length ? { coherence } : {}),
  };
}
