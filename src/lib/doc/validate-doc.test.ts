import { describe, expect, it } from 'vitest';
import { validateDoc } from './validate-doc';
import type { PmNode } from './types';

const para = (text: string, marks?: PmNode['marks']): PmNode => ({ type: 'paragraph', content: [{ type: 'text', text, ...(marks ? { marks } : {}) }] });
const doc = (...content: PmNode[]): PmNode => ({ type: 'doc', content });

function refused(input: unknown) {
  const result = validateDoc(input);
  if (result.ok) throw new Error('expected a refusal');
  return result;
}

function nested(depth: number): PmNode {
  let node: PmNode = para('deep');
  for (let i = 0; i < depth; i++) node = { type: 'blockquote', content: [node] };
  return doc(node);
}

describe('validateDoc accepts what the editor produces', () => {
  it('headings, lists, task lists, tables, links and own images', () => {
    const input = doc(
      { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Patch' }] },
      { type: 'bulletList', content: [{ type: 'listItem', content: [para('one')] }] },
      { type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: true }, content: [para('ring out wedges')] }] },
      {
        type: 'table',
        content: [
          { type: 'tableRow', content: [{ type: 'tableHeader', attrs: { colspan: 1, rowspan: 1, colwidth: null }, content: [para('Ch')] }] },
          { type: 'tableRow', content: [{ type: 'tableCell', content: [para('1')] }] },
        ],
      },
      para('site', [{ type: 'link', attrs: { href: 'https://example.org/x', target: '_blank', rel: 'noopener noreferrer nofollow', class: null } }]),
      para('rel', [{ type: 'link', attrs: { href: '/venues/x/y' } }]),
      para('mail', [{ type: 'link', attrs: { href: 'mailto:foh@example.org' } }]),
      { type: 'image', attrs: { src: '/files/abc123/display', alt: 'Rack A' } },
    );
    const result = validateDoc(input);
    expect(result.ok).toBe(true);
    if (result.ok) {
      expect(result.plainText).toContain('ring out wedges');
      expect(result.doc.content?.[0].attrs?.level).toBe(2);
    }
  });

  it('an empty document becomes one empty paragraph', () => {
    const result = validateDoc({ type: 'doc' });
    expect(result.ok && result.doc.content).toEqual([{ type: 'paragraph' }]);
  });

  it('text that looks like HTML is kept as text', () => {
    const result = validateDoc(doc(para('<script>alert(1)</script> <img src=x onerror=alert(1)>')));
    expect(result.ok && result.plainText).toBe('<script>alert(1)</script> <img src=x onerror=alert(1)>');
  });

  it('control characters never reach the search text', () => {
    const result = validateDoc(doc(para('a\u0002b\u0003c')));
    expect(result.ok && result.plainText).toBe('abc');
  });
});

describe('validateDoc refuses with a sentence', () => {
  it.each([
    ['not an object', 'hello', /"type": "doc"/],
    ['a non-doc root', { type: 'paragraph' }, /"type": "doc"/],
    ['an unknown node, named', doc({ type: 'iframe' }), /"iframe".*does not know/],
    ['an unknown mark, named', doc(para('x', [{ type: 'blink' }])), /"blink".*does not know/],
    ['heading level 99', doc({ type: 'heading', attrs: { level: 99 }, content: [{ type: 'text', text: 'x' }] }), /level 99.*1 to 4/],
    ['heading level 0', doc({ type: 'heading', attrs: { level: 0 }, content: [{ type: 'text', text: 'x' }] }), /1 to 4/],
    ['a javascript: link', doc(para('x', [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }])), /javascript:alert\(1\).*not allowed/],
    ['a tab-split javascript: link', doc(para('x', [{ type: 'link', attrs: { href: 'java\tscript:alert(1)' } }])), /not allowed/],
    ['a data: link', doc(para('x', [{ type: 'link', attrs: { href: 'data:text/html,<script>1</script>' } }])), /not allowed/],
    ['a protocol-relative link', doc(para('x', [{ type: 'link', attrs: { href: '//evil.example/x' } }])), /not allowed/],
    ['a link without href', doc(para('x', [{ type: 'link', attrs: {} }])), /Links may point only/],
    ['a foreign image', doc({ type: 'image', attrs: { src: 'https://evil.example/x.png' } }), /files uploaded to this venue/],
    ['a data: image', doc({ type: 'image', attrs: { src: 'data:image/png;base64,AAAA' } }), /files uploaded/],
    ['an image without src', doc({ type: 'image', attrs: {} }), /files uploaded/],
    ['an unknown attribute', doc({ type: 'paragraph', attrs: { onclick: 'x' } }), /no attribute "onclick"/],
    ['an unexpected key', doc({ type: 'paragraph', html: '<b>' } as unknown as PmNode), /unexpected field "html"/],
    ['nested data in an attribute', doc({ type: 'image', attrs: { src: '/files/a', alt: { x: 1 } } }), /image descriptions/],
    ['an empty text node', doc({ type: 'paragraph', content: [{ type: 'text', text: '' }] }), /non-empty/],
    ['text at the top level', doc({ type: 'text', text: 'x' }), /structure is not valid/],
    ['a table cell outside a table', doc({ type: 'tableCell', content: [para('x')] }), /structure is not valid/],
    ['content that is not a list', { type: 'doc', content: 'x' }, /must be a list/],
    ['a class on a link', doc(para('x', [{ type: 'link', attrs: { href: '/a', class: 'evil' } }])), /class/],
  ] as [string, unknown, RegExp][])('%s', (_label, input, message) => {
    const result = refused(input);
    expect(result.status).toBe(400);
    expect(result.message).toMatch(message);
  });

  it('nesting 10,000 deep is refused by the walk, without recursion', () => {
    const result = refused(nested(10_000));
    expect(result.message).toMatch(/more than 40 levels/);
  });

  it('nesting just within the cap is fine', () => {
    // doc, 37 quotes, a paragraph and its text: exactly 40 levels.
    expect(validateDoc(nested(37)).ok).toBe(true);
  });

  it('too many nodes is a 413', () => {
    const many = doc(...Array.from({ length: 10_001 }, () => para('x')));
    const result = refused(many);
    expect(result.status).toBe(413);
    expect(result.message).toMatch(/more than 20,000 parts/);
  });

  it('more than 1 MiB is a 413', () => {
    const big = doc(...Array.from({ length: 30 }, () => para('x'.repeat(40_000))));
    const result = refused(big);
    expect(result.status).toBe(413);
    expect(result.message).toMatch(/limit is 1 MiB/);
  });
});
