import { escapeHtml } from './escape-html';
import { isOwnFileUrl, linkKind } from './safe-url';
import type { PmMark, PmNode } from './types';
import { blockPlainText, processorBlockRenderers, type BlockContext } from './render-blocks';

/**
 * Renders a stored page document to HTML for the read view, on the server, with no editor code.
 * Only known node and mark types produce markup; every text and attribute is escaped, and links
 * and images are checked again here even though the save route already vetted them, so a row
 * written by an older version can never put script on a page.
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

function renderMarks(text: string, marks: PmMark[] | undefined): string {
  let html = escapeHtml(text);
  for (const mark of marks ?? []) {
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
          const external = kind === 'external';
          html = `<a${attr('href', href as string)}${external ? ' rel="noopener noreferrer nofollow" target="_blank"' : ''}>${html}</a>`;
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
  const out: string[] = [];
  // Iterative, so a deeply nested stored document cannot overflow the stack.
  const stack: (PmNode | { close: string })[] = [doc];
  while (stack.length) {
    const item = stack.pop()!;
    if ('close' in item) {
      out.push(item.close);
      continue;
    }
    const [open, close] = tagsFor(item, options);
    out.push(open);
    stack.push({ close });
    if (open.endsWith('/>') || item.type === 'text' || options.blocks?.[item.type]) continue;
    const children = item.content ?? [];
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return out.join('');
}

function tagsFor(node: PmNode, options: RenderOptions): [string, string] {
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
      return [`<h${level}>`, `</h${level}>`];
    }
    case 'orderedList': {
      const start = clampInt(node.attrs?.start, 1, 100000, 1);
      return [start === 1 ? '<ol>' : `<ol${attr('start', start)}>`, '</ol>'];
    }
    case 'taskList':
      return ['<ul data-type="taskList">', '</ul>'];
    case 'taskItem': {
      const checked = node.attrs?.checked === true;
      return [`<li data-checked="${checked}"><span aria-hidden="true">${checked ? '☑' : '☐'}</span> `, '</li>'];
    }
    case 'codeBlock':
      return ['<pre><code>', '</code></pre>'];
    case 'horizontalRule':
      return ['<hr/>', ''];
    case 'hardBreak':
      return ['<br/>', ''];
    case 'table':
      return ['<div class="table-wrap"><table><tbody>', '</tbody></table></div>'];
    case 'tableHeader':
    case 'tableCell': {
      const tag = node.type === 'tableHeader' ? 'th' : 'td';
      const colspan = clampInt(node.attrs?.colspan, 1, 50, 1);
      const rowspan = clampInt(node.attrs?.rowspan, 1, 500, 1);
      return [`<${tag}${colspan > 1 ? attr('colspan', colspan) : ''}${rowspan > 1 ? attr('rowspan', rowspan) : ''}>`, `</${tag}>`];
    }
    case 'image': {
      const src = node.attrs?.src;
      if (!isOwnFileUrl(src)) return ['', ''];
      const alt = typeof node.attrs?.alt === 'string' ? node.attrs.alt : '';
      if (options.isImageAvailable && !options.isImageAvailable(src)) {
        return [`<span class="missing-photo" role="note">Photo removed${alt ? `: ${escapeHtml(alt)}` : ''}</span>`, ''];
      }
      const title = typeof node.attrs?.title === 'string' ? node.attrs.title : '';
      return [`<img${attr('src', options.imageUrl ? options.imageUrl(src) : src)}${attr('alt', alt)}${title ? attr('title', title) : ''} loading="lazy"/>`, ''];
    }
    default:
      // Unknown nodes keep their text but lose their markup.
      return ['', ''];
  }
}

/** The document's words, for search and for the word-level diff. */
export function docPlainText(doc: PmNode): string {
  const parts: string[] = [];
  const stack: PmNode[] = [doc];
  const BLOCK_BREAK = new Set(['paragraph', 'heading', 'listItem', 'taskItem', 'tableRow', 'codeBlock', 'blockquote']);
  while (stack.length) {
    const node = stack.pop()!;
    if (node.type === 'text') {
      parts.push(node.text ?? '');
      continue;
    }
    if (node.type === 'hardBreak') parts.push('\n');
    const block = blockPlainText(node);
    if (block) parts.push(`\n${block}\n`);
    if (node.type === 'tableCell' || node.type === 'tableHeader') parts.push(' ');
    if (BLOCK_BREAK.has(node.type)) parts.push('\n');
    const children = node.content ?? [];
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return parts.join('').replace(/[ \t]+/g, ' ').replace(/\n\s*\n+/g, '\n').trim();
}
