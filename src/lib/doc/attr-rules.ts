import { HEADING_LEVELS } from './extensions';
import { isOwnFileUrl, isSafeLinkHref } from './safe-url';
import { PROCESSOR_BLOCKS, type ProcessorBlockType } from './blocks/block-data';
import { processorBlockProblem } from '~/lib/schemas/processor-blocks';

/**
 * Allowlists for the attributes of nodes and marks. ProseMirror's schema checks structure but
 * takes any attribute value (a heading of level 99, an image from any host), so every value a
 * page may carry is vetted here. An attribute the schema does not know is refused outright.
 */
export interface AttrRule {
  check: (value: unknown) => boolean;
  /** Why a value was refused, phrased so a person can fix it; `shown` is the offending value. */
  explain: (shown: string) => string;
  /** Missing counts as refused (an image needs a source, a link a target). */
  required?: boolean;
}

const isNull = (v: unknown) => v === null || v === undefined;
const intIn = (min: number, max: number) => (v: unknown) => Number.isInteger(v) && (v as number) >= min && (v as number) <= max;
const shortText = (max: number) => (v: unknown) => isNull(v) || (typeof v === 'string' && v.length <= max);
const oneOf = (...allowed: unknown[]) => (v: unknown) => isNull(v) || allowed.includes(v);

const cellRules: Record<string, AttrRule> = {
  colspan: { check: intIn(1, 50), explain: (s) => `A table cell may span 1 to 50 columns, not ${s}.` },
  rowspan: { check: intIn(1, 500), explain: (s) => `A table cell may span 1 to 500 rows, not ${s}.` },
  colwidth: {
    check: (v) => isNull(v) || (Array.isArray(v) && v.length <= 50 && v.every((w) => w === null || intIn(1, 5000)(w))),
    explain: () => 'Column widths must be a short list of whole numbers of pixels.',
  },
  align: { check: oneOf('left', 'center', 'right'), explain: (s) => `Cells align left, center or right, not ${s}.` },
};

export const NODE_ATTR_RULES: Record<string, Record<string, AttrRule>> = {
  heading: {
    level: {
      check: (v) => (HEADING_LEVELS as readonly unknown[]).includes(v),
      explain: (s) => `Heading level ${s} is not allowed; use levels 1 to 4.`,
    },
  },
  orderedList: {
    start: { check: (v) => isNull(v) || intIn(0, 1_000_000)(v), explain: (s) => `A numbered list must start at a whole number from 0 to 1,000,000, not ${s}.` },
    type: { check: oneOf('1', 'a', 'A', 'i', 'I'), explain: (s) => `A numbered list uses 1, a, A, i or I, not ${s}.` },
  },
  codeBlock: {
    language: { check: (v) => isNull(v) || (typeof v === 'string' && /^[A-Za-z0-9+#._-]{1,30}$/.test(v)), explain: (s) => `The code language ${s} is not a plain language name.` },
  },
  taskItem: {
    checked: { check: (v) => isNull(v) || typeof v === 'boolean', explain: (s) => `A task is checked (true) or not (false), not ${s}.` },
  },
  tableCell: cellRules,
  tableHeader: cellRules,
  image: {
    src: {
      required: true,
      check: isOwnFileUrl,
      explain: (s) => `Images must be files uploaded to this venue (a /files/… address); ${s} is not allowed.`,
    },
    alt: { check: shortText(500), explain: () => 'Keep image descriptions under 500 characters.' },
    title: { check: shortText(500), explain: () => 'Keep image titles under 500 characters.' },
    width: { check: (v) => isNull(v) || intIn(1, 10_000)(v), explain: (s) => `Image width must be a whole number of pixels, not ${s}.` },
    height: { check: (v) => isNull(v) || intIn(1, 10_000)(v), explain: (s) => `Image height must be a whole number of pixels, not ${s}.` },
  },
};

export const MARK_ATTR_RULES: Record<string, Record<string, AttrRule>> = {
  link: {
    href: {
      required: true,
      check: isSafeLinkHref,
      explain: (s) => `Links may point only to http, https, mailto or a path on this site; ${s} is not allowed.`,
    },
    target: { check: oneOf('_blank'), explain: (s) => `A link's target may only be _blank, not ${s}.` },
    rel: { check: shortText(100), explain: () => "A link's rel must be short text." },
    class: { check: isNull, explain: () => 'Links may not carry a class.' },
    title: { check: shortText(500), explain: () => 'Keep link titles under 500 characters.' },
  },
};

/**
 * The rule for an attribute the schema declares but no rule above covers (a block added later
 * without its own rules): plain scalar values only, never nested data.
 */
export const SCALAR_ATTR_RULE: AttrRule = {
  check: (v) => isNull(v) || typeof v === 'boolean' || (typeof v === 'number' && Number.isFinite(v)) || (typeof v === 'string' && v.length <= 2000),
  explain: () => 'Attributes must be plain text, numbers or true/false.',
};

/** A value as it appears in an error sentence: quoted, short, on one line. */
export function showValue(value: unknown): string {
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  let text: string;
  try {
    text = typeof value === 'string' ? value : JSON.stringify(value) ?? String(value);
  } catch {
    text = String(value);
  }
  text = text.replace(/[\u0000-\u001f\u007f]/g, ' ');
  return `"${text.length > 60 ? `${text.slice(0, 57)}…` : text}"`;
}

/**
 * Blocks whose attributes are nested data (bands, ways, outputs) are checked as a whole by their
 * zod schema, after the schema's defaults fill what the input left out; the sentence names the
 * band or way and the field.
 */
export const NODE_WHOLE_RULES: Record<string, (attrs: Record<string, unknown>) => string | null> = Object.fromEntries(
  PROCESSOR_BLOCKS.map((type: ProcessorBlockType) => [type, (attrs: Record<string, unknown>) => processorBlockProblem(type, attrs)]),
);
