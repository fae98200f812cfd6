import { describe, expect, it } from 'vitest';
import { headingOutline } from './heading-outline';
import { renderDocHtml } from './render-html';
import type { PmNode } from './types';

const h = (level: number, text: string): PmNode => ({ type: 'heading', attrs: { level }, content: [{ type: 'text', text }] });
const doc = (...content: PmNode[]): PmNode => ({ type: 'doc', content });

describe('headingOutline', () => {
  it('lists headings in reading order with ids the rendered headings carry', () => {
    const d = doc(h(2, 'Mains distribution'), { type: 'paragraph', content: [{ type: 'text', text: 'x' }] }, h(3, '63 A — stage left'), h(2, 'Mains distribution'));
    const outline = headingOutline(d);
    expect(outline).toEqual([
      { level: 2, text: 'Mains distribution', id: 'h-mains-distribution' },
      { level: 3, text: '63 A — stage left', id: 'h-63-a-stage-left' },
      { level: 2, text: 'Mains distribution', id: 'h-mains-distribution-2' },
    ]);
    const html = renderDocHtml(d);
    for (const { id } of outline) expect(html).toContain(`id="${id}"`);
  });

  it('keeps ids apart with a prefix, and gives a heading without letters a usable id', () => {
    expect(headingOutline(doc(h(2, '—'), h(2, 'Énergie')), 'power-').map((e) => e.id)).toEqual(['power-h-section', 'power-h-energie']);
  });

  it('reads headings nested in lists and tables, and escapes nothing into the id', () => {
    const nested = doc({ type: 'blockquote', content: [h(4, '"><script>')] });
    expect(headingOutline(nested)[0].id).toBe('h-script');
  });
});
