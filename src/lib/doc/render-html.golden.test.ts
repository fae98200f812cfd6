import { generateHTML } from '@tiptap/html/server';
import { describe, expect, it } from 'vitest';
import { HEADING_LEVELS, docExtensions } from './extensions';
import { getDocSchema } from './doc-schema';
import { MARK_ORDER, docPlainText, renderDocHtml } from './render-html';
import type { PmMark, PmNode } from './types';
import { validateDoc } from './validate-doc';

/**
 * Golden tests: every node, mark and attribute the validator accepts, with the exact HTML the read
 * view gives it, and the same document put through the editor's own serializer (the shared
 * extension list, via @tiptap/html) to show that both say the same thing. Where the read view
 * differs on purpose (no editing controls, tables that fit a phone), `meaning()` below names the
 * difference; anything else that differs fails here.
 */

const t = (text: string, marks?: PmMark[]): PmNode => ({ type: 'text', text, ...(marks ? { marks } : {}) });
const p = (...content: PmNode[]): PmNode => ({ type: 'paragraph', content });
const doc = (...content: PmNode[]): PmNode => ({ type: 'doc', content });
const li = (text: string): PmNode => ({ type: 'listItem', content: [p(t(text))] });
const ol = (attrs: Record<string, unknown>): PmNode => ({ type: 'orderedList', attrs, content: [li('one'), li('two')] });
const cell = (type: 'tableCell' | 'tableHeader', text: string, attrs: Record<string, unknown> = {}): PmNode => ({ type, attrs, content: [p(t(text))] });
const table = (...rows: PmNode[][]): PmNode => ({ type: 'table', content: rows.map((content) => ({ type: 'tableRow', content })) });
const link = (href: string, extra: Record<string, unknown> = {}): PmMark => ({ type: 'link', attrs: { href, ...extra } });
const PHOTO = '/files/abcdefghijklmnop/display';
const EDITOR_LINK = { target: '_blank', rel: 'noopener noreferrer nofollow', class: null };

interface Golden {
  name: string;
  doc: PmNode;
  html: string;
}

const GOLDEN: Golden[] = [
  { name: 'paragraph', doc: doc(p(t('Stage box A'))), html: '<p>Stage box A</p>' },
  ...HEADING_LEVELS.map((level) => ({ name: `heading ${level}`, doc: doc({ type: 'heading', attrs: { level }, content: [t('Power')] }), html: `<h${level} id="h-power">Power</h${level}>` })),
  { name: 'bold', doc: doc(p(t('x', [{ type: 'bold' }]))), html: '<p><strong>x</strong></p>' },
  { name: 'italic', doc: doc(p(t('x', [{ type: 'italic' }]))), html: '<p><em>x</em></p>' },
  { name: 'strike', doc: doc(p(t('x', [{ type: 'strike' }]))), html: '<p><s>x</s></p>' },
  { name: 'underline', doc: doc(p(t('x', [{ type: 'underline' }]))), html: '<p><u>x</u></p>' },
  { name: 'inline code', doc: doc(p(t('-6 dB', [{ type: 'code' }]))), html: '<p><code>-6 dB</code></p>' },
  { name: 'marks nest in the schema’s order', doc: doc(p(t('x', [{ type: 'bold' }, { type: 'italic' }]))), html: '<p><strong><em>x</em></strong></p>' },
  {
    name: 'marks stored out of order nest as the editor nests them',
    doc: doc(p(t('x', [{ type: 'underline' }, { type: 'strike' }, link('https://example.org/', EDITOR_LINK), { type: 'bold' }]))),
    html: '<p><a target="_blank" rel="noopener noreferrer nofollow" href="https://example.org/"><strong><s><u>x</u></s></strong></a></p>',
  },
  {
    name: 'external link as the editor stores it',
    doc: doc(p(t('spec', [link('https://example.org/spec', EDITOR_LINK)]))),
    html: '<p><a target="_blank" rel="noopener noreferrer nofollow" href="https://example.org/spec">spec</a></p>',
  },
  {
    // The rel and target come from the kind of address, not from what is stored: a bare link
    // (an older row, a script) still opens apart and passes nothing to the other site.
    name: 'external link without rel or target',
    doc: doc(p(t('spec', [link('http://example.org/')]))),
    html: '<p><a target="_blank" rel="noopener noreferrer nofollow" href="http://example.org/">spec</a></p>',
  },
  {
    name: 'link with a title',
    doc: doc(p(t('spec', [link('https://example.org/', { ...EDITOR_LINK, title: 'Rider "B"' })]))),
    html: '<p><a target="_blank" rel="noopener noreferrer nofollow" href="https://example.org/" title="Rider &quot;B&quot;">spec</a></p>',
  },
  { name: 'link within the site', doc: doc(p(t('patch', [link('/venues/hall/patch', { target: null, rel: null })]))), html: '<p><a href="/venues/hall/patch">patch</a></p>' },
  { name: 'mail link', doc: doc(p(t('desk', [link('mailto:desk@example.org', { target: null, rel: null })]))), html: '<p><a href="mailto:desk@example.org">desk</a></p>' },
  { name: 'bullet list', doc: doc({ type: 'bulletList', content: [li('a'), li('b')] }), html: '<ul><li><p>a</p></li><li><p>b</p></li></ul>' },
  { name: 'ordered list from 1', doc: doc(ol({ start: 1, type: null })), html: '<ol><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list from 0', doc: doc(ol({ start: 0, type: null })), html: '<ol start="0"><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list from 7', doc: doc(ol({ start: 7 })), html: '<ol start="7"><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list from 1,000,000', doc: doc(ol({ start: 1_000_000 })), html: '<ol start="1000000"><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list type 1 (the default)', doc: doc(ol({ start: 1, type: '1' })), html: '<ol><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list type a', doc: doc(ol({ start: 1, type: 'a' })), html: '<ol type="a" class="list-lower-alpha"><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list type A', doc: doc(ol({ start: 1, type: 'A' })), html: '<ol type="A" class="list-upper-alpha"><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list type i', doc: doc(ol({ start: 1, type: 'i' })), html: '<ol type="i" class="list-lower-roman"><li><p>one</p></li><li><p>two</p></li></ol>' },
  { name: 'ordered list type I from 0', doc: doc(ol({ start: 0, type: 'I' })), html: '<ol start="0" type="I" class="list-upper-roman"><li><p>one</p></li><li><p>two</p></li></ol>' },
  {
    name: 'task list',
    doc: doc({ type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: true }, content: [p(t('Ring out'))] }, { type: 'taskItem', attrs: { checked: false }, content: [p(t('Label'))] }] }),
    html:
      '<ul data-type="taskList">' +
      '<li data-checked="true" data-type="taskItem"><span class="task-mark" role="img" aria-label="done">☑</span><div><p>Ring out</p></div></li>' +
      '<li data-checked="false" data-type="taskItem"><span class="task-mark" role="img" aria-label="not done">☐</span><div><p>Label</p></div></li>' +
      '</ul>',
  },
  { name: 'blockquote', doc: doc({ type: 'blockquote', content: [p(t('Mind the gap'))] }), html: '<blockquote><p>Mind the gap</p></blockquote>' },
  { name: 'code block', doc: doc({ type: 'codeBlock', content: [t('a < b && c')] }), html: '<pre><code>a &lt; b &amp;&amp; c</code></pre>' },
  { name: 'code block with a language', doc: doc({ type: 'codeBlock', attrs: { language: 'c++' }, content: [t('x')] }), html: '<pre><code class="language-c++">x</code></pre>' },
  { name: 'horizontal rule', doc: doc(p(t('a')), { type: 'horizontalRule' }, p(t('b'))), html: '<p>a</p><hr/><p>b</p>' },
  { name: 'hard break', doc: doc(p(t('line one'), { type: 'hardBreak' }, t('line two'))), html: '<p>line one<br/>line two</p>' },
  { name: 'image', doc: doc({ type: 'image', attrs: { src: PHOTO, alt: 'Amp rack', title: null } }), html: `<figure class="photo"><a class="photo-open" href="/files/abcdefghijklmnop"><img src="${PHOTO}" alt="Amp rack" loading="lazy" decoding="async"/></a><figcaption>Amp rack</figcaption></figure>` },
  {
    name: 'image with title and size',
    doc: doc({ type: 'image', attrs: { src: PHOTO, alt: 'Rack', title: 'Rack "B"', width: 640, height: 480 } }),
    html: `<figure class="photo"><a class="photo-open" href="/files/abcdefghijklmnop"><img src="${PHOTO}" alt="Rack" title="Rack &quot;B&quot;" width="640" height="480" loading="lazy" decoding="async"/></a><figcaption>Rack &quot;B&quot;</figcaption></figure>`,
  },
  {
    name: 'table with header, spans and alignment',
    doc: doc(
      table(
        [cell('tableHeader', 'Ch'), cell('tableHeader', 'Source', { align: 'center' })],
        [cell('tableCell', '1', { align: 'right' }), cell('tableCell', 'Kick in', { colspan: 1, rowspan: 2, colwidth: [120] })],
        [cell('tableCell', '2', { colspan: 2, align: 'left' })],
      ),
    ),
    html:
      '<div class="table-wrap" role="region" aria-label="Table (scrolls sideways)" tabindex="0"><table><tbody>' +
      '<tr><th><p>Ch</p></th><th style="text-align: center;"><p>Source</p></th></tr>' +
      '<tr><td style="text-align: right;"><p>1</p></td><td rowspan="2"><p>Kick in</p></td></tr>' +
      '<tr><td colspan="2" style="text-align: left;"><p>2</p></td></tr>' +
      '</tbody></table></div>',
  },
  { name: 'text is escaped', doc: doc(p(t('<b>"x" & \'y\'</b>'))), html: '<p>&lt;b&gt;&quot;x&quot; &amp; &#39;y&#39;&lt;/b&gt;</p>' },
];

const ENTITY: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'", nbsp: '\u00a0' };
const decode = (s: string) => s.replace(/&(amp|lt|gt|quot|#39|nbsp);/g, (_, e: string) => ENTITY[e]);

/** The tags and attributes that carry meaning for a reader; everything else is presentation. */
const MEANINGFUL: Record<string, string[]> = {
  p: [], h1: [], h2: [], h3: [], h4: [], blockquote: [], pre: [], code: ['class'], strong: [], em: [], s: [], u: [], br: [], hr: [],
  ul: ['data-type'], ol: ['start', 'type'], li: ['data-checked'], a: ['href', 'target', 'rel', 'title'], img: ['src', 'alt', 'title', 'width', 'height'],
  table: [], tbody: [], tr: [], th: ['colspan', 'rowspan', 'style'], td: ['colspan', 'rowspan', 'style'],
};

/**
 * A page's HTML reduced to what a reader gets from it: the meaningful tags with their meaningful
 * attributes (sorted, so order does not count) and the text. The read view's own differences are
 * taken out by name: its checkmark stands where the editor has a checkbox control, column
 * widths (the editor's colgroup) are not kept, so tables fit a phone, and a photo is a figure
 * whose link opens the whole file and whose caption repeats its title or description.
 */
function meaning(html: string): string[] {
  const out: string[] = [];
  const withoutMark = html
    .replace(/<span class="task-mark"[^>]*>[^<]*<\/span>/g, '')
    .replace(/<figure class="photo"><a class="photo-open"[^>]*>(<img[^>]*>)<\/a>(<figcaption>[^<]*<\/figcaption>)?<\/figure>/g, '$1');
  for (const m of withoutMark.matchAll(/<(\/?)([a-z0-9]+)([^>]*?)\/?>|([^<]+)/g)) {
    const [, closing, tag, rest, text] = m;
    if (text !== undefined) {
      if (text.trim()) out.push(`"${decode(text)}"`);
      continue;
    }
    const keep = MEANINGFUL[tag];
    if (!keep) continue;
    if (closing) {
      out.push(`/${tag}`);
      continue;
    }
    const attrs = [...rest.matchAll(/([a-z-]+)(?:="([^"]*)")?/g)]
      .filter(([, name]) => keep.includes(name))
      .map(([, name, value]) => `${name}=${decode(value ?? name)}`)
      .sort();
    out.push(`${tag}${attrs.length ? `[${attrs.join(' ')}]` : ''}`);
  }
  return out;
}

describe('the renderer’s mark order', () => {
  it('is the document schema’s', () => {
    expect(MARK_ORDER).toEqual(Object.keys(getDocSchema().marks));
  });
});

describe('the read view renders every accepted node, mark and attribute', () => {
  it.each(GOLDEN)('$name', ({ doc: d, html }) => {
    // Only what the save route accepts is pinned here.
    expect(validateDoc(d).ok).toBe(true);
    expect(renderDocHtml(d)).toBe(html);
  });
});

describe('the read view and the editor agree on what every accepted document says', () => {
  it.each(GOLDEN)('$name', ({ doc: d }) => {
    expect(meaning(renderDocHtml(d))).toEqual(meaning(generateHTML(d, docExtensions)));
  });
});

describe('plain text for search and the diff', () => {
  it('keeps table cells apart, one row a line', () => {
    const d = doc(table([cell('tableHeader', 'Ch'), cell('tableHeader', 'Source')], [cell('tableCell', '1'), cell('tableCell', 'Kick')]));
    expect(docPlainText(d)).toBe('Ch | Source\n1 | Kick');
  });

  it('keeps a cell’s own paragraphs and breaks on its row’s line, and an empty cell in its place', () => {
    const twoLines: PmNode = { type: 'tableCell', content: [p(t('DI'), { type: 'hardBreak' }, t('left')), p(t('pad'))] };
    const empty: PmNode = { type: 'tableCell', content: [p()] };
    expect(docPlainText(doc(table([cell('tableCell', '7'), twoLines, empty, cell('tableCell', 'x')])))).toBe('7 | DI left pad | | x');
  });

  it('puts each block and hard break on its own line and drops the markup', () => {
    const d = doc(
      { type: 'heading', attrs: { level: 2 }, content: [t('Power')] },
      p(t('Mains '), t('32 A', [{ type: 'bold' }]), { type: 'hardBreak' }, t('CEE')),
      { type: 'bulletList', content: [li('a'), li('b')] },
      { type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: true }, content: [p(t('done'))] }] },
      { type: 'codeBlock', content: [t('x=1')] },
      { type: 'blockquote', content: [p(t('q'))] },
    );
    expect(docPlainText(d)).toBe('Power\nMains 32 A\nCEE\na\nb\ndone\nx=1\nq');
  });
});
