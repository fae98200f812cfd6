import { NODE_ATTR_RULES } from './attr-rules';
import { escapeHtml } from './escape-html';
import { isOwnFileUrl, linkKind } from './safe-url';
import type { PmMark, PmNode } from './types';
import { blockPlainText, processorBlockRenderers, type BlockContext } from './render-blocks';
import { headingOutline, type OutlineEntry } from './heading-outline';
import { fileIdOfUrl } from '~/lib/file-url';

/**
 * Renders a stored page document to HTML for the read view, on the server, with no editor code.
 * Only known node and mark types produce markup; every text and attribute is escaped, and every
 * attribute is checked again with the same rules the save route applies (attr-rules.ts), so a row
 * written by an older version can never put script on a page. Whatever the validator accepts is
 * rendered with the meaning the editor gives it; render-html.golden.test.ts holds the two together
 * against the editor's own HTML.
 */
export type BlockRenderer = (node: PmNode) => string;

export interface RenderOptions {
  /** Renderers for custom block nodes, keyed by node type; the processor blocks have theirs by default. */
  blocks?: Record<string, BlockRenderer>;
  /** Prefix for the ids inside processor-block plots, when one HTML page shows several renders. */
  idPrefix?: string;
  /**
   * Whether an image's file can still be served. A photo deleted after a page used it is shown
   * as a short note instead of a broken image.
   */
  isImageAvailable?: (src: string) => boolean;
  /** Measured traces and curve downloads for the processor blocks (see render-blocks.ts). */
  blockContext?: BlockContext;
  /**
   * Where the reader fetches an image of this instance from. A guest has no session, so the
   * guest view points images at its own pass-scoped file route instead of /files/….
   */
  imageUrl?: (src: string) => string;
  /**
   * A photo's stored pixel size, so the read view reserves its space before it loads. Used when
   * the node itself carries no size (photos placed before sizes were kept).
   */
  imageSize?: (src: string) => { width: number | null; height: number | null } | undefined;
  /** The document's headingOutline(), when the caller already has it (the read cache keeps it). */
  outline?: OutlineEntry[];
}

/** What the renderer carries from one node to the next: the heading ids, in reading order. */
interface RenderState {
  headingIds: string[];
}

const SIMPLE_BLOCKS: Record<string, string> = {
  paragraph: 'p',
  blockquote: 'blockquote',
  bulletList: 'ul',
  listItem: 'li',
  tableRow: 'tr',
};

function attr(name: string, value: string | number): string {
  return ` ${name}="${escapeHtml(String(value))}"`;
}

function clampInt(value: unknown, min: number, max: number, fallback: number): number {
  const n = Number(value);
  return Number.isInteger(n) && n >= min && n <= max ? n : fallback;
}

/** The stored value when the save route's rule for it accepts it, else nothing. */
function accepted(node: PmNode, name: string): unknown {
  const value = node.attrs?.[name];
  if (value === null || value === undefined) return undefined;
  const rule = NODE_ATTR_RULES[node.type]?.[name];
  return rule && rule.check(value) ? value : undefined;
}

/** Tailwind's reset takes the numbering away from every list, so each style is named in CSS. */
const LIST_STYLE_CLASS: Record<string, string> = { a: 'list-lower-alpha', A: 'list-upper-alpha', i: 'list-lower-roman', I: 'list-upper-roman' };

/** External links open apart from the book and pass nothing to the other site, as the editor sets them. */
const EXTERNAL_LINK = ' target="_blank" rel="noopener noreferrer nofollow"';

/**
 * The order the document schema ranks marks in (see the golden test, which checks it against the
 * schema): the editor always nests them this way, first outermost, whatever order was stored.
 */
export const MARK_ORDER = ['link', 'bold', 'code', 'italic', 'strike', 'underline'];

const markRank = (mark: PmMark) => {
  const i = MARK_ORDER.indexOf(mark.type);
  return i < 0 ? MARK_ORDER.length : i;
};

function renderMarks(text: string, marks: PmMark[] | undefined): string {
  let html = escapeHtml(text);
  // Innermost first: wrap from the lowest-ranked mark outwards.
  const inner = [...(marks ?? [])].sort((a, b) => markRank(b) - markRank(a));
  for (const mark of inner) {
    switch (mark.type) {
      case 'bold':
        html = `<strong>${html}</strong>`;
        break;
      case 'italic':
        html = `<em>${html}</em>`;
        break;
      case 'strike':
        html = `<s>${html}</s>`;
        break;
      case 'underline':
        html = `<u>${html}</u>`;
        break;
      case 'code':
        html = `<code>${html}</code>`;
        break;
      case 'link': {
        const href = mark.attrs?.href;
        const kind = linkKind(href);
        if (kind) {
          // Only web links open a new tab; mailto: and tel: hand over to another program anyway.
          const external = kind === 'external' && /^https?:/i.test((href as string).trim());
          const title = mark.attrs?.title;
          const titled = typeof title === 'string' && title && title.length <= 500 ? attr('title', title) : '';
          html = `<a${external ? EXTERNAL_LINK : ''}${attr('href', href as string)}${titled}>${html}</a>`;
        }
        break;
      }
      default:
        break;
    }
  }
  return html;
}

export function renderDocHtml(doc: PmNode, given: RenderOptions = {}): string {
  const options = { ...given, blocks: { ...processorBlockRenderers(given.idPrefix, given.blockContext), ...given.blocks } };
  const state: RenderState = { headingIds: (given.outline ?? headingOutline(doc, given.idPrefix ?? '')).map((h) => h.id) };
  const out: string[] = [];
  // Iterative, so a deeply nested stored document cannot overflow the stack.
  const stack: (PmNode | { close: string })[] = [doc];
  while (stack.length) {
    const item = stack.pop()!;
    if ('close' in item) {
      out.push(item.close);
      continue;
    }
    const [open, close] = tagsFor(item, options, state);
    out.push(open);
    stack.push({ close });
    if (open.endsWith('/>') || item.type === 'text' || options.blocks?.[item.type]) continue;
    const children = item.content ?? [];
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return out.join('');
}

function tagsFor(node: PmNode, options: RenderOptions, state: RenderState): [string, string] {
  const custom = options.blocks?.[node.type];
  if (custom) return [custom(node), ''];
  const simple = SIMPLE_BLOCKS[node.type];
  if (simple) return [`<${simple}>`, `</${simple}>`];
  switch (node.type) {
    case 'doc':
      return ['', ''];
    case 'text':
      return [renderMarks(node.text ?? '', node.marks), ''];
    case 'heading': {
      const level = clampInt(node.attrs?.level, 1, 4, 2);
      // Ids in the order headingOutline() found them, so the contents list's links land here.
      const id = state.headingIds.shift();
      return [`<h${level}${id ? attr('id', id) : ''}>`, `</h${level}>`];
    }
    case 'orderedList': {
      const start = (accepted(node, 'start') as number | undefined) ?? 1;
      const type = accepted(node, 'type') as string | undefined;
      const style = type ? LIST_STYLE_CLASS[type] : undefined;
      return [`<ol${start === 1 ? '' : attr('start', start)}${type && type !== '1' ? attr('type', type) : ''}${style ? attr('class', style) : ''}>`, '</ol>'];
    }
    case 'taskList':
      return ['<ul data-type="taskList">', '</ul>'];
    case 'taskItem': {
      const checked = node.attrs?.checked === true;
      // A mark to read, not a control: the read view changes nothing. Its name carries the state.
      const mark = `<span class="task-mark" role="img" aria-label="${checked ? 'done' : 'not done'}">${checked ? '☑' : '☐'}</span>`;
      return [`<li data-checked="${checked}" data-type="taskItem">${mark}<div>`, '</div></li>'];
    }
    case 'codeBlock': {
      const language = accepted(node, 'language') as string | undefined;
      return [`<pre><code${language ? attr('class', `language-${language}`) : ''}>`, '</code></pre>'];
    }
    case 'horizontalRule':
      return ['<hr/>', ''];
    case 'hardBreak':
      return ['<br/>', ''];
    case 'table':
      // The wrapper scrolls sideways on a phone; as a focusable region a keyboard can scroll it too.
      return ['<div class="table-wrap" role="region" aria-label="Table (scrolls sideways)" tabindex="0"><table><tbody>', '</tbody></table></div>'];
    case 'tableHeader':
    case 'tableCell': {
      const tag = node.type === 'tableHeader' ? 'th' : 'td';
      const colspan = clampInt(node.attrs?.colspan, 1, 50, 1);
      const rowspan = clampInt(node.attrs?.rowspan, 1, 500, 1);
      const align = accepted(node, 'align') as string | undefined;
      // Column widths are an editing aid; the read view lets tables fit the screen instead.
      return [`<${tag}${colspan > 1 ? attr('colspan', colspan) : ''}${rowspan > 1 ? attr('rowspan', rowspan) : ''}${align ? attr('style', `text-align: ${align};`) : ''}>`, `</${tag}>`];
    }
    case 'image': {
      const src = node.attrs?.src;
      if (!isOwnFileUrl(src)) return ['', ''];
      const alt = typeof node.attrs?.alt === 'string' ? node.attrs.alt : '';
      if (options.isImageAvailable && !options.isImageAvailable(src)) {
        return [`<span class="missing-photo" role="note">Photo removed${alt ? `: ${escapeHtml(alt)}` : ''}</span>`, ''];
      }
      const title = typeof node.attrs?.title === 'string' ? node.attrs.title : '';
      const stored = options.imageSize?.(src);
      const width = accepted(node, 'width') ?? stored?.width ?? undefined;
      const height = accepted(node, 'height') ?? stored?.height ?? undefined;
      const size = `${width ? attr('width', width as number) : ''}${height ? attr('height', height as number) : ''}`;
      const url = (u: string) => (options.imageUrl ? options.imageUrl(u) : u);
      const img = `<img${attr('src', url(src))}${attr('alt', alt)}${title ? attr('title', title) : ''}${size} loading="lazy" decoding="async"/>`;
      // A photo reads as a figure: its caption shown under it, and a tap opens the whole file.
      const caption = photoCaption(title, alt);
      const full = `/files/${fileIdOfUrl(src)}`;
      return [
        `<figure class="photo"><a class="photo-open"${attr('href', url(full))}>${img}</a>${caption ? `<figcaption>${escapeHtml(caption)}</figcaption>` : ''}</figure>`,
        '',
      ];
    }
    default:
      // Unknown nodes keep their text but lose their markup.
      return ['', ''];
  }
}

/** A file name left as the description (IMG_2041.jpg) is no caption worth showing. */
const FILE_NAME = /^[\w .()-]+\.(jpe?g|png|webp|gif|avif|heic|heif|tiff?)$/i;

/** The caption shown under a photo: its title when set, else its description unless that is just the file's name. */
export function photoCaption(title: string, alt: string): string {
  if (title.trim()) return title.trim();
  return FILE_NAME.test(alt.trim()) ? '' : alt.trim();
}

const BLOCK_BREAK = new Set(['paragraph', 'heading', 'listItem', 'taskItem', 'tableRow', 'codeBlock', 'blockquote']);
/** Between the cells of a row in plain text, so a patch-list row reads as one line. */
export const CELL_SEPARATOR = ' | ';
const LEAVE_CELL = { leave: 'cell' } as const;

/**
 * The document's words, for search and for the word-level diff: one block a line, a table row a
 * line with its cells apart (their paragraphs do not break the row).
 */
export function docPlainText(doc: PmNode): string {
  const parts: string[] = [];
  // Iterative, like the renderer; strings on the stack are written as they are.
  const stack: (PmNode | string | typeof LEAVE_CELL)[] = [doc];
  let inCell = 0;
  while (stack.length) {
    const item = stack.pop()!;
    if (typeof item === 'string') {
      parts.push(item);
      continue;
    }
    if ('leave' in item) {
      inCell--;
      continue;
    }
    const node = item;
    if (node.type === 'text') {
      parts.push(node.text ?? '');
      continue;
    }
    const lineBreak = inCell > 0 ? ' ' : '\n';
    if (node.type === 'hardBreak') parts.push(lineBreak);
    const block = blockPlainText(node);
    if (block) parts.push(`${lineBreak}${block}${lineBreak}`);
    if (BLOCK_BREAK.has(node.type)) parts.push(node.type === 'tableRow' ? '\n' : lineBreak);
    if (node.type === 'tableCell' || node.type === 'tableHeader') {
      inCell++;
      stack.push(LEAVE_CELL);
    }
    const children = node.content ?? [];
    for (let i = children.length - 1; i >= 0; i--) {
      stack.push(children[i]);
      if (node.type === 'tableRow' && i > 0) stack.push(CELL_SEPARATOR);
    }
  }
  return parts.join('').replace(/[ \t]+/g, ' ').replace(/ ?\n\s*/g, '\n').trim();
}
