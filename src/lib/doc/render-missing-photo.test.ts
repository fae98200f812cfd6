import { describe, expect, it } from 'vitest';
import { renderDocHtml } from './render-html';
import type { PmNode } from './types';

const doc: PmNode = {
  type: 'doc',
  content: [
    { type: 'image', attrs: { src: '/files/abc123/display', alt: 'Rack <B>' } },
    { type: 'image', attrs: { src: '/files/kept99/display', alt: 'Patch bay' } },
  ],
};

describe('renderDocHtml with isImageAvailable', () => {
  it('shows a note, escaped, instead of a broken image for a file that is gone', () => {
    const html = renderDocHtml(doc, { isImageAvailable: (src) => src.includes('kept99') });
    expect(html).toContain('<span class="missing-photo" role="note">Photo removed: Rack &lt;B&gt;</span>');
    expect(html).toContain('<img src="/files/kept99/display" alt="Patch bay" loading="lazy"/>');
    expect(html).not.toContain('abc123');
  });

  it('renders every image when no check is given', () => {
    expect(renderDocHtml(doc).match(/<img /g)).toHaveLength(2);
  });
});
