/**
 * One reading of how engineers spell things, applied to the text that goes into the full-text
 * index and to what a person types, so both sides meet on the same terms: "Wi-Fi" and "wifi",
 * "63 A", "63A" and "63 amps", "dB(A)", "dBA" and "dB A", "XR-18" and "xr18".
 *
 * The index keeps every word as written and adds the joined spellings beside it (so "fi" still
 * finds "Wi-Fi"); a query is reduced to the joined spellings only. A query term therefore matches
 * whenever the text, read the same way, holds that term.
 */

export interface Word {
  /** Offsets into the original text, for marking the match. */
  start: number;
  end: number;
  /** Lower case, compatibility-folded, without diacritics, alias applied ("ohms" → "ohm"). */
  term: string;
  /** The token FTS5 itself makes of the word (no alias, no width folding): already in the index. */
  plain: string;
}

export interface TermGroup {
  start: number;
  end: number;
  words: Word[];
  /** The one spelling a query uses for this group: its words joined, units in their short form. */
  joined: string;
  /** Every term the index holds for this group beside the words themselves (worked out on first use). */
  readonly variants: string[];
}

/**
 * Spellings that mean the same anywhere in a text. Maps, not object literals: a word of page
 * text such as "constructor" must never find something on Object's prototype.
 */
const ALIASES = new Map(Object.entries({
  ohms: 'ohm',
  ω: 'ohm',
  hertz: 'hz',
  kilohertz: 'khz',
  decibel: 'db',
  decibels: 'db',
  millisecond: 'ms',
  milliseconds: 'ms',
  msec: 'ms',
  msecs: 'ms',
  millimetre: 'mm',
  millimetres: 'mm',
  millimeter: 'mm',
  millimeters: 'mm',
  metre: 'm',
  metres: 'm',
  meter: 'm',
  meters: 'm',
  kilowatt: 'kw',
  kilowatts: 'kw',
}));

/** The aliases, for tests to check the fold against. */
export const TERM_ALIASES: ReadonlyMap<string, string> = ALIASES;

/** Spellings that are a unit only right after a number ("63 amps"; "amps" alone are amplifiers). */
const UNIT_AFTER_NUMBER = new Map(Object.entries({
  amp: 'a',
  amps: 'a',
  ampere: 'a',
  amperes: 'a',
  volt: 'v',
  volts: 'v',
  watt: 'w',
  watts: 'w',
  kg: 'kg',
  kilo: 'kg',
  kilos: 'kg',
  second: 's',
  seconds: 's',
  sec: 's',
  secs: 's',
}));

/** Units a number is written beside, with or without a space: 63 A, 48V, 100 Hz, 3 dB. */
const UNITS = new Set([
  'a', 'ma', 'ka', 'v', 'mv', 'kv', 'w', 'kw', 'mw', 'va', 'kva', 'hz', 'khz', 'mhz', 'ghz',
  'db', 'dba', 'dbc', 'dbz', 'dbu', 'dbv', 'dbfs', 'dbspl', 'ms', 's', 'us', 'µs', 'm', 'mm', 'cm', 'km',
  'mm2', 'ft', 'kg', 'lb', 'lbs', 't', 'ohm', 'kohm', 'k', 'ch', 'x', 'p', 'mp', 'gb', 'mb',
]);

/** The decibel with a weighting or reference after it, which the trade writes glued, bracketed or spaced. */
const DB_SUFFIXES = new Set(['a', 'c', 'z', 'u', 'v', 'fs', 'spl']);

const HYPHENS = new Set(['-', '\u2010', '\u2011', '\u2012']);
const WORD = /[\p{L}\p{N}]+/gu;
const DIGITS = /^\p{N}+$/u;
const STARTS_WITH_NUMBER = /^\p{N}/u;
const NUMBER_THEN_UNIT = /^(\p{N}+)(\p{L}+\p{N}?)$/u;

/** Plain ASCII: every Unicode normalisation leaves it as it is, and it holds no combining mark. */
const ASCII = /^[\x00-\x7f]*$/;

/** How a word reads for matching: the fold FTS5's unicode61 tokenizer applies, then the aliases. */
export function foldWord(raw: string): string {
  // Marking a search's hits folds every word of 20 texts; most are ASCII, and for them the
  // normalisations (most of the cost) change nothing.
  const folded = ASCII.test(raw) ? raw.toLowerCase() : raw.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase().normalize('NFKC');
  return ALIASES.get(folded) ?? folded;
}

function plainToken(raw: string): string {
  return ASCII.test(raw) ? raw.toLowerCase() : raw.normalize('NFD').replace(/\p{M}/gu, '').toLowerCase();
}

function isUnitAfterNumber(term: string): boolean {
  return UNITS.has(UNIT_AFTER_NUMBER.get(term) ?? term);
}

function unitForm(term: string): string {
  return UNIT_AFTER_NUMBER.get(term) ?? term;
}

/** "63a" → ["63", "a"]; undefined when the word is not a number glued to a unit. */
function splitNumberUnit(term: string): [string, string] | undefined {
  // Asked of nearly every word while marking hits; most start with a letter, and a one-character
  // test turns them away before the full pattern runs.
  if (!STARTS_WITH_NUMBER.test(term)) return undefined;
  const m = NUMBER_THEN_UNIT.exec(term);
  if (!m) return undefined;
  const unit = ALIASES.get(m[2]) ?? m[2];
  if (!isUnitAfterNumber(unit)) return undefined;
  return [m[1], unitForm(unit)];
}

function words(text: string): Word[] {
  const out: Word[] = [];
  for (const m of text.matchAll(WORD)) out.push({ start: m.index, end: m.index + m[0].length, term: foldWord(m[0]), plain: plainToken(m[0]) });
  return out;
}

type Join = 'hyphen' | 'decimal' | 'unit' | 'bracket' | null;

/** How word b attaches to word a, judged by what lies between them in the text. */
function joinBetween(text: string, a: Word, b: Word): Join {
  const between = text.slice(a.end, b.start);
  if (between.length === 1 && HYPHENS.has(between)) return 'hyphen';
  if (between === '.' && DIGITS.test(a.term) && DIGITS.test(b.term)) return 'decimal';
  if (between === '(' && text[b.end] === ')' && [...b.term].length <= 4) return 'bracket';
  // A unit follows a number or a decibel; every other pair of words (most of them) stops here.
  if (between.length > 2) return null;
  const endsInNumber = /\p{N}$/u.test(a.term);
  const afterDecibel = a.term === 'db' || a.term.endsWith('db');
  if ((endsInNumber || afterDecibel) && /^[ \t\u00a0\u202f]{1,2}$/u.test(between)) {
    if (endsInNumber && isUnitAfterNumber(b.term)) return 'unit';
    if (afterDecibel && DB_SUFFIXES.has(b.term)) return 'unit';
  }
  return null;
}

/** Longest run of words whose sub-runs are all indexed: a long hyphen chain keeps its pairs and whole. */
const MAX_RUN = 6;

function joinedRun(ws: Word[], joins: Join[], from: number, to: number): string {
  if (from === to) {
    const glued = splitNumberUnit(ws[from].term);
    return glued ? glued.join('') : ws[from].term;
  }
  let joined = '';
  for (let i = from; i <= to; i++) {
    if (i > from && joins[i - 1] === 'decimal') joined += '.';
    const afterNumber = i > from && /\p{N}$/u.test(ws[i - 1].term);
    joined += afterNumber ? unitForm(ws[i].term) : ws[i].term;
  }
  return joined;
}

/** A group whose variants are worked out when first asked for: marking a snippet asks only of groups its words do not decide. */
class Group implements TermGroup {
  readonly start: number;
  readonly end: number;
  readonly joined: string;
  private known: string[] | undefined;

  constructor(
    readonly words: Word[],
    private readonly joins: Join[],
  ) {
    const last = words.length - 1;
    this.start = words[0].start;
    this.end = words[last].end + (joins.at(-1) === 'bracket' ? 1 : 0);
    this.joined = joinedRun(words, joins, 0, last);
  }

  get variants(): string[] {
    return (this.known ??= variantsOf(this.words, this.joins));
  }
}

function groupOf(ws: Word[], joins: Join[]): TermGroup {
  return new Group(ws, joins);
}

function variantsOf(ws: Word[], joins: Join[]): string[] {
  const last = ws.length - 1;
  const variants = new Set<string>([joinedRun(ws, joins, 0, last)]);
  for (let from = 0; from <= last; from++) {
    for (let to = from; to <= last; to++) {
      // A run never cuts a decimal: "2.5 mm" holds "2.5mm", not "5mm".
      const cutsDecimal = (from > 0 && joins[from - 1] === 'decimal') || (to < last && joins[to] === 'decimal');
      if (!cutsDecimal && (to - from < MAX_RUN || (from === 0 && to === last))) variants.add(joinedRun(ws, joins, from, to));
    }
    const glued = splitNumberUnit(ws[from].term);
    if (glued) glued.forEach((t) => variants.add(t));
  }
  // "dBA", "dB(A)", "95dBA": each also holds the plain decibel, so "db limit" finds them.
  for (const t of [...variants]) {
    const unit = splitNumberUnit(t)?.[1] ?? t;
    if (unit.startsWith('db') && DB_SUFFIXES.has(unit.slice(2))) variants.add('db');
  }
  for (const w of ws) variants.delete(w.plain);
  return [...variants];
}

/** The text cut into groups of words the trade writes as one thing. */
export function termGroups(text: string): TermGroup[] {
  const ws = words(text);
  const groups: TermGroup[] = [];
  let i = 0;
  while (i < ws.length) {
    let j = i;
    const joins: Join[] = [];
    while (j + 1 < ws.length) {
      const join = joinBetween(text, ws[j], ws[j + 1]);
      if (!join) break;
      joins.push(join);
      j++;
    }
    groups.push(groupOf(ws.slice(i, j + 1), joins));
    i = j + 1;
  }
  return groups;
}

/**
 * The text FTS5 indexes: the original words, each group followed by its joined spellings, so a
 * query's joined term is found and every single word still is too. Control characters become
 * spaces (they are the snippet markers).
 */
export function indexText(text: string): string {
  const clean = text.replace(/\p{Cc}/gu, ' ');
  let out = '';
  let at = 0;
  for (const g of termGroups(clean)) {
    if (g.variants.length === 0) continue;
    out += `${clean.slice(at, g.end)} ${g.variants.join(' ')} `;
    at = g.end;
  }
  return out + clean.slice(at);
}

/** What a person typed, as the terms to look for: one per group, in its joined spelling. */
export function queryTerms(input: string): string[] {
  return termGroups(input.replace(/\p{Cc}/gu, ' ')).map((g) => g.joined);
}

/** Every term one word answers to on its own ("dBC" → dbc, db; "63A" → 63a, 63, a). */
export function wordTerms(w: Word): string[] {
  return groupTerms(groupOf([w], []));
}

/** Every term a group answers to: its words, its joined spelling and its variants. */
export function groupTerms(g: TermGroup): string[] {
  return [...new Set([g.joined, ...g.words.map((w) => w.term), ...g.variants])];
}
