import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { renderDocHtml } from './render-html';
import type { PmMark, PmNode } from './types';
import { validateDoc } from './validate-doc';

/**
 * Property: whatever document the server accepts, its rendered HTML carries no script element,
 * no event-handler attribute and no javascript: URL. The generator follows the schema closely
 * enough that many documents are accepted, and salts text and attributes with hostile strings.
 */
const SEED = 20_260_607;

const hostile = fc.constantFrom(
  '<script>alert(1)</script>',
  '"><script>alert(1)</script>',
  "' onmouseover='alert(1)",
  '" onerror="alert(1)',
  '<img src=x onerror=alert(1)>',
  'javascript:alert(1)',
  ' JaVaScRiPt:alert(1)',
  'java\tscript:alert(1)',
  'data:text/html,<script>alert(1)</script>',
  '&lt;script&gt;',
  '</td></tr></table><script>x</script>',
  '<a href="javascript:alert(1)">x</a>',
  '\u0000<script>',
);
const anyText = fc.oneof(hostile, fc.string({ minLength: 1, maxLength: 12 }), fc.constantFrom('Stage box', 'LR24 at 90 Hz'));
const href = fc.oneof(hostile, fc.constantFrom('https://example.org/a?b=1', '/venues/x/y', 'mailto:a@b.c', '#top', 'ftp://x', '//evil.example', 'vbscript:x'));
const src = fc.oneof(hostile, fc.constantFrom('/files/abc/display', '/files/x_y-z', 'https://evil.example/a.png', 'data:image/png;base64,AA', '/files/../etc/passwd'));
const smallInt = fc.oneof(fc.integer({ min: -2, max: 8 }), fc.constant(99));

const mark: fc.Arbitrary<PmMark> = fc.oneof(
  fc.constantFrom<PmMark>({ type: 'bold' }, { type: 'italic' }, { type: 'code' }, { type: 'strike' }, { type: 'underline' }),
  href.map((h) => ({ type: 'link', attrs: { href: h } })),
  fc.record({ type: fc.constant('link'), attrs: fc.record({ href, title: anyText }) }),
  fc.constant({ type: 'onclick' }),
);
const text: fc.Arbitrary<PmNode> = fc.record(
  { type: fc.constant('text'), text: anyText, marks: fc.uniqueArray(mark, { maxLength: 2, selector: (m) => m.type }) },
  { requiredKeys: ['type', 'text'] },
);
const inline = fc.array(fc.oneof({ weight: 6, arbitrary: text }, { weight: 1, arbitrary: fc.constant<PmNode>({ type: 'hardBreak' }) }), { maxLength: 4 });
const paragraph = inline.map<PmNode>((content) => (content.length ? { type: 'paragraph', content } : { type: 'paragraph' }));

const { block } = fc.letrec<{ block: PmNode }>((tie) => {
  const blocks = fc.array(tie('block'), { minLength: 1, maxLength: 3 });
  const item = (type: string) =>
    fc.tuple(paragraph, fc.array(tie('block'), { maxLength: 1 }), fc.boolean()).map(([first, rest, checked]) => ({
      type,
      ...(type === 'taskItem' ? { attrs: { checked } } : {}),
      content: [first, ...rest],
    }));
  const cell = fc.tuple(fc.constantFrom('tableCell', 'tableHeader'), paragraph, smallInt).map(([type, p, span]) => ({ type, attrs: { colspan: span }, content: [p] }));
  return {
    block: fc.oneof(
      { depthSize: 'small', withCrossShrink: true },
      { weight: 5, arbitrary: paragraph },
      { weight: 2, arbitrary: fc.tuple(smallInt, inline).map(([level, content]) => ({ type: 'heading', attrs: { level }, ...(content.length ? { content } : {}) })) },
      { weight: 1, arbitrary: fc.array(item('listItem'), { minLength: 1, maxLength: 3 }).map((content) => ({ type: 'bulletList', content })) },
      { weight: 1, arbitrary: fc.tuple(smallInt, fc.array(item('listItem'), { minLength: 1, maxLength: 2 })).map(([start, content]) => ({ type: 'orderedList', attrs: { start }, content })) },
      { weight: 1, arbitrary: fc.array(item('taskItem'), { minLength: 1, maxLength: 2 }).map((content) => ({ type: 'taskList', content })) },
      { weight: 1, arbitrary: fc.array(fc.array(cell, { minLength: 1, maxLength: 3 }).map((content) => ({ type: 'tableRow', content })), { minLength: 1, maxLength: 3 }).map((content) => ({ type: 'table', content })) },
      { weight: 1, arbitrary: fc.record({ type: fc.constant('image'), attrs: fc.record({ src, alt: anyText, title: anyText }) }) },
      { weight: 1, arbitrary: blocks.map((content) => ({ type: 'blockquote', content })) },
      { weight: 1, arbitrary: fc.tuple(anyText, fc.option(anyText)).map(([t, language]) => ({ type: 'codeBlock', attrs: { language }, content: [{ type: 'text', text: t }] })) },
      { weight: 1, arbitrary: fc.constant({ type: 'horizontalRule' }) },
      { weight: 1, arbitrary: fc.record({ type: fc.constantFrom('script', 'iframe'), attrs: fc.record({ onload: anyText }) }) },
    ),
  };
});
const document = fc.array(block, { minLength: 1, maxLength: 5 }).map<PmNode>((content) => ({ type: 'doc', content }));

/**
 * Problems in rendered HTML. Text is escaped, so every literal "<" opens a real tag, and
 * attribute values are escaped, so a double quote always ends one.
 */
const URL_ATTRS = /^(href|src|srcset|action|formaction|poster|background|cite|data|xlink:href)$/i;

function dangers(html: string): string[] {
  const found: string[] = [];
  if (/<\s*script/i.test(html)) found.push('script element');
  for (const tag of html.match(/<[^>]*>/g) ?? []) {
    const name = /^<\/?\s*([a-z0-9]+)/i.exec(tag)?.[1] ?? '';
    if (/^(script|iframe|object|embed|style|svg|math|base|form|meta|link)$/i.test(name)) found.push(`unexpected element ${tag}`);
    const rest = tag.slice(1 + tag.indexOf(name) + name.length).replace(/\/?>$/, '');
    const attrs = [...rest.matchAll(/\s*([^\s="]+)(?:="([^"]*)")?/g)];
    const unparsed = rest.replace(/\s*([^\s="]+)(?:="([^"]*)")?/g, '').trim();
    if (unparsed) found.push(`unparsable attributes in ${tag}`);
    for (const [, attrName, rawValue = ''] of attrs) {
      if (/^on/i.test(attrName)) found.push(`event handler in ${tag}`);
      const value = rawValue.replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');
      if (!URL_ATTRS.test(attrName)) continue;
      // Browsers drop whitespace and control characters inside a scheme, so compare without them.
      const squeezed = value.replace(/[\u0000-\u0020]/g, '');
      if (/^javascript:/i.test(squeezed)) found.push(`javascript: in ${tag}`);
      if (/^(data|vbscript):/i.test(squeezed)) found.push(`${attrName} scheme in ${tag}`);
    }
  }
  return found;
}

describe('rendering accepted documents', () => {
  it('never yields a script, an on…= attribute or a javascript: URL', () => {
    let accepted = 0;
    let total = 0;
    fc.assert(
      fc.property(document, (doc) => {
        total++;
        const result = validateDoc(doc);
        if (!result.ok) return;
        accepted++;
        expect(dangers(renderDocHtml(result.doc))).toEqual([]);
      }),
      { seed: SEED, numRuns: 600 },
    );
    // Guards against a vacuous pass where the generator only ever builds refused documents.
    expect(accepted).toBeGreaterThan(total / 10);
  });

  it('the renderer alone stays safe even for documents that were never validated', () => {
    fc.assert(
      fc.property(document, (doc) => {
        expect(dangers(renderDocHtml(doc))).toEqual([]);
      }),
      { seed: SEED, numRuns: 400 },
    );
  });

  it('the danger check itself notices a handler, a script and a javascript: link', () => {
    expect(dangers('<p><img src="x" onerror="y"/></p>')).toHaveLength(1);
    expect(dangers('<script>x</script>')).not.toHaveLength(0);
    expect(dangers('<a href="javascript:x">y</a>')).toHaveLength(1);
    expect(dangers('<p>&lt;script&gt; onerror=x javascript:</p>')).toEqual([]);
    expect(dangers('<a href="&quot; onerror=&quot;x">y</a>')).toEqual([]);
  });
});
